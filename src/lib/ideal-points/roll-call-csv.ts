/**
 * A session's recorded votes from CSV, in either of the two usual layouts:
 *   one row per member per vote:  member,vote,position[,bloc]
 *   a member × vote matrix:       member[,bloc],<vote 1>,<vote 2>,…   (one column per roll call)
 * The layout is recognised from the header (a "vote" and a "position" column → one row per vote).
 * Positions: yea / aye / yes / y / for / 1 count as yea; nay / no / n / against / 0 as nay; a blank
 * cell, present, abstain, not voting, absent, excused, paired and recused are recorded but not
 * counted by the model. Anything else is refused with its row and column. Member names and roll-call
 * names are kept as written (trimmed), up to 200 characters. Row numbers count the header as row 1.
 */
import Papa from "papaparse";
import { GavelError, type InputIssue } from "../errors.ts";
import { cellIssue, decodeCsv, failRows } from "../estimates/csv-text.ts";
import { restoreCell } from "../text/csv-cells.ts";

export const MAX_ROLL_CALL_ROWS = 200_000;
export const MAX_ROLL_CALL_BYTES = 8 * 1024 * 1024;

/** Uploaded bytes → text: UTF-8 only (as for estimates, src/lib/estimates/csv-text.ts), up to 8 MB. */
export function decodeRollCallCsv(bytes: Uint8Array): string {
  return decodeCsv(bytes, MAX_ROLL_CALL_BYTES);
}

const YEA = new Set(["yea", "aye", "yes", "y", "for", "1", "+"]);
const NAY = new Set(["nay", "no", "n", "against", "0", "-"]);
const NOT_COUNTED = new Set(["", "present", "abstain", "abstained", "abstention", "not voting", "nv", "absent", "excused", "paired", "recused", "?"]);

export interface RollCallImport {
  layout: "long" | "matrix";
  members: string[];
  /** Bloc (party, group) of each member, when the file names one. */
  blocs: Record<string, string>;
  votes: Array<{ id: string; yea: string[]; nay: string[]; notCounted: number }>;
}

function position(raw: string): "yea" | "nay" | null | undefined {
  const v = raw.trim().toLowerCase();
  if (YEA.has(v)) return "yea";
  if (NAY.has(v)) return "nay";
  if (NOT_COUNTED.has(v)) return null;
  return undefined;
}

const BAD_POSITION = "is not a recorded position (use yea or nay; present, abstain, not voting, absent, recused or blank are not counted)";

