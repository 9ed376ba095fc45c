/**
 * Weighted ranked ballots from CSV, one row per member or bloc:
 *   member,bloc,weight,ranking
 *   Moorland Union,Moorland Union,14,measure+A1 > measure+A7 > Q = measure
 * `ranking` lists version ids best first, separated by ">"; "=" joins versions ranked equal.
 * Versions not listed are unranked (the estimate's partial-ballot convention decides, DOMAIN §1).
 * An optional `chair` column marks the presiding officer's row ("yes"/"true"/"1"; empty or "no" otherwise).
 * Every problem is reported with its spreadsheet row and column; nothing is half-accepted.
 */
import type { InputIssue } from "../errors.ts";
import { cellIssue, checkColumns, failRows, readCsv } from "./csv-text.ts";
import { MAX_ROWS, type BallotRow } from "./estimate-content.ts";

export const BALLOT_COLUMNS = { required: ["member", "ranking"], optional: ["bloc", "weight", "chair"] } as const;

/** "a > b = c > d" → ["a", ["b", "c"], "d"]; null with a message when malformed. */
export function parseRankingText(text: string): { ranking: Array<string | string[]> } | { error: string } {
  if (!text.trim()) return { error: "empty ranking" };
  const ranking: Array<string | string[]> = [];
  for (const level of text.split(">")) {
    const names = level.split("=").map((s) => s.trim());
    if (names.some((n) => n === "")) return { error: `empty place in "${text.trim()}" (use ">" between places and "=" for equal ones)` };
    ranking.push(names.length === 1 ? names[0] : names);
  }
  return { ranking };
}

export function parseWeight(text: string): number | null {
  if (text === "") return 1;
  if (!/^\d+$/.test(text)) return null;
  const w = Number(text);
  return w >= 1 && w <= 1000 ? w : null;
}

export function parseBallotCsv(text: string, versionIds: readonly string[]): BallotRow[] {
  const { header, rows } = readCsv(text);
  checkColumns(header, BALLOT_COLUMNS.required, BALLOT_COLUMNS.optional);
  if (rows.length === 0) failRows([{ path: "rows", message: "the file has a header but no rows" }]);
  if (rows.length > MAX_ROWS) failRows([{ path: "rows", message: `at most ${MAX_ROWS} rows; the file has ${rows.length}` }]);
  const known = new Set(versionIds);
  const issues: InputIssue[] = [];
  const out: BallotRow[] = [];
  for (const { row, cells } of rows) {
    const member = cells.member ?? "";
    if (!member) issues.push(cellIssue(row, "member", "name the member or bloc"));
    else if (member.length > 200) issues.push(cellIssue(row, "member", "at most 200 characters"));
    const weight = parseWeight(cells.weight ?? "");
    if (weight === null) issues.push(cellIssue(row, "weight", `"${cells.weight}" is not a whole number from 1 to 1000`));
    const r = parseRankingText(cells.ranking ?? "");
    if ("error" in r) {
      issues.push(cellIssue(row, "ranking", r.error));
      continue;
    }
    const seen = new Set<string>();
    let ok = true;
    for (const name of r.ranking.flat()) {
      if (!known.has(name)) {
        issues.push(cellIssue(row, "ranking", `unknown version ${name}`));
        ok = false;
      } else if (seen.has(name)) {
        issues.push(cellIssue(row, "ranking", `version ${name} is ranked twice`));
        ok = false;
      }
      seen.add(name);
    }
    const chairText = (cells.chair ?? "").trim().toLowerCase();
    const chair = ["yes", "true", "1", "y"].includes(chairText);
    if (chairText && !chair && !["no", "false", "0", "n"].includes(chairText)) issues.push(cellIssue(row, "chair", `"${cells.chair}" is not yes or no`));
    if (ok && member && weight !== null) out.push({ member, bloc: cells.bloc ?? "", weight, ranking: r.ranking, ...(chair ? { chair: true } : {}) });
  }
  if (issues.length) failRows(issues);
  return out;
}

/** One ranking back to its CSV text. */
export function rankingText(ranking: ReadonlyArray<string | readonly string[]>): string {
  return ranking.map((e) => (typeof e === "string" ? e : e.join(" = "))).join(" > ");
}
