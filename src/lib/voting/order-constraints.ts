/**
 * The ordering rules a rulebook's `voting.constraints` impose on the questions of an amendment tree
 * (ORDER_CONSTRAINTS in src/lib/procedure/voting-section.ts). Question k is final passage.
 *
 * Precedence pairs ([before, after]):
 *  - secondary-before-primary: an amendment before the amendment it amends (Robert's Rules of Order
 *    Revised 1915, §33; a substitute for a first-degree amendment before that amendment, which is then
 *    put as amended: House Rule XVI cl. 6);
 *  - perfecting-before-substitute: every amendment perfecting text a substitute would replace (and its
 *    own amendments) before that substitute *and before the substitute's own amendments*: "[the chair
 *    first asks for amendments to the paragraph] to be struck out, these amendments being of the second
 *    degree. After it is perfected by its friends,
 *    the chair asks if there are any amendments proposed to the paragraph to be inserted. When both
 *    paragraphs have been perfected by amendments the question is put on substituting one paragraph for
 *    the other" (Robert's Rules of Order Revised 1915, §33 p. 142); the House substitute "shall not be
 *    voted on until the original matter is perfected" (House Rule XIX as quoted ibid. p. 135 fn. 1; now
 *    Rule XVI cl. 6);
 *  - furthest-first: of two mutually exclusive amendments with a `distance`, the larger first
 *    (European Parliament practice); equal or missing distances leave them unordered;
 *  - textual-order: first-degree amendments to different sections in the measure's section order,
 *    and non-overlapping amendments to one section by first line — a rulebook's choice for consideration
 *    by paragraph or section (Robert's Rules of Order Revised 1915, §24; the House's reading by section),
 *    not general parliamentary law;
 *  - passage-last: every amendment before final passage.
 *
 * Windows (see precedence.ts), which are not precedence pairs:
 *  - primary-contiguous: one primary amendment pending at a time, so each amendment and everything that
 *    amends it form one contiguous block of the order (a first-degree amendment with its second-degree
 *    amendments and with a substitute for it and that substitute's amendments; within it, the substitute
 *    with its own amendments). Robert's Parliamentary Practice (1922) ch. IV: "While a primary
 *    amendment is pending no other primary amendment of the same motion is in order. After a primary
 *    amendment has been voted on another primary amendment is in order"; Robert's Rules of Order Revised
 *    1915, §33 p. 145: "it is an amendment of the first degree, and no other amendment of that degree is
 *    in order until this is acted upon"; House Rules Manual: "not in order to offer more than one motion
 *    to amend of the same nature at a time (V, 5755; VIII, 2831)".
 *  - perfecting-after-rejected-substitute (with perfecting-before-substitute): a perfecting amendment may
 *    instead come after the substitute, where it is put only if the substitute was rejected (an adopted
 *    substitute replaced its text, so it falls): "If the motion to substitute is lost … It may be willing
 *    that … the paragraph retained in the resolution be further amended, or even struck out" (Robert's
 *    Rules of Order Revised 1915, §33 p. 142). It is then never voted between the substitute's first
 *    amendment and the substitute itself (the pair rule above becomes this window).
 */
import type { OrderConstraint } from "../procedure/voting-section.ts";
import type { AmendmentTreeModel } from "./amendment-versions.ts";
import { precedence, type OrderWindow, type Precedence } from "./precedence.ts";

export interface QuestionOrderRules {
  /** [before, after] question pairs. */
  pairs: Array<[number, number]>;
  /** Contiguous blocks of questions (primary-contiguous), as bitmasks, outermost first. */
  blocks: number[];
  /** "Not between": none of `excludes` between the first and last question of `span` (perfecting-after-rejected-substitute). */
  notBetween: OrderWindow[];
}

export function questionOrderRules(model: AmendmentTreeModel, constraints: readonly OrderConstraint[]): QuestionOrderRules {
  const k = model.amendments.length;
  const out: Array<[number, number]> = [];
  const on = new Set(constraints);
  const afterRejected = on.has("perfecting-after-rejected-substitute");
  const notBetween: OrderWindow[] = [];
  const sectionIndex = new Map(model.measure.sections.map((s, i) => [s.id, i]));
  for (let a = 0; a < k; a++) {
    const A = model.amendments[a];
    if (on.has("secondary-before-primary") && model.parent[a] >= 0) out.push([a, model.parent[a]]);
    if (on.has("passage-last")) out.push([a, k]);
    for (let b = 0; b < k; b++) {
      if (a === b) continue;
      const B = model.amendments[b];
      if (on.has("perfecting-before-substitute") && model.supersedes[b] & (1 << a) && !afterRejected) {
        out.push([a, b]);
        for (let m = model.descendants[b]; m !== 0; m &= m - 1) out.push([a, 31 - Math.clz32(m & -m)]);
      }
      if (on.has("furthest-first") && model.exclusive[a] & (1 << b) && A.distance !== undefined && B.distance !== undefined && A.distance > B.distance) out.push([a, b]);
      if (on.has("textual-order") && model.parent[a] < 0 && model.parent[b] < 0 && !(model.exclusive[a] & (1 << b))) {
        const sa = sectionIndex.get(A.target);
        const sb = sectionIndex.get(B.target);
        if (sa === undefined || sb === undefined) continue;
        if (sa < sb || (sa === sb && A.lines && B.lines && A.lines[0] < B.lines[0])) out.push([a, b]);
      }
    }
    if (on.has("perfecting-before-substitute") && afterRejected && model.isSubstitute[a] && model.supersedes[a] && model.descendants[a])
      notBetween.push({ span: (1 << a) | model.descendants[a], excludes: model.supersedes[a] });
  }
  const blocks: number[] = [];
  if (on.has("primary-contiguous")) for (let a = 0; a < k; a++) if (model.descendants[a]) blocks.push((1 << a) | model.descendants[a]);
  return { pairs: out, blocks, notBetween };
}

/** The precedence pairs only (the part of the rules that is a partial order). */
export function questionConstraints(model: AmendmentTreeModel, constraints: readonly OrderConstraint[]): Array<[number, number]> {
  return questionOrderRules(model, constraints).pairs;
}

/** The availability rule of the questions' orders: pairs, contiguous blocks and "not between" windows. */
export function questionPrecedence(model: AmendmentTreeModel, constraints: readonly OrderConstraint[], path = "rulebook.voting.constraints"): Precedence {
  const rules = questionOrderRules(model, constraints);
  const n = model.amendments.length + 1;
  const all = (2 ** n - 1) | 0;
  return precedence(n, rules.pairs, path, [...rules.blocks.map((b) => ({ span: b, excludes: all & ~b })), ...rules.notBetween]);
}
