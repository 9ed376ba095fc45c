/**
 * How a clerk names an amendment in a confirmation, a receipt, the amendments list or the desk:
 * "Amendment A3 to section 2 of HCA 12", "Amendment A4 to Amendment A1 to HCA 12", "Amendment A5
 * to HCA 12"; a draft, which has no number yet, "A draft amendment to section 2 of HCA 12". Pure.
 */
export interface AmendmentToName {
  /** The amendment's number (3 for "A3"), null while a draft. */
  number: number | null;
  targetKind: "measure" | "section" | "amendment";
  /** The section's id ("s2") when it amends a section. */
  targetSection: string | null;
  lineFrom: number | null;
  lineTo: number | null;
}

/** A filed amendment's key, as clerks write it: "A3". */
export function filedKey(number: number): string {
  return `A${number}`;
}

/** "section 2" for the id "s2"; ids of other shapes are kept as written. */
export function sectionInWords(id: string): string {
  return `section ${id.replace(/^s(?=\d)/i, "")}`;
}

function linesInWords(lines: readonly [number, number]): string {
  return lines[0] === lines[1] ? `line ${lines[0]}` : `lines ${lines[0]}–${lines[1]}`;
}

/**
 * The one name of an amendment in words. `measure` is the measure's number ("HCA 12"); `target` the
 * amended amendment when it amends one (null or undefined when it is gone).
 */
export function amendmentInWords(a: AmendmentToName, measure: string, target?: { number: number | null } | null): string {
  const own = a.number === null ? "A draft amendment" : `Amendment ${filedKey(a.number)}`;
  const lines = a.lineFrom === null ? null : ([a.lineFrom, a.lineTo ?? a.lineFrom] as const);
  if (a.targetKind === "section" && a.targetSection) return `${own} to ${sectionInWords(a.targetSection)}${lines ? `, ${linesInWords(lines)},` : ""} of ${measure}`;
  if (a.targetKind === "amendment") return `${own} to ${!target ? "Amendment (removed)" : target.number === null ? "a draft amendment" : `Amendment ${filedKey(target.number)}`} to ${measure}`;
  return `${own} to ${measure}`;
}

/**
 * Each amendment of a measure as a person reads it, which is also its key in the measure's tree:
 * "A3" once filed; a draft, which has no number yet, "Draft" when the measure has one, "Draft-1",
 * "Draft-2"… in the order they were saved when it has several. `amendments` in the order they were
 * saved. A label is unique within the measure, never looks like a filed key ("A1"), and is written
 * without a space so that it is a valid id of a tree case (case-schema.ts) and of a link to it:
 * the tree is validated and drawn under these keys, so every finding names a draft as people read it.
 */
export function amendmentLabels(amendments: ReadonlyArray<{ id: string; number: number | null }>): Map<string, string> {
  const several = amendments.filter((a) => a.number === null).length > 1;
  let drafts = 0;
  return new Map(amendments.map((a) => [a.id, a.number !== null ? filedKey(a.number) : several ? `Draft-${++drafts}` : "Draft"]));
}