export function parseRollCallCsv(text: string): RollCallImport {
  // A cell the app neutralised against formula injection when it wrote a CSV is read back without the apostrophe.
  const data = Papa.parse<string[]>(text.replace(/\r\n?/g, "\n"), { skipEmptyLines: "greedy" }).data.map((r) => r.map((c) => restoreCell(c.trim())));
  if (data.length === 0) throw new GavelError("invalid-input", "the file is empty", { issues: [{ path: "file", message: "no header row" }] });
  const header = data[0].map((h) => h.trim());
  const lower = header.map((h) => h.toLowerCase());
  const rows = data.slice(1);
  if (rows.length === 0) failRows([{ path: "rows", message: "the file has a header but no rows" }]);
  if (rows.length > MAX_ROLL_CALL_ROWS) failRows([{ path: "rows", message: `at most ${MAX_ROLL_CALL_ROWS} rows; the file has ${rows.length}` }]);
  const col = (name: string) => lower.indexOf(name);
  const memberCol = col("member");
  if (memberCol < 0) failRows([{ path: "header", message: 'missing column "member"' }]);
  const blocCol = col("bloc") >= 0 ? col("bloc") : col("party");
  const issues: InputIssue[] = [];
  const members: string[] = [];
  const seenMember = new Set<string>();
  const blocs: Record<string, string> = {};
  const addMember = (m: string, bloc: string, row: number) => {
    if (!seenMember.has(m)) {
      seenMember.add(m);
      members.push(m);
    }
    if (bloc) {
      if (blocs[m] && blocs[m] !== bloc) issues.push(cellIssue(row, header[blocCol], `${m} is in bloc "${blocs[m]}" on an earlier row`));
      else blocs[m] = bloc;
    }
  };
  const checkName = (v: string, row: number, column: string, what: string) => {
    if (!v) issues.push(cellIssue(row, column, `name the ${what}`));
    else if (v.length > 200) issues.push(cellIssue(row, column, `the ${what}'s name is over 200 characters`));
    else return true;
    return false;
  };
  const votes = new Map<string, { id: string; yea: string[]; nay: string[]; notCounted: number; seen: Map<string, number> }>();
  const vote = (id: string) => {
    let v = votes.get(id);
    if (!v) votes.set(id, (v = { id, yea: [], nay: [], notCounted: 0, seen: new Map() }));
    return v;
  };
  const record = (voteId: string, member: string, pos: "yea" | "nay" | null, row: number, column: string) => {
    const v = vote(voteId);
    const earlier = v.seen.get(member);
    if (earlier !== undefined) {
      issues.push(cellIssue(row, column, `${member} already has a position on ${voteId} (row ${earlier})`));
      return;
    }
    v.seen.set(member, row);
    if (pos === null) v.notCounted++;
    else v[pos].push(member);
  };

  const long = col("vote") >= 0 && col("position") >= 0;
  if (long) {
    const known = new Set(["member", "vote", "position", "bloc", "party"]);
    lower.forEach((h, i) => {
      if (!known.has(h)) issues.push({ path: `header.${i}`, message: `unknown column "${header[i] || "(blank)"}"; expected member, vote, position and optionally bloc` });
    });
    if (issues.length) failRows(issues);
    const vCol = col("vote"), pCol = col("position");
    rows.forEach((cells, k) => {
      const row = k + 2;
      const member = (cells[memberCol] ?? "").trim();
      const voteId = (cells[vCol] ?? "").trim();
      const raw = cells[pCol] ?? "";
      const okM = checkName(member, row, "member", "member");
      const okV = checkName(voteId, row, "vote", "vote");
      const pos = position(raw);
      if (pos === undefined) issues.push(cellIssue(row, "position", `"${raw.trim()}" ${BAD_POSITION}`));
      if (okM) addMember(member, blocCol >= 0 ? (cells[blocCol] ?? "").trim() : "", row);
      if (okM && okV && pos !== undefined) record(voteId, member, pos, row, "position");
    });
  } else {
    const voteCols = header.map((h, i) => ({ h, i })).filter(({ i }) => i !== memberCol && i !== blocCol);
    if (voteCols.length === 0) failRows([{ path: "header", message: 'no vote columns: give one column per roll call after "member" (or use the columns member, vote, position)' }]);
    voteCols.forEach(({ h, i }) => {
      if (!h) issues.push({ path: `header.${i}`, message: `column ${i + 1} has no roll-call name in the header` });
      else if (h.length > 200) issues.push({ path: `header.${i}`, message: `column ${i + 1}: the roll call's name is over 200 characters` });
    });
    const dup = voteCols.find(({ h }, k) => h && voteCols.findIndex((c) => c.h === h) !== k);
    if (dup) issues.push({ path: `header.${dup.i}`, message: `roll call "${dup.h}" has two columns` });
    if (issues.length) failRows(issues);
    for (const { h } of voteCols) vote(h);
    rows.forEach((cells, k) => {
      const row = k + 2;
      if (cells.length > header.length && cells.slice(header.length).some((c) => c.trim() !== "")) {
        issues.push({ path: `rows.${row}`, message: `row ${row}: more cells than the header has columns` });
        return;
      }
      const member = (cells[memberCol] ?? "").trim();
      if (!checkName(member, row, "member", "member")) return;
      if (seenMember.has(member)) {
        issues.push(cellIssue(row, "member", `${member} has two rows`));
        return;
      }
      addMember(member, blocCol >= 0 ? (cells[blocCol] ?? "").trim() : "", row);
      for (const { h, i } of voteCols) {
        const raw = cells[i] ?? "";
        const pos = position(raw);
        if (pos === undefined) issues.push(cellIssue(row, h, `"${raw.trim()}" ${BAD_POSITION}`));
        else record(h, member, pos, row, h);
      }
    });
  }
  if (issues.length) failRows(issues);
  return { layout: long ? "long" : "matrix", members, blocs, votes: [...votes.values()].map(({ id, yea, nay, notCounted }) => ({ id, yea, nay, notCounted })) };
}
