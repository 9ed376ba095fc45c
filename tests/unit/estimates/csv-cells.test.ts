// CSV formula injection: cells beginning with = + - @, tab or carriage return are neutralised
// with a leading apostrophe. Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection),
// paraphrase: prefix cells that begin with those characters with a single quote, and quote the cell.
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { idealTemplate, ballotTemplate } from "../../../src/lib/estimates/csv-template.ts";
import { readCsv } from "../../../src/lib/estimates/csv-text.ts";
import { neutraliseCell, restoreCell, writeCsv } from "../../../src/lib/text/csv-cells.ts";

const HOSTILE = ['=HYPERLINK("http://evil.example","x")', "@SUM(1+1)*cmd|' /C calc'!A0", "+cmd|' /C calc'!A0", "-2+3+cmd|' /C calc'!A0", "\t=1+1", "\r=1+1"];

describe("CSV cells", () => {
  it("neutralises every formula start and leaves other text and numbers alone", () => {
    for (const h of HOSTILE) expect(neutraliseCell(h)).toBe(`'${h}`);
    expect(neutraliseCell("Harbour bloc")).toBe("Harbour bloc");
    expect(neutraliseCell(-3)).toBe(-3);
    for (const h of HOSTILE) expect(restoreCell(`'${h}`)).toBe(h);
    expect(restoreCell("'tis")).toBe("'tis");
  });

  it("no cell of a written CSV begins with a formula character", () => {
    const text = writeCsv(["name", ...HOSTILE], [HOSTILE, ["a", 1, true, null, undefined, "b", "c"]]);
    const cells = Papa.parse<string[]>(text, { skipEmptyLines: true }).data.flat();
    for (const c of cells) expect(c, JSON.stringify(c)).not.toMatch(/^[=+\-@\t\r]/);
  });

  it("the spatial template with hostile dimension names is safe and reads back to the same names", () => {
    const text = idealTemplate(HOSTILE.slice(0, 4), [{ name: "=Member", bloc: "@bloc" }], true);
    const cells = Papa.parse<string[]>(text, { skipEmptyLines: true }).data.flat();
    for (const c of cells) expect(c).not.toMatch(/^[=+\-@\t\r]/);
    const back = readCsv(text);
    expect(back.header.slice(3)).toEqual(HOSTILE.slice(0, 4).map((h) => h.toLowerCase()));
    expect(back.rows[0].cells.member).toBe("=Member");
    const ballots = ballotTemplate(["Q", "measure"], [{ name: "+x", bloc: "-y" }], true);
    for (const c of Papa.parse<string[]>(ballots, { skipEmptyLines: true }).data.flat()) expect(c).not.toMatch(/^[=+\-@\t\r]/);
  });
});
