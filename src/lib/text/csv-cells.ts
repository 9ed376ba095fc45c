/**
 * Every CSV the app writes goes through `writeCsv`: a text cell that begins with `=`, `+`, `-`, `@`,
 * a tab or a carriage return is neutralised with a leading apostrophe, so a spreadsheet shows it as
 * text instead of running it as a formula (OWASP, "CSV Injection": paraphrase of its advice to
 * prefix such cells with a single quote and quote the field). Numbers stay numbers. `restoreCell`
 * takes the apostrophe off again when such a file is uploaded back (src/lib/estimates/csv-text.ts),
 * so a downloaded template round-trips. Pure.
 */
import Papa from "papaparse";

const FORMULA_START = /^[=+\-@\t\r]/;

/** The cell as written: text that a spreadsheet would read as a formula gets a leading apostrophe. */
export function neutraliseCell(v: string | number | boolean | null | undefined): string | number | boolean | null | undefined {
  return typeof v === "string" && FORMULA_START.test(v) ? `'${v}` : v;
}

/** Undo `neutraliseCell` on a cell read back from an uploaded CSV. */
export function restoreCell(v: string): string {
  return v.length > 1 && v[0] === "'" && FORMULA_START.test(v.slice(1)) ? v.slice(1) : v;
}

/** A CSV text (RFC 4180 quoting, CR LF line ends, a final line end) with every cell neutralised. */
export function writeCsv(fields: readonly string[], rows: ReadonlyArray<ReadonlyArray<string | number | boolean | null | undefined>>): string {
  return Papa.unparse({ fields: fields.map((f) => String(neutraliseCell(f))), data: rows.map((r) => r.map(neutraliseCell)) }, { newline: "\r\n" }) + "\r\n";
}
