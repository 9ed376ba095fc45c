// A member's staff imports a session's recorded votes from CSV, estimates members' positions, sees
// them (with uncertainty, by bloc, with a roll call's cutting line, in a table sortable by position),
// saves them as a spatial estimate of HCA 12 and the voting-order analysis runs on it (issue 19).
// The product's own contract (no outside source); the method is checked in tests/unit/ideal-points.
import { describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { BASE_URL, browserForFile, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();
const unique = Date.now().toString(36);

function file(name: string, text: string): string {
  const p = join(mkdtempSync(join(tmpdir(), "gw-positions-")), name);
  writeFileSync(p, text);
  return p;
}

// Twenty-four fictional members in three blocs, in a known left-to-right order; roll call k splits
// them at a cutting point that moves along the line (some roll calls have the right side voting yea),
// with one member absent from each roll call.
const FIRST = ["Ada", "Bram", "Cleo", "Dov", "Esme", "Fenn", "Gil", "Hana"];
const LAST = ["Quill", "Marrow", "Tansy"];
const members = LAST.flatMap((l) => FIRST.map((f) => `${f} ${l}`)); // ordered: all Quills, then Marrows, then Tansys
const bloc = (i: number) => ["Harbour Progressives", "Civic Reform", "Moorland Union"][Math.floor(i / 8)];
const rollCalls = Array.from({ length: 30 }, (_, k) => ({ id: `RC ${k + 1}`, cut: 1 + ((k * 7) % 23), rightYea: k % 3 === 0 }));
const position = (i: number, k: number) => {
  if ((i + k) % 24 === 5) return "not voting";
  const leftOfCut = i < rollCalls[k].cut;
  return leftOfCut !== rollCalls[k].rightYea ? "yea" : "nay";
};
const MATRIX = ["member,bloc," + rollCalls.map((r) => r.id).join(","), ...members.map((m, i) => `${m},${bloc(i)},${rollCalls.map((_, k) => position(i, k)).join(",")}`)].join("\n");
const LONG_BAD = "member,vote,position\nAda Quill,RC 1,yea\nBram Quill,RC 1,perhaps\n";

describe("positions from recorded votes", () => {
  it("staff import votes, estimate positions, save them as an estimate and the analysis runs on it", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "staff");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByRole("link", { name: "Estimate positions from recorded votes" }).click();
    await visible(page.getByRole("heading", { name: "Positions from recorded votes", level: 1 }));

    // A bad file (one row per member per vote): the error names the row and the column.
    await page.getByLabel("CSV file of recorded votes").setInputFiles(file("bad.csv", LONG_BAD));
    expect(await textOf(page.getByRole("alert"))).toContain('row 3, column position: "perhaps" is not a recorded position');
    await shot(page, "positions-import-error");

    // The member × vote table.
    await page.getByLabel("CSV file of recorded votes").setInputFiles(file("session.csv", MATRIX));
    expect(await textOf(page.getByRole("status").filter({ hasText: "Read session.csv" }))).toContain("24 members, 30 roll calls (one column per roll call), 3 blocs");
    await page.getByLabel("Placed on the left").selectOption("Ada Quill");
    await page.getByLabel("Placed on the right").selectOption("Hana Tansy");
    await page.getByRole("button", { name: "Estimate positions" }).click();
    await visible(page.getByRole("heading", { name: "3. Where members stand" }), 60_000);
    expect(await textOf(page.getByTestId("fit"))).toMatch(/account for \d+\.\d% of the [\d,]+ votes counted/);
    // each member has 28 or 29 votes, roll calls split at least 2 of 24: nothing is left out
    expect(await textOf(page.getByTestId("left-out"))).toContain("0 roll calls where the losing side had fewer than 2.5% of the votes, and 0 members with fewer than 20 votes");
    await visible(page.getByTestId("positions-chart"));
    await page.getByLabel("Roll call whose cutting line is drawn").selectOption({ index: 3 });
    await visible(page.getByTestId("cutting-line"));
    await shot(page, "positions-result");

    // The table sorted by position runs from the member placed left to the member placed right.
    const table = page.getByTestId("positions-table");
    const firstCells = async () => (await table.locator("tbody tr td:first-child").allInnerTexts()).map((s) => s.trim());
    let names = await firstCells();
    expect(names[0]).toBe("Ada Quill");
    expect(names[23]).toBe("Hana Tansy");
    expect(names.slice(0, 8).every((n) => n.endsWith("Quill"))).toBe(true);
    await page.getByRole("button", { name: "Sort by position" }).click();
    names = await firstCells();
    expect(names[0]).toBe("Hana Tansy");
    await page.getByRole("button", { name: "Sort by member" }).click();
    names = await firstCells();
    expect(names).toEqual([...members].sort((a, b) => a.localeCompare(b)));

    // Save as a spatial estimate of HCA 12 with amendment A1, versions placed by hand.
    await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
    await page.getByRole("checkbox", { name: /^A1 \(/ }).check();
    await page.getByLabel("Title of the estimate").fill(`Positions from the session ${unique}`);
    await page.getByRole("group", { name: "Status quo (the measure rejected)" }).getByLabel("Left to right").fill("1.2");
    await page.getByRole("group", { name: "HCA 12 as introduced" }).getByLabel("Left to right").fill("-0.8");
    await page.getByRole("button", { name: "Save as estimate" }).click();
    expect(await textOf(page.getByRole("alert"))).toContain("Amendment A1, Left to right: give a number");
    await page.getByRole("group", { name: "Where amendment A1, if adopted, puts the measure" }).getByLabel("Left to right").fill("0.1");
    await shot(page, "positions-save");
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Save as estimate" }).click()]);
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    expect(await textOf(page.getByRole("heading", { name: `Positions from the session ${unique}`, level: 1 }))).toBeTruthy();
    await shot(page, "positions-analysis");
  });

  it("two dimensions at phone width: the plane with each member's uncertainty and a roll call's cutting line", async () => {
    const page = await browser.freshPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signInAs(page, "staff");
    await page.goto(`${BASE_URL}/orders/positions`);
    await page.getByLabel("CSV file of recorded votes").setInputFiles(file("session.csv", MATRIX));
    await page.getByLabel("Dimensions").selectOption({ label: "Two" });
    await page.getByRole("button", { name: "Estimate positions" }).click();
    await visible(page.getByRole("heading", { name: "3. Where members stand" }), 60_000);
    await visible(page.getByRole("img", { name: /on two dimensions, with the cutting line of RC 1/ }));
    await visible(page.getByTestId("cutting-line"));
    await visible(page.getByRole("columnheader", { name: "Second dimension" }));
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    await shot(page, "positions-phone");
  });
});
