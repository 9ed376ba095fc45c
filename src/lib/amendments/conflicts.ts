/**
 * Which first-degree (or same-parent) amendments are mutually exclusive: adopting one
 * makes the other fall, because both change the same text.
 *
 * Rule followed (common practice, no single source; cf. the continental rule that among
 * mutually exclusive amendments the first adopted makes the rest fall): two amendments with
 * the same target conflict when
 *  - either replaces the whole target (substitute, in-nature-of-substitute, or any form with
 *    no line range on a measure/section target), or
 *  - their line ranges overlap.
 * Amendments to different targets never conflict here: amendments to different parts of a
 * measure combine.
 */
import type { Amendment } from "./case-schema.ts";

const WHOLE_TEXT_FORMS = new Set(["substitute", "in-nature-of-substitute"]);

function replacesWhole(a: Pick<Amendment, "form" | "lines">): boolean {
  return WHOLE_TEXT_FORMS.has(a.form) || a.lines === undefined;
}

/** True when `a` and `b` change the same text, so at most one of them can be adopted. */
export function amendmentsConflict(a: Pick<Amendment, "id" | "target" | "form" | "lines">, b: Pick<Amendment, "id" | "target" | "form" | "lines">): boolean {
  if (a.id === b.id || a.target !== b.target) return false;
  if (replacesWhole(a) || replacesWhole(b)) return true;
  const [a1, a2] = a.lines!;
  const [b1, b2] = b.lines!;
  return a1 <= b2 && b1 <= a2;
}

/** Every conflicting pair, each once, in input order. */
export function conflictingPairs<T extends Pick<Amendment, "id" | "target" | "form" | "lines">>(amendments: readonly T[]): Array<[T, T]> {
  const out: Array<[T, T]> = [];
  for (let i = 0; i < amendments.length; i++)
    for (let j = i + 1; j < amendments.length; j++) if (amendmentsConflict(amendments[i], amendments[j])) out.push([amendments[i], amendments[j]]);
  return out;
}
