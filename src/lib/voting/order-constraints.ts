/**
 * The precedence constraints a rulebook's `voting.constraints` impose on the questions of an
 * amendment tree (ORDER_CONSTRAINTS in src/lib/procedure/voting-section.ts):
 *  - secondary-before-primary: a second-degree amendment before the amendment it amends
 *    (Robert's Rules of Order Revised, 1915 [PD], DOMAIN §3: vote the secondary, then the primary as amended);
 *  - perfecting-before-substitute: every amendment perfecting text a substitute would replace
 *    (and its own amendments) before that substitute;
 *  - furthest-first: of two mutually exclusive amendments with a `distance`, the larger first
 *    (European Parliament practice); equal or missing distances leave them unordered;
 *  - textual-order: first-degree amendments to different sections in the measure's section order,
 *    and non-overlapping amendments to one section by first line;
 *  - passage-last: every amendment before final passage.
 * Returns [before, after] question pairs (question k = passage).
 */
import type { OrderConstraint } from "../procedure/voting-section.ts";
import type { AmendmentTreeModel } from "./amendment-versions.ts";

export function questionConstraints(model: AmendmentTreeModel, constraints: readonly OrderConstraint[]): Array<[number, number]> {
  const k = model.amendments.length;
  const out: Array<[number, number]> = [];
  const on = new Set(constraints);
  const sectionIndex = new Map(model.measure.sections.map((s, i) => [s.id, i]));
  for (let a = 0; a < k; a++) {
    const A = model.amendments[a];
    if (on.has("secondary-before-primary") && model.parent[a] >= 0) out.push([a, model.parent[a]]);
    if (on.has("passage-last")) out.push([a, k]);
    for (let b = 0; b < k; b++) {
      if (a === b) continue;
      const B = model.amendments[b];
      if (on.has("perfecting-before-substitute") && model.supersedes[b] & (1 << a)) out.push([a, b]);
      if (on.has("furthest-first") && model.exclusive[a] & (1 << b) && A.distance !== undefined && B.distance !== undefined && A.distance > B.distance) out.push([a, b]);
      if (on.has("textual-order") && model.parent[a] < 0 && model.parent[b] < 0 && !(model.exclusive[a] & (1 << b))) {
        const sa = sectionIndex.get(A.target);
        const sb = sectionIndex.get(B.target);
        if (sa === undefined || sb === undefined) continue;
        if (sa < sb || (sa === sb && A.lines && B.lines && A.lines[0] < B.lines[0])) out.push([a, b]);
      }
    }
  }
  return out;
}
