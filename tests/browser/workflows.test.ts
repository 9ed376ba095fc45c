// Whole jobs through the web pages, not the API: a clerk introduces a measure and edits a section
// (a second tab that saved late is told who changed what), a member edits the amendment they filed,
// a clerk overrides a finding with a picked ruling and revokes it, ballots are entered in a table
// and analysed, a CSV becomes a new version, and a spatial estimate's positions are edited.
// The product's own contract (common practice, no source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { BASE_URL, launch, pickSponsors, shot, signInAs, textOf, visible } from "./browser.ts";

// One signed-in browser per role, shared by the tests (signing in is the slowest step).
let clerk: Awaited<ReturnType<typeof launch>>;
let member: Awaited<ReturnType<typeof launch>>;
const unique = Date.now().toString(36).slice(-5).toUpperCase();
const NUMBER = `WF ${unique}`;
let measureUrl = "";
let estimateUrl = "";

beforeAll(async () => {
  [clerk, member] = await Promise.all([launch(), launch()]);
  await signInAs(await clerk.context.newPage(), "clerk");
  await signInAs(await member.context.newPage(), "member");
}, 60_000);
afterAll(async () => {
  await Promise.all([clerk?.close(), member?.close()]);
});

async function pageOf(who: { context: BrowserContext }): Promise<Page> {
  for (const p of who.context.pages()) await p.close();
  return who.context.newPage();
}

