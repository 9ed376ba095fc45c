/**
 * How a clerk names a filed amendment in a confirmation or a receipt: "Amendment A3 to section 2
 * of HCA 12", "Amendment A4 to Amendment A1 to HCA 12", "Amendment A5 to HCA 12". Pure.
 */
export interface AmendmentTargetWords {
  /** The amendment's key ("A3"). */
  key: string;
  /** The measure's number ("HCA 12"). */
  measure: string;
  targetKind: "measure" | "section" | "amendment";
  /** The section's id ("s2") when it amends a section. */
  section?: string | null;
  /** The amended amendment's key ("A1") when it amends an amendment. */
  targetKey?: string | null;
  lines?: readonly [number, number] | null;
}

/** "section 2" for the id "s2"; ids of other shapes are kept as written. */
export function sectionInWords(id: string): string {
  return `section ${id.replace(/^s(?=\d)/i, "")}`;
}

function linesInWords(lines: readonly [number, number]): string {
  return lines[0] === lines[1] ? `line ${lines[0]}` : `lines ${lines[0]}–${lines[1]}`;
}

export function filedAmendmentInWords(a: AmendmentTargetWords): string {
  const own = `Amendment ${a.key}`;
  if (a.targetKind === "section" && a.section) return `${own} to ${sectionInWords(a.section)}${a.lines ? `, ${linesInWords(a.lines)},` : ""} of ${a.measure}`;
  if (a.targetKind === "amendment") return `${own} to Amendment ${a.targetKey ?? "(removed)"} to ${a.measure}`;
  return `${own} to ${a.measure}`;
}

/**
 * What a person reads for a draft amendment, which has no number yet: "Draft" when the measure has
 * one, "Draft 1", "Draft 2"… in the order they were saved when it has several. `amendments` in the
 * order they were saved; the map holds the drafts' keys only.
 */
export function draftLabels(amendments: ReadonlyArray<{ key: string; draft: boolean }>): Map<string, string> {
  const drafts = amendments.filter((a) => a.draft);
  return new Map(drafts.map((a, i) => [a.key, drafts.length === 1 ? "Draft" : `Draft ${i + 1}`]));
}
