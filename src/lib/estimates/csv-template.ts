/**
 * Downloadable CSV templates: the header, a comment-free example per roster bloc (or member), so a
 * clerk can fill in a spreadsheet and upload it back. Cells are quoted when needed and neutralised
 * against formula injection (writeCsv).
 */
import { writeCsv } from "../text/csv-cells.ts";

export interface RosterEntry {
  name: string;
  bloc: string;
}

/** The roster's blocs in order of first appearance, with their sizes. */
export function rosterBlocs(roster: readonly RosterEntry[]): Array<{ bloc: string; size: number }> {
  const blocs = new Map<string, number>();
  for (const r of roster) blocs.set(r.bloc, (blocs.get(r.bloc) ?? 0) + 1);
  return [...blocs].map(([bloc, size]) => ({ bloc, size }));
}

/** Ballot template: one row per bloc (weight = its size), each ranking the versions in listed order. */
export function ballotTemplate(versionIds: readonly string[], roster: readonly RosterEntry[], perMember = false): string {
  const example = versionIds.join(" > ");
  const rows: string[][] = [];
  if (perMember) for (const r of roster) rows.push([r.name, r.bloc, "1", example]);
  else {
    const blocs = new Map<string, number>();
    for (const r of roster) blocs.set(r.bloc, (blocs.get(r.bloc) ?? 0) + 1);
    for (const [bloc, n] of blocs) rows.push([bloc, bloc, String(n), example]);
    if (rows.length === 0) rows.push(["Member name", "Bloc", "1", example]);
  }
  return writeCsv(["member", "bloc", "weight", "ranking"], rows);
}

/**
 * Ideal-point template: one row per member at the origin, or one row per bloc (weight = its size)
 * spread along the first dimension (0, 1, 2 …) so that each bloc is a separate point to move.
 */
export function idealTemplate(dimensions: readonly string[], roster: readonly RosterEntry[], perMember = true): string {
  let rows: string[][];
  if (perMember) rows = roster.map((r) => [r.name, r.bloc, "1", ...dimensions.map(() => "0")]);
  else {
    const blocs = new Map<string, number>();
    for (const r of roster) blocs.set(r.bloc, (blocs.get(r.bloc) ?? 0) + 1);
    rows = [...blocs].map(([bloc, n], i) => [bloc, bloc, String(n), ...dimensions.map((_, d) => (d === 0 ? String(i) : "0"))]);
  }
  if (rows.length === 0) rows = [["Member name", "Bloc", "1", ...dimensions.map(() => "0")]];
  return writeCsv(["member", "bloc", "weight", ...dimensions], rows);
}