/** The JSON API with the page's session (for setting the scene only; the job itself is done on the pages). */
async function api(page: Page, method: "POST" | "GET", path: string, data?: unknown) {
  const res = await page.request.fetch(`${BASE_URL}${path}`, { method, data, headers: { origin: BASE_URL } });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

function csvFile(name: string, text: string): string {
  const p = join(mkdtempSync(join(tmpdir(), "gw-wf-")), name);
  writeFileSync(p, text);
  return p;
}

describe("measures and amendments on the pages", () => {
  it("a clerk introduces a measure, edits a section, and a second tab's late save is told who changed what", async () => {
    const page = await pageOf(clerk);
    await page.goto(`${BASE_URL}/measures`);
    await page.getByLabel("Number").fill(NUMBER);
    await page.getByLabel("Title", { exact: true }).fill("Quayside Bollards Ordinance");
    await page.getByLabel("Committee of jurisdiction").fill("Harbour Works");
    await page.getByLabel("Status").selectOption("in-committee");
    await pickSponsors(page, [0]);
    await page.getByLabel("Text", { exact: true }).fill("## Section 1 — Bollards\nSubjects: bollards, safety\nBollards shall stand on the quay.\nThey shall be painted.\n## Section 2 — Costs\nSubjects: finance\nThe harbour dues pay for them.");
    await Promise.all([page.waitForURL(/\/measures\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Introduce measure" }).click()]);
    measureUrl = page.url();
    expect(await textOf(page.locator("h1"))).toContain(NUMBER);
    expect(await textOf(page.getByText(/· in committee ·/))).toContain("Harbour Works");

    // A second tab opens the same version before the first one saves.
    const late = await clerk.context.newPage();
    await late.goto(measureUrl);
    await late.getByText("Edit this measure's fields and sections…").click();

    await page.bringToFront();
    await page.getByText("Edit this measure's fields and sections…").click();
    await page.getByLabel("Text of § s1").fill("Bollards shall stand on the quay.\nThey shall be painted yellow.\nThey shall be lit at night.");
    await page.getByLabel("Subject tags of § s1").fill("bollards, safety, lighting");
    await page.getByRole("button", { name: "Add a section" }).click();
    await page.getByLabel("Text of § new section").fill("This ordinance takes effect on 1 May.");
    await page.getByRole("button", { name: /Save changes/ }).click();
    await visible(page.getByText("They shall be lit at night."));
    await visible(page.locator("#section-s3"));
    expect(await textOf(page.getByText(/version 2/).first())).toBeTruthy();
    await shot(page, "workflows-measure-edited");

    await late.bringToFront();
    await late.getByLabel("Title", { exact: true }).fill("Quayside Bollards (Amendment) Ordinance");
    await late.getByRole("button", { name: /Save changes/ }).click();
    const alert = await textOf(late.getByTestId("measure-editor-error"));
    expect(alert).toMatch(/Changed by .+ since you opened it: edited/);
    expect(alert).toContain("sections");
    await late.getByTestId("measure-editor-error").scrollIntoViewIfNeeded();
    await shot(late, "workflows-measure-409");
    await late.getByRole("button", { name: "Reload the current version" }).click();
    await visible(late.getByText("They shall be lit at night."));
    await late.close();
  });

  it("a member edits the amendment they filed", async () => {
    const page = await pageOf(member);
    const measureId = measureUrl.split("/").pop()!;
    await page.goto(measureUrl);
    // Filed through the page's own form.
    const filing = page.getByTestId("file-amendment");
    await filing.getByLabel("Amends").selectOption("s1");
    await filing.getByLabel("Short title").fill("Reflective paint");
    await filing.getByLabel("Text of the amendment").fill("Insert: with reflective paint.");
    await page.getByTestId("file-amendment").getByLabel("Subject tags").fill("harbour fees");
    await page.getByRole("button", { name: "File amendment" }).click();
    await visible(page.getByText(/Filed as Amendment A1/));
    // The page reloads with the new row; its Edit link opens the editor on it.
    await page.getByRole("link", { name: "Edit amendment A1" }).click();
    await visible(page.getByRole("heading", { name: "Edit amendment A1" }));
    const editor = page.getByTestId("amendment-editor");
    await editor.getByLabel("Form").selectOption("strike-and-insert");
    await editor.getByLabel("Lines (sections only)").fill("2");
    await editor.getByLabel("Text of the amendment").fill("Strike “yellow”, insert “reflective yellow”.");
    await editor.getByLabel("Short title").fill("Reflective paint, line 2");
    await editor.getByLabel("Subject tags").fill("bollards, paint");
    await shot(page, "workflows-amendment-edit");
    await page.getByRole("button", { name: "Save amendment A1" }).click();
    await visible(page.getByTestId("amendments-table").getByText("Reflective paint, line 2"));
    expect(await textOf(page.getByTestId("amendments-table").locator("tr#A1"))).toMatch(/Strike and insert[\s\S]*lines 2–2/);
    expect((await api(page, "GET", `/api/measures/${measureId}/amendments`)).amendments[0].text).toContain("reflective yellow");
  });

  it("a clerk overrides a finding with a picked ruling, then revokes it", async () => {
    const page = await pageOf(clerk);
    page.on("dialog", (d) => void d.accept());
    await page.goto(`${measureUrl}/tree#A1`);
    const details = page.getByTestId("tree-details");
    await visible(details.getByRole("heading", { name: "Amendment A1" }));
    await details.getByRole("button", { name: "Override with a ruling…" }).first().click();
    const hits = details.getByRole("list", { name: "Matching rulings" }).getByRole("button");
    await visible(hits);
    const first = await textOf(hits.first());
    const number = /Ruling (\d+)/.exec(first)![1];
    await details.getByLabel("Find an issued ruling (number or words)").fill(number);
    await expect.poll(async () => (await hits.allInnerTexts()).every((t) => t.startsWith(`Ruling ${number}`)), { timeout: 5000 }).toBe(true);
    await hits.filter({ hasText: `Ruling ${number}` }).first().click();
    expect(await details.getByLabel("Ruling relied on").inputValue()).toMatch(new RegExp(`^Ruling ${number}`));
    await shot(page, "workflows-override-picker");
    await details.getByRole("button", { name: "Record override" }).click();
    expect(await textOf(page.getByRole("status").filter({ hasText: "Override on Amendment A1 recorded" }))).toContain(`resting on Ruling ${number}`);
    await visible(details.getByText(`Ruling: Ruling ${number}`));
    expect(await details.getByRole("link", { name: new RegExp(`^Ruling ${number} \\(`) }).first().getAttribute("href")).toMatch(/^\/rulings\/[0-9a-f-]{36}$/);
    await shot(page, "workflows-override-recorded");
    await details.getByRole("button", { name: "Revoke override" }).click();
    expect(await textOf(page.getByRole("status").filter({ hasText: "revoked" }))).toMatch(/Override on Amendment A1 revoked: “.+” counts again/);
    expect(await details.getByRole("button", { name: "Revoke override" }).count()).toBe(0);

    // A finding on the demo tree shows the issued precedents that cite the same rule.
    const { measures } = (await api(page, "GET", "/api/measures")) as { measures: Array<{ id: string; number: string }> };
    await page.goto(`${BASE_URL}/measures/${measures.find((m) => m.number === "HCA 12")!.id}/tree#A8`);
    const related = page.getByTestId(/^related-A8-/);
    expect(await textOf(related)).toMatch(/Related precedents: Ruling \d+/);
  });
});

describe("estimates on the pages", () => {
  it("a clerk starts an estimate from the roster, enters ballots in the table and sees the analysis", async () => {
    const page = await pageOf(clerk);
    await page.goto(`${BASE_URL}/orders`);
    await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
    for (const a of ["A1", "A2", "A7"]) await page.getByRole("checkbox", { name: new RegExp(`^${a} \\(`) }).check();
    await visible(page.getByTestId("versions-to-rank").getByText("HCA 12 + A1 + A2", { exact: true }));
    await page.getByLabel("Title of the estimate").fill(`Table count ${unique}`);
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start from the roster and fill it in on the page" }).click()]);
    estimateUrl = page.url();
    // An unfilled draft: the table is open and the analysis waits until it is filled in.
    await visible(page.getByTestId("draft-notice"));
    const table = page.getByTestId("ballot-table");
    await visible(table);
    // Row 1: the measure and Q tied first; row 2 leaves Q unranked. Versions are named in words.
    const rank = async (row: number, places: Record<string, string>) => {
      const name = await table.getByLabel(`Row ${row}: member or bloc`).inputValue();
      for (const [v, p] of Object.entries(places)) await table.getByLabel(`${name}: place of ${v}`, { exact: true }).fill(p);
    };
    await rank(1, { "Q (no change)": "1", "HCA 12": "1", "HCA 12 + A1": "2", "HCA 12 + A7": "3", "HCA 12 + A1 + A2": "4" });
    await rank(2, { "Q (no change)": "", "HCA 12": "4", "HCA 12 + A1": "3", "HCA 12 + A7": "1", "HCA 12 + A1 + A2": "2" });
    await rank(3, { "Q (no change)": "3", "HCA 12": "1", "HCA 12 + A1": "4", "HCA 12 + A7": "5", "HCA 12 + A1 + A2": "2" });
    expect(await textOf(table.locator("tbody tr").first())).toContain("Q (no change) = HCA 12 > HCA 12 + A1 > HCA 12 + A7 > HCA 12 + A1 + A2");
    await rank(4, { "Q (no change)": "x" });
    await visible(table.getByText("the place of Q (no change) must be a whole number from 1"));
    await rank(4, { "Q (no change)": "5" });
    await shot(page, "workflows-ballot-table");
    await Promise.all([page.waitForURL(estimateUrl), table.getByRole("button", { name: "Save as version 2" }).click()]);
    await visible(page.getByText(/version 2 of 2/));
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    await visible(page.getByText(/projections from an estimate/).first());
    await shot(page, "workflows-ballot-analysis");
  });

  it("uploads a CSV as the next version of that estimate", async () => {
    const page = await pageOf(clerk);
    await page.goto(estimateUrl);
    await page.getByText("Upload a CSV as version 3…").click();
    const box = page.getByTestId("upload-version");
    await box.getByLabel("CSV file").setInputFiles(csvFile("bad.csv", "member,bloc,weight,ranking\nNorth,North,20,measure > Z\n"));
    await box.getByRole("button", { name: "Upload as a new version" }).click();
    expect(await textOf(box.getByRole("alert"))).toContain("row 2, column ranking");
    await box.getByLabel("CSV file").setInputFiles(csvFile("good.csv", "member,bloc,weight,ranking\nNorth,North,21,measure+A7 > measure > Q\nSouth,South,19,measure > Q = measure+A1\n"));
    await box.getByRole("button", { name: "Upload as a new version" }).click();
    await visible(page.getByText(/version 3 of 3 — Uploaded from CSV/));
    await visible(page.getByText(/2 rows, 40 votes/));
    await shot(page, "workflows-csv-version");
  });

  it("edits a spatial estimate's dimensions and positions and saves them as a new version", async () => {
    const page = await pageOf(member);
    const measures = (await api(page, "GET", "/api/estimates/options")) as { measures: Array<{ id: string; number: string }> };
    const measureId = measures.measures.find((m) => m.number === "HCA 12")!.id;
    const content = { kind: "spatial", dimensions: ["Lighting", "Cost"], statusQuo: [1, 1], measure: [5, 5], effects: {}, members: [{ member: "North", bloc: "North", weight: 3, ideal: [2, 3] }, { member: "South", bloc: "South", weight: 2, ideal: [7, 6] }, { member: "East", bloc: "East", weight: 2, ideal: [8, 1] }] };
    const made = (await api(page, "POST", "/api/estimates", { measureId, title: `Spatial edit ${unique}`, scope: ["A1", "A7"], content })) as { id: string };
    await page.goto(`${BASE_URL}/orders/${made.id}`);
    const editor = page.getByTestId("positions-editor");
    await visible(editor);
    await editor.getByLabel("Name of dimension 1").fill("Lighting standard");
    await editor.getByLabel("High end of Lighting standard").fill("12");
    await editor.getByLabel("Status quo on Lighting standard").fill("3");
    await editor.getByLabel("How A1 moves the text").selectOption("position");
    await editor.getByLabel("A1 position on Lighting standard").fill("6");
    await editor.getByLabel("How A7 moves the text").selectOption("shift");
    await editor.getByLabel("A7 shift on Cost").fill("-2");
    await editor.getByText(/Members' ideal points \(3 rows, 7 votes\)/).click();
    await editor.getByLabel("Row 1: weight").fill("4");
    await visible(editor.getByText(/Members' ideal points \(3 rows, 8 votes\)/));
    await visible(page.getByRole("group", { name: /Lighting standard across/ }));
    await shot(page, "workflows-spatial-edit");
    await page.getByRole("button", { name: "Save these positions as a new version" }).click();
    await visible(page.getByText(/version 2 of 2/));
    const saved = (await api(page, "GET", `/api/estimates/${made.id}`)) as { version: { content: Record<string, unknown> } };
    expect(saved.version.content).toMatchObject({ dimensions: ["Lighting standard", "Cost"], ranges: [[0, 12], [0, 10]], statusQuo: [3, 1], effects: { A1: { position: [6, 5] }, A7: { shift: [0, -2] } }, members: [{ member: "North", weight: 4 }, { member: "South" }, { member: "East" }] });
    expect(await page.getByTestId("positions-editor").getByLabel("Status quo on Lighting standard").inputValue()).toBe("3");
  });
});
