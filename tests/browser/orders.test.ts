// A clerk builds an estimate from an uploaded CSV, sees the order analysis of HCA 12, picks an order
// and opens (and prints) the chair's script; under a successive-procedure rulebook version the
// walk-through and the script show projected tallies too; a member's private estimate stays private;
// the spatial view shows the status quo's win set; a spatial estimate gains and loses a dimension.
// The product's own contract (no outside source).
import { describe, expect, it } from "vitest";
import { writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { BASE_URL, browserForFile, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();

const unique = Date.now().toString(36);
let estimateId = "";

async function api(page: Page, method: "GET" | "POST", path: string, data?: unknown) {
  const res = await page.request.fetch(`${BASE_URL}${path}`, { method, data, headers: { origin: BASE_URL } });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}
const CSV = [
  "member,bloc,weight,ranking",
  "Moorland Union,Moorland Union,14,measure+A1 > measure+A7 > measure+A1+A2 > Q > measure",
  "Harbour Progressives,Harbour Progressives,12,measure+A7 > measure+A1+A2 > measure+A1 > measure > Q",
  "Civic Reform,Civic Reform,9,measure > measure+A1+A2 > Q > measure+A1 > measure+A7",
  "Independents,Independents,5,measure > measure+A1+A2 > measure+A7 > Q > measure+A1",
].join("\n");

function file(name: string, text: string): string {
  const dir = mkdtempSync(join(tmpdir(), "gw-orders-"));
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

async function chooseScope(page: import("playwright-core").Page) {
  await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
  for (const a of ["A1", "A2", "A7"]) await page.getByRole("checkbox", { name: new RegExp(`^${a} \\(`) }).check();
  await visible(page.getByTestId("versions-to-rank").getByText("HCA 12 + A1 + A2", { exact: true }));
}

/** The page is no wider than the window (no sideways scrolling). */
async function noOverflow(page: Page, width?: number) {
  const [w, inner] = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
  if (width !== undefined) expect(inner).toBe(width);
  expect(w, `page is ${w} px wide at ${inner} px`).toBeLessThanOrEqual(inner);
}

describe("voting orders", () => {
  it("a clerk uploads a CSV estimate, sees the analysis, picks an order and prints the chair's script", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await chooseScope(page);
    await page.getByLabel("Title of the estimate").fill(`Whips' count ${unique}`);
    // A bad file first: the error names the row and the column.
    await page.getByLabel("CSV file").setInputFiles(file("bad.csv", CSV.replace("measure+A7 > measure+A1+A2 > measure+A1 > measure > Q", "measure+Z > Q")));
    await page.getByRole("button", { name: "Preview" }).click();
    expect(await textOf(page.getByRole("alert"))).toContain("row 3, column ranking: unknown version measure+Z");
    await shot(page, "orders-upload-error");
    await page.getByLabel("CSV file").setInputFiles(file("good.csv", CSV));
    await page.getByRole("button", { name: "Preview" }).click();
    expect(await textOf(page.getByRole("heading", { name: /Preview/ }))).toContain("40 votes");
    await shot(page, "orders-upload-preview");
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Save estimate" }).click()]);
    estimateId = page.url().split("/").pop()!;
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    expect(await textOf(page.getByText(/The order of questions decides the outcome/))).toBeTruthy();
    await visible(page.getByText(/projections from an estimate/).first());
    expect(await textOf(page.getByText(/Legal orders of questions: 2/))).toBeTruthy(); // A2 and A1 are one block (primary-contiguous in the demo rulebook; RONR 1915 §33 p. 135)
    await shot(page, "orders-analysis");
    await page.getByRole("button", { name: "Walk through" }).first().click();
    await visible(page.getByRole("heading", { name: /Vote by vote/ }));
    expect(await textOf(page.locator("#walk-through"))).toMatch(/adopted|rejected/);
    expect(await page.locator("#walk-through").innerText()).toMatch(/\(\d+ for, \d+ against\)/);
    await shot(page, "orders-walk-through");
    await Promise.all([page.waitForURL(/\/script\?/), page.getByRole("link", { name: "Open the chair's script for this order" }).click()]);
    await visible(page.getByRole("heading", { name: /Chair's script/, level: 1 }));
    expect(await textOf(page.getByText(/Vote required/).first())).toBeTruthy();
    await page.evaluate(() => {
      (window as unknown as { printed: boolean }).printed = false;
      window.print = () => ((window as unknown as { printed: boolean }).printed = true);
    });
    await page.getByRole("button", { name: "Print" }).click();
    expect(await page.evaluate(() => (window as unknown as { printed: boolean }).printed)).toBe(true);
    await page.emulateMedia({ media: "print" });
    await shot(page, "orders-chair-script-print");
    await page.emulateMedia({ media: "screen" });
    const md = await page.request.get(await page.getByRole("link", { name: "Download as Markdown" }).getAttribute("href").then((h) => `${BASE_URL}${h}`));
    expect(md.headers()["content-type"]).toMatch(/markdown/);
    expect(await md.text()).toMatch(/^# Chair's script/);
  });

  it("under a successive-procedure rulebook version, the walk-through and the chair's script show projected tallies", async () => {
    expect(estimateId).not.toBe("");
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const books = await api(page, "GET", "/api/rulebooks");
    const inForce = await api(page, "GET", `/api/rulebooks/${books.inForce.versionId}`);
    const trial = await api(page, "POST", "/api/rulebooks", { basedOn: books.latest.id, note: `Successive voting trial ${unique}`, document: { ...inForce.document, voting: { ...inForce.document.voting, procedure: "successive" } } });
    const run = await api(page, "POST", "/api/analysis/runs", { estimateId, rulebookVersionId: trial.id });
    await page.goto(`${BASE_URL}/orders/${estimateId}?run=${run.runId}`);
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    await visible(page.getByText(/successive procedure \(yes\/no in turn\)/));
    await page.getByRole("button", { name: "Walk through" }).first().click();
    await visible(page.getByRole("heading", { name: /Vote by vote/ }));
    const walk = await page.locator("#walk-through").innerText();
    expect(walk).toMatch(/first choice among the versions still within reach/);
    expect(walk).toMatch(/\(\d+ for, \d+ against\)/);
    expect(walk).toContain("Weighed against what was still within reach: Q (no change)");
    await page.locator("#walk-through").scrollIntoViewIfNeeded();
    await shot(page, "orders-walk-through-successive");
    await Promise.all([page.waitForURL(/\/script\?/), page.getByRole("link", { name: "Open the chair's script for this order" }).click()]);
    await visible(page.getByRole("heading", { name: /Chair's script/, level: 1 }));
    // The projected path closes the script: "1. <question>: Projected: adopted (…)".
    const first = await textOf(page.getByText(/Projected: (adopted|rejected)/).first());
    expect(first).toMatch(/\(\d+ for, \d+ against\)\. Counted for: members who rank this text above each of the other versions still within reach/);
    expect(await page.getByText(/no tally/).count()).toBe(0);
    await shot(page, "orders-chair-script-successive");
    const md = await page.request.get(await page.getByRole("link", { name: "Download as Markdown" }).getAttribute("href").then((h) => `${BASE_URL}${h}`));
    expect(await md.text()).toMatch(/Projected: (adopted|rejected) \(\d+ for, \d+ against\)/);
    // Back to the analysis returns to the same run, still under the trial rulebook.
    await page.getByRole("link", { name: "Back to the analysis" }).click();
    await visible(page.getByText(/successive procedure \(yes\/no in turn\)/), 60_000);
  });

  it("a member's private estimate is not visible to the clerk", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "member");
    await page.goto(`${BASE_URL}/orders`);
    await chooseScope(page);
    const title = `Member's private count ${unique}`;
    await page.getByLabel("Title of the estimate").fill(title);
    await page.getByLabel("CSV file").setInputFiles(file("mine.csv", CSV));
    await page.getByRole("button", { name: "Preview" }).click();
    await visible(page.getByRole("heading", { name: /Preview/ }));
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Save estimate" }).click()]);
    const url = page.url();
    await visible(page.getByText("Private: only you can see it."));
    const other = await browser.freshPage();
    await signInAs(other, "clerk");
    await other.goto(`${BASE_URL}/orders`);
    await visible(other.getByRole("heading", { name: "Estimates you can see" }));
    expect(await other.getByText(title).count()).toBe(0);
    const res = await other.goto(url);
    expect(res?.status()).toBe(404);
  });

  it("the spatial view shows the status quo's win set and moves a bloc with the keyboard", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByRole("link", { name: "Lighting and cost: where the blocs stand" }).click();
    await visible(page.getByRole("heading", { name: "Where members stand" }));
    const win = page.getByTestId("win-set");
    expect(await win.locator("circle").count()).toBeGreaterThan(0);
    expect(await textOf(page.getByText(/Win set of Q: union of/))).toBeTruthy();
    // Axes with numbered ticks and the dimensions' names; blocs named on the plot, not only counted.
    expect(await page.getByTestId("x-ticks").locator("text").count()).toBeGreaterThanOrEqual(3);
    expect(await page.getByTestId("y-ticks").locator("text").count()).toBeGreaterThanOrEqual(3);
    expect((await page.getByTestId("x-ticks").locator("text").allTextContents()).every((t) => /^-?\d+(\.\d+)?$/.test(t))).toBe(true);
    expect(await page.getByTestId("x-axis-name").textContent()).toMatch(/\w+ →/);
    expect(await page.getByTestId("y-axis-name").textContent()).toMatch(/\w+ →/);
    expect(await page.getByTestId("bloc-name").allTextContents()).toContain("Moorland Union");
    // The win set's shading lies inside the plot's frame.
    const clip = await page.evaluate(() => {
      const svg = document.querySelector("[data-testid=win-set]")!.closest("svg")!;
      const frame = svg.querySelector("clipPath#gw-plot-area rect")!.getBoundingClientRect();
      const shade = svg.querySelector("[data-testid=win-set]")!.getBoundingClientRect();
      return { frame: { l: frame.left, t: frame.top, r: frame.right, b: frame.bottom }, inClip: svg.querySelector("[data-testid=win-set]")!.closest("[clip-path='url(#gw-plot-area)']") !== null, shade: { w: shade.width } };
    });
    expect(clip.inClip).toBe(true);
    await shot(page, "orders-spatial");
    const bloc = page.getByRole("button", { name: /^Moorland Union: 14 votes at \(2, 3\)/ });
    await bloc.focus();
    await page.keyboard.press("ArrowRight");
    await visible(page.getByRole("button", { name: /^Moorland Union: 14 votes at \(2.5, 3\)/ }));
    await visible(page.getByRole("button", { name: "Save these positions as a new version" }));
    await shot(page, "orders-spatial-moved");
  });

  it("a spatial estimate gains a dimension and loses it again, each saved as a new version", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const options = await api(page, "GET", "/api/estimates/options");
    const measureId = (options.measures as Array<{ id: string; number: string }>).find((m) => m.number === "HCA 12")!.id;
    const content = { kind: "spatial", dimensions: ["Lighting", "Cost"], statusQuo: [1, 1], measure: [5, 5], effects: { A1: { position: [6, 4] } }, members: [{ member: "Moorland Union", bloc: "Moorland Union", weight: 14, ideal: [2, 3] }, { member: "Harbour Progressives", bloc: "Harbour Progressives", weight: 12, ideal: [7, 6] }, { member: "Civic Reform", bloc: "Civic Reform", weight: 9, ideal: [8, 1] }] };
    const made = await api(page, "POST", "/api/estimates", { measureId, title: `Dimensions ${unique}`, scope: ["A1", "A7"], content });
    await page.goto(`${BASE_URL}/orders/${made.id}`);
    const editor = page.getByTestId("positions-editor");
    await visible(editor);
    // Invalid names are refused on the page: empty, and one already used (ignoring case).
    await editor.getByRole("button", { name: "Add a dimension" }).click();
    expect(await textOf(editor.getByRole("alert"))).toMatch(/name/);
    await editor.getByLabel("New dimension").fill("cost");
    await editor.getByRole("button", { name: "Add a dimension" }).click();
    expect(await textOf(editor.getByRole("alert"))).toContain("already called “Cost”");
    await editor.getByLabel("New dimension").fill("Harbour access");
    await editor.getByRole("button", { name: "Add a dimension" }).click();
    await visible(editor.getByLabel("Name of dimension 3"));
    expect(await editor.getByLabel("Name of dimension 3").inputValue()).toBe("Harbour access");
    await visible(editor.getByLabel("Status quo on Harbour access"));
    await visible(page.getByText("The plot shows estimates in two dimensions; this one has 3."));
    await editor.getByLabel("Status quo on Harbour access").fill("4");
    await shot(page, "orders-spatial-dimension-added");
    await page.getByRole("button", { name: "Save these positions as a new version" }).click();
    await visible(page.getByText(/version 2 of 2 — Dimensions and positions edited/));
    let saved = await api(page, "GET", `/api/estimates/${made.id}`);
    expect(saved.version.content).toMatchObject({ dimensions: ["Lighting", "Cost", "Harbour access"], statusQuo: [1, 1, 4], measure: [5, 5, 0], effects: { A1: { position: [6, 4, 0] } } });

    // Removing asks first; "Keep it" changes nothing.
    const after = page.getByTestId("positions-editor");
    await after.getByRole("button", { name: "Remove dimension 2 (Cost)" }).click();
    const confirm = after.getByRole("group", { name: "Confirm removing a dimension" });
    expect(await textOf(confirm)).toContain("deleted from every member's ideal point");
    await shot(page, "orders-spatial-dimension-confirm");
    await confirm.getByRole("button", { name: "Keep it" }).click();
    expect(await after.getByLabel("Name of dimension 2").inputValue()).toBe("Cost");
    await after.getByRole("button", { name: "Remove dimension 2 (Cost)" }).click();
    await after.getByRole("button", { name: "Remove “Cost”" }).click();
    expect(await after.getByLabel("Name of dimension 2").inputValue()).toBe("Harbour access");
    expect(await after.getByLabel("Name of dimension 3").count()).toBe(0);
    await visible(page.getByRole("group", { name: /Lighting across, Harbour access up/ }));
    await shot(page, "orders-spatial-dimension-removed");
    await page.getByRole("button", { name: "Save these positions as a new version" }).click();
    await visible(page.getByText(/version 3 of 3 — Dimensions and positions edited/));
    saved = await api(page, "GET", `/api/estimates/${made.id}`);
    expect(saved.version.content).toMatchObject({ dimensions: ["Lighting", "Harbour access"], statusQuo: [1, 4], measure: [5, 0], effects: { A1: { position: [6, 0] } }, members: [{ ideal: [2, 0] }, { ideal: [7, 0] }, { ideal: [8, 0] }] });
  });

  it("a clerk starts from the roster, cannot analyse the draft until it is filled, fills it, then reads and sorts the majority matrix", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
    // The third-degree amendment is not offered, and the form says why.
    await visible(page.getByTestId("not-offered"));
    expect(await textOf(page.getByTestId("not-offered"))).toMatch(/A8 .*third degree is out of order/);
    expect(await page.getByRole("checkbox", { name: /^A8 / }).count()).toBe(0);
    for (const a of ["A1", "A4", "A5", "A6"]) await page.getByRole("checkbox", { name: new RegExp(`^${a} \\(`) }).check();
    const list = page.getByTestId("versions-to-rank");
    await visible(list.getByText("HCA 12 + A1 + A4 + A5 + A6", { exact: true }));
    const nVersions = await list.locator("li").count();
    expect(nVersions).toBeGreaterThan(8);
    expect(await list.innerText()).not.toContain("measure+");
    await noOverflow(page);
    await page.setViewportSize({ width: 390, height: 844 });
    await noOverflow(page, 390);
    await shot(page, "orders-roster-form-phone");
    await page.setViewportSize({ width: 1360, height: 900 });
    await page.getByLabel("Title of the estimate").fill(`Roster count ${unique}`);
    await page.getByLabel("Versions a row leaves out").selectOption("bottom");
    await shot(page, "orders-roster-form");
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start from the roster and fill it in on the page" }).click()]);

    // An unfilled draft: labelled for what it is, and no analysis.
    await visible(page.getByTestId("draft-notice"));
    expect(await textOf(page.getByText(/version 1 of 1 — Started from the roster/))).not.toContain("CSV");
    expect(await textOf(page.getByTestId("draft-notice"))).toMatch(/Draft — not ready for analysis.*rows have no ranking yet/s);
    await visible(page.getByTestId("analysis-refused"));
    expect(await page.getByRole("heading", { name: "Findings" }).count()).toBe(0);
    await shot(page, "orders-roster-draft");
    await page.setViewportSize({ width: 390, height: 844 });
    await noOverflow(page, 390);
    await shot(page, "orders-roster-draft-phone");
    await page.setViewportSize({ width: 1360, height: 900 });

    const table = page.getByTestId("ballot-table");
    const rows = await table.locator("tbody tr").count();
    const names: string[] = [];
    const weights: number[] = [];
    for (let i = 1; i <= rows; i++) {
      names.push(await table.getByLabel(`Row ${i}: member or bloc`).inputValue());
      weights.push(Number(await table.getByLabel(`Row ${i}: weight`).inputValue()));
    }
    // Three blocs whose weights allow a majority cycle (each pair outweighs the third): Condorcet's
    // three rankings X > Y > Z, Y > Z > X, Z > X > Y (Condorcet 1785, from memory).
    const trio = (() => {
      for (let a = 0; a < rows; a++) for (let b = a + 1; b < rows; b++) for (let c = b + 1; c < rows; c++) {
        const [x, y, z] = [weights[a], weights[b], weights[c]];
        if (x + y > z && y + z > x && x + z > y) return [a, b, c];
      }
      return null;
    })();
    expect(trio, `weights ${weights.join(", ")}`).not.toBeNull();
    const [X, Y, Z] = ["HCA 12 + A1", "HCA 12 + A4", "HCA 12 + A5"];
    const rankings = [[X, Y, Z], [Y, Z, X], [Z, X, Y]];
    const fill = async (row: number, ranking: string[]) => {
      for (const [place, v] of ranking.entries()) await table.getByLabel(`${names[row]}: place of ${v}`, { exact: true }).fill(String(place + 1));
    };
    await fill(trio![0], rankings[0]);
    expect(await textOf(table.getByTestId("rows-to-fill"))).toContain(`${rows - 1} of ${rows} rows still to fill in`);
    await table.getByRole("button", { name: "Save as version 2" }).click();
    await visible(page.getByText(/version 2 of 2 — Ballots partly filled in/));
    expect(await textOf(page.getByTestId("draft-notice"))).toContain(`${rows - 1} of ${rows} rows have no ranking yet`);
    expect(await page.getByRole("heading", { name: "Findings" }).count()).toBe(0);

    await fill(trio![1], rankings[1]);
    await fill(trio![2], rankings[2]);
    for (let i = 0; i < rows; i++) if (!trio!.includes(i)) await table.getByRole("checkbox", { name: `${names[i]}: unranked` }).check();
    expect(await textOf(table.getByTestId("rows-to-fill"))).toBe("Every row is filled in or marked unranked.");
    await table.getByRole("button", { name: "Save as version 3" }).click();
    await visible(page.getByText(/version 3 of 3/));
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    expect(await page.getByTestId("draft-notice").count()).toBe(0);

    // The cycle sentence names the three versions; the matrix marks the cycle's three wins.
    await visible(page.getByText(`None: no version beats all the others; the majorities cycle among ${X}, ${Y} and ${Z}.`));
    const matrix = page.getByRole("table", { name: /Majority matrix/ });
    await visible(matrix);
    expect(await matrix.locator("tbody tr").count()).toBe(nVersions);
    expect(await matrix.locator("tbody td", { hasText: "↻" }).count()).toBe(3);
    // Sorting by keyboard: Wins − losses, strongest first, then reversed.
    const byScore = matrix.getByRole("button", { name: /Wins − losses/ });
    await byScore.focus();
    await page.keyboard.press("Enter");
    await visible(matrix.locator("th[aria-sort=descending]", { hasText: "Wins − losses" }));
    expect(await textOf(page.getByText(/Sorted by wins minus losses, highest first/))).toBeTruthy();
    expect([X, Y, Z]).toContain((await matrix.locator("tbody tr th").first().innerText()).split("\n")[0].trim());
    await page.keyboard.press("Space");
    await visible(matrix.locator("th[aria-sort=ascending]", { hasText: "Wins − losses" }));
    expect([X, Y, Z]).not.toContain((await matrix.locator("tbody tr th").first().innerText()).split("\n")[0].trim());

    // The graph is collapsed to the top cycle, says so, and can show every version.
    expect(await textOf(page.getByTestId("graph-collapsed"))).toContain(`${nVersions} versions are too many to draw legibly: the graph shows only the top cycle (3 versions)`);
    expect(await page.getByTestId("majority-graph").getAttribute("aria-label")).toMatch(/^Majority graph of 3 versions/);
    await page.getByTestId("majority-graph").scrollIntoViewIfNeeded();
    await shot(page, "orders-matrix-collapsed");
    await page.getByRole("button", { name: `Show all ${nVersions} versions` }).click();
    expect(await page.getByTestId("majority-graph").getAttribute("aria-label")).toMatch(new RegExp(`^Majority graph of ${nVersions} versions`));
    await page.getByRole("button", { name: "Show only the top cycle" }).click();
    expect(await page.getByTestId("majority-graph").getAttribute("aria-label")).toMatch(/^Majority graph of 3 versions/);
    expect(await page.locator("main").innerText()).not.toMatch(/measure\+|\+A\d+\+/);
    await noOverflow(page);

    // Phone width: nothing wider than the screen.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.reload();
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    await visible(page.getByRole("table", { name: /Majority matrix/ }));
    await noOverflow(page, 390);
    await shot(page, "orders-matrix-phone");
  });

  it("a spatial estimate started from the roster is a draft until the blocs are placed and saved", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
    await page.getByRole("checkbox", { name: /^A1 \(/ }).check();
    await visible(page.getByTestId("versions-to-rank").getByText("HCA 12 + A1", { exact: true }));
    await page.getByLabel("Kind").selectOption("spatial");
    await page.getByLabel("Policy dimensions").fill("Lighting, Cost");
    await page.getByLabel("Title of the estimate").fill(`Spatial roster ${unique}`);
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Start from the roster and fill it in on the page" }).click()]);
    await visible(page.getByText(/version 1 of 1 — Started from the roster \(\d+ blocs\); positions are placeholders, not yet set/));
    expect(await textOf(page.getByTestId("draft-notice"))).toMatch(/the positions are the roster's placeholders/);
    await visible(page.getByTestId("analysis-refused"));
    // Place one bloc with the keyboard and save: the positions are now the clerk's, and the analysis runs.
    const bloc = page.getByRole("button", { name: /votes? at \(0, 0\)/ }).first();
    await bloc.focus();
    await page.keyboard.press("ArrowUp");
    await page.getByRole("button", { name: "Save these positions as a new version" }).click();
    await visible(page.getByText(/version 2 of 2 — Positions edited on the plot/));
    expect(await page.getByTestId("draft-notice").count()).toBe(0);
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    await noOverflow(page);
  });
});
