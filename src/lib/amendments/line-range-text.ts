/** Read a line reference typed by a person ("7", "3-7", "3 – 7") as an amendment's line range. */
export function lineRangeFromText(text: string): [number, number] | null | "invalid" {
  const t = text.trim();
  if (!t) return null;
  const m = /^(\d+)\s*(?:[-–]\s*(\d+))?$/.exec(t);
  if (!m) return "invalid";
  return [Number(m[1]), Number(m[2] ?? m[1])];
}
