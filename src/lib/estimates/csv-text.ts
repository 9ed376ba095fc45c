/**
 * Uploaded CSV bytes → text and records. Only UTF-8 is accepted (a leading byte-order mark is
 * dropped); anything else is refused rather than guessed, so a name never arrives garbled.
 * Records are split by papaparse (RFC 4180 quoting); header names are trimmed and lower-cased.
 * Row numbers count the header as row 1, as a spreadsheet shows them. A cell the app neutralised
 * against formula injection when it wrote the file (a leading apostrophe) is read back without it.
 */
import Papa from "papaparse";
import { GavelError, type InputIssue } from "../errors.ts";
import { restoreCell } from "../text/csv-cells.ts";

export const MAX_CSV_BYTES = 512 * 1024;

export function decodeCsv(bytes: Uint8Array): string {
  if (bytes.byteLength > MAX_CSV_BYTES) throw new GavelError("too-large", `the file is ${bytes.byteLength} bytes; the limit is ${MAX_CSV_BYTES}`);
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new GavelError("invalid-input", "the file is not UTF-8 text: save it from your spreadsheet as \"CSV UTF-8\"", { issues: [{ path: "file", message: "not UTF-8 encoded" }] });
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.includes("\u0000")) throw new GavelError("invalid-input", "the file contains binary data, not CSV text", { issues: [{ path: "file", message: "binary data" }] });
  return text;
}

export interface CsvRecords {
  header: string[];
  /** Data rows with their spreadsheet row number. */
  rows: Array<{ row: number; cells: Record<string, string> }>;
}

export function readCsv(text: string): CsvRecords {
  const parsed = Papa.parse<string[]>(text.replace(/\r\n?/g, "\n"), { skipEmptyLines: "greedy" });
  const data = parsed.data;
  if (data.length === 0) throw new GavelError("invalid-input", "the file is empty", { issues: [{ path: "file", message: "no header row" }] });
  const header = data[0].map((h) => restoreCell(h.trim()).toLowerCase());
  const rows = data.slice(1).map((cells, i) => ({ row: i + 2, cells: Object.fromEntries(header.map((h, j) => [h, restoreCell((cells[j] ?? "").trim())])), extra: cells.length > header.length && cells.slice(header.length).some((c) => c.trim() !== "") }));
  const extra = rows.find((r) => r.extra);
  if (extra) throw new GavelError("invalid-input", `row ${extra.row}: more cells than the header has columns`, { issues: [{ path: `rows.${extra.row}`, message: `row ${extra.row}: more cells than the header has columns` }] });
  return { header, rows: rows.map(({ row, cells }) => ({ row, cells })) };
}

/** Refuse a header that lacks a required column or carries one we do not know. */
export function checkColumns(header: string[], required: readonly string[], optional: readonly string[]): void {
  const issues: InputIssue[] = [];
  const known = new Set([...required, ...optional]);
  for (const r of required) if (!header.includes(r)) issues.push({ path: "header", message: `missing column "${r}"` });
  header.forEach((h, i) => {
    if (!known.has(h)) issues.push({ path: `header.${i}`, message: `unknown column "${h || "(blank)"}"; expected ${[...required, ...optional].join(", ")}` });
  });
  const dup = header.find((h, i) => header.indexOf(h) !== i);
  if (dup) issues.push({ path: "header", message: `column "${dup}" appears twice` });
  if (issues.length) throw new GavelError("invalid-input", `wrong columns: ${issues.map((i) => i.message).join("; ")}`, { issues });
}

/** A row-precise issue: "row 7, column ranking: unknown version B+Z". */
export function cellIssue(row: number, column: string, message: string): InputIssue {
  return { path: `rows.${row}.${column}`, message: `row ${row}, column ${column}: ${message}` };
}

export function failRows(issues: InputIssue[]): never {
  const shown = issues.slice(0, 50);
  throw new GavelError("invalid-input", `${issues.length} problem${issues.length === 1 ? "" : "s"} in the file; first: ${shown[0].message}`, { issues: shown });
}
