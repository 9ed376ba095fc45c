/**
 * Members' ideal points from CSV, one row per member or bloc, one column per policy dimension:
 *   member,bloc,weight,<dimension 1>,<dimension 2>
 * Coordinates are plain decimals (a point as decimal separator). Row-precise errors, as for ballots.
 */
import type { InputIssue } from "../errors.ts";
import { parseWeight } from "./ballot-csv.ts";
import { cellIssue, checkColumns, failRows, readCsv } from "./csv-text.ts";
import { MAX_ROWS, type IdealRow } from "./estimate-content.ts";

const DECIMAL = /^[-+]?(\d+(\.\d*)?|\.\d+)$/;

export function parseIdealCsv(text: string, dimensions: readonly string[]): IdealRow[] {
  const { header, rows } = readCsv(text);
  const dims = dimensions.map((d) => d.trim().toLowerCase());
  checkColumns(header, ["member", ...dims], ["bloc", "weight"]);
  if (rows.length === 0) failRows([{ path: "rows", message: "the file has a header but no rows" }]);
  if (rows.length > MAX_ROWS) failRows([{ path: "rows", message: `at most ${MAX_ROWS} rows; the file has ${rows.length}` }]);
  const issues: InputIssue[] = [];
  const out: IdealRow[] = [];
  for (const { row, cells } of rows) {
    const member = cells.member ?? "";
    if (!member) issues.push(cellIssue(row, "member", "name the member or bloc"));
    const weight = parseWeight(cells.weight ?? "");
    if (weight === null) issues.push(cellIssue(row, "weight", `"${cells.weight}" is not a whole number from 1 to 1000`));
    const ideal: number[] = [];
    for (const d of dims) {
      const v = cells[d] ?? "";
      if (!DECIMAL.test(v) || Math.abs(Number(v)) > 1e6) issues.push(cellIssue(row, d, `"${v}" is not a number (use a point for decimals)`));
      else ideal.push(Number(v));
    }
    if (member && weight !== null && ideal.length === dims.length) out.push({ member, bloc: cells.bloc ?? "", weight, ideal });
  }
  if (issues.length) failRows(issues);
  return out;
}
