// A clerk, in the browser only (issue 16, items 3 and 4): uploads the chamber's standing orders, links
// a motion and a rule to their clauses, reads the coverage, writes three scenarios, changes the rulebook
// so one scenario changes verdict, and adopts the new version with a note. The standing orders are the
// demo chamber's fictional ones; the expected verdicts are the demo-chamber template's (fictional SO 20
// after Robert's Rules of Order Revised, 1915, §33 p. 134 and §3: a member speaking keeps the floor).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { BASE_URL, launch, shot, signInAs } from "./browser.ts";

let browser: { context: BrowserContext; close(): Promise<void> };
let page: Page;

const ORDERS = `# Standing Orders of the Harrowmere Assembly

## SO 20 Precedence of motions
When a question is under debate, no motion shall be received except:
1. to adjourn;
2. to lay on the table;
3. to amend.

## SO 42 Suspension
(1) Standing orders may be suspended by a majority of all members.
(2) No suspension lasts beyond the sitting.

## SO 50 Reconsideration
A vote may be reconsidered on the same or the next day.
`;

beforeAll(async () => {
  browser = await launch();
  page = await browser.context.newPage();
});
afterAll(async () => {
  await browser.close();
});

/** Choose the option of a select whose visible text contains `text`, as a clerk picks it from the list. */
async function choose(selectId: string, text: string | RegExp) {
  const options = await page.locator(`#${selectId} option`).allInnerTexts();
  const label = options.find((o) => (typeof text === "string" ? o.includes(text) : text.test(o)));
  expect(label, `${selectId}: ${String(text)} among ${options.length} options`).toBeDefined();
  await page.locator(`#${selectId}`).selectOption({ label: label! });
}

async function addScenario(title: string, source: string, pending: string[], motion: string, inOrder: boolean, speaking = false) {
  const form = page.getByTestId("add-scenario");
  await form.getByLabel("Verdict the chamber expects, in words").fill(title);
  await form.getByLabel("Source (the rule, page or precedent)").fill(source);
  for (const p of pending) {
    await page.locator("#sc-add-pending").selectOption({ label: p });
    await form.getByRole("button", { name: "Add to pending" }).click();
  }
  if (speaking) await form.getByLabel("A member has the floor (is speaking)").check();
  await page.locator("#sc-motion").selectOption({ label: motion });
  await page.locator("#sc-expect").selectOption({ label: inOrder ? "in order" : "out of order" });
  await form.getByRole("button", { name: "Add scenario" }).click();
  await page.getByTestId("scenario-message").filter({ hasText: `Scenario “${title}” added.` }).waitFor();
}

describe("the chamber's own rules and the bench of scenarios", () => {
  it("upload, link, coverage, three scenarios, one verdict changes, adoption with a note", async () => {
    await signInAs(page, "clerk");
    // Work on the chamber's latest version (other browser files may have saved versions after the one in force).
    const books = await (await page.request.get(`${BASE_URL}/api/rulebooks`)).json();
    await page.goto(`${BASE_URL}/rulebooks/${books.latest.id}`);
    await page.getByTestId("chamber-text").waitFor();

    // Upload the standing orders (Markdown).
    await page.locator("#chamber-text-file").setInputFiles({ name: "standing-orders.md", mimeType: "text/markdown", buffer: Buffer.from(ORDERS) });
    await page.getByRole("button", { name: "Upload", exact: true }).click();
    await page.getByTestId("chamber-text-message").filter({ hasText: "8 numbered clauses found" }).waitFor();
    await page.getByTestId("chamber-text-summary").filter({ hasText: "Standing Orders of the Harrowmere Assembly" }).waitFor();

    // Link a motion and a rule to their clauses, saved as a new version.
    await choose("link-item", /^Motion: Suspend the rules/);
    await choose("link-clause", "SO 42(1)");
    await page.getByRole("button", { name: "Add link" }).click();
    await choose("link-item", "Rule: The motion does not take precedence of the immediately pending question");
    await choose("link-clause", /^SO 20 — Precedence/);
    await page.getByRole("button", { name: "Add link" }).click();
    expect(await page.getByTestId("pending-links").locator("li").count()).toBe(2);
    await Promise.all([page.waitForURL(/\/rulebooks\/[0-9a-f-]+\?saved=\d+/), page.getByRole("button", { name: "Save these 2 links as a new version" }).click()]);
    const linkedVersion = Number(new URL(page.url()).searchParams.get("saved"));

    // Coverage: the clause no rule cites, and what each link encodes.
    const coverage = page.getByTestId("coverage");
    await coverage.waitFor();
    expect(await page.getByTestId("linked").locator("li").count()).toBe(2);
    await page.getByTestId("linked").getByText("SO 42(1)").waitFor();
    const uncited = await page.getByTestId("uncited-clauses").locator("summary").allInnerTexts();
    expect(uncited.map((t) => t.split(" — ")[0])).toEqual(["SO 42(2)", "SO 50"]);
    await page.getByTestId("items-without-clause").locator("summary").click();
    const uncitingItems = await page.getByTestId("items-without-clause").locator("li").allInnerTexts();
    expect(uncitingItems).toContain("Motion: Amend");
    expect(uncitingItems).not.toContain("Motion: Suspend the rules");
    await shot(page, "rulebook-chamber-text-coverage");

    // Three scenarios with their sources.
    await addScenario("With postpone indefinitely pending, amend is in order", "SO 20", ["Main motion", "Postpone indefinitely"], "Amend", true);
    await addScenario("With nothing pending, a main motion is in order", "SO 11", [], "Main motion", true);
    await addScenario("While a member speaks, adjourn is out of order", "SO 20 and SO 3", ["Main motion"], "Adjourn", false, true);
    await page.getByTestId("bench-summary").filter({ hasText: `3 of 3 scenarios give the expected verdict on version ${linkedVersion}.` }).waitFor();
    await page.getByTestId("no-changed-verdicts").waitFor();

    // Change something: adjourn may now interrupt a speaker. Save as a new version.
    await page.getByRole("button", { name: "Edit Adjourn", exact: true }).first().click();
    await page.getByRole("group", { name: "Characteristics of Adjourn" }).getByLabel("May interrupt a speaker").check();
    await page.getByLabel("Note for this version").fill("Adjourn may interrupt (browser test)");
    await Promise.all([page.waitForURL((u) => u.searchParams.get("saved") === String(linkedVersion + 1)), page.getByRole("button", { name: "Save as new version" }).click()]);
    const changed = page.getByTestId("changed-verdicts");
    await changed.waitFor();
    expect(await changed.innerText()).toContain("One scenario changes verdict against the version in force");
    expect(await changed.innerText()).toContain("“While a member speaks, adjourn is out of order” (SO 20 and SO 3): Adjourn out of order → in order");
    await page.getByTestId("bench-summary").filter({ hasText: `2 of 3 scenarios give the expected verdict on version ${linkedVersion + 1}.` }).waitFor();
    await shot(page, "rulebook-scenarios-changed-verdict");

    // Adoption asks for a note, then adopts with it.
    await page.getByLabel("Adoption note (e.g. the resolution)").fill("");
    await page.getByRole("button", { name: `Adopt version ${linkedVersion + 1}` }).click();
    await page.getByTestId("editor-message").filter({ hasText: "Say in a note why the chamber adopts it" }).waitFor();
    await page.getByLabel("Adoption note (e.g. the resolution)").fill("Resolution 7: adjourn may interrupt a speaker.");
    await page.getByRole("button", { name: `Adopt version ${linkedVersion + 1}` }).click();
    await page.getByTestId("editor-message").filter({ hasText: "now in force" }).waitFor();
    await shot(page, "rulebook-adopted-with-note");

    await page.goto(`${BASE_URL}/rulebooks`);
    await page.getByTestId("in-force").filter({ hasText: `Version ${linkedVersion + 1}:` }).waitFor();

    // Leave the chamber as the other tests expect it: adjourn no longer interrupts (a verdict changes back, so a note again).
    await page.getByTestId("in-force").locator("a").first().click();
    await page.getByRole("button", { name: "Edit Adjourn", exact: true }).first().click();
    await page.getByRole("group", { name: "Characteristics of Adjourn" }).getByLabel("May interrupt a speaker").uncheck();
    await Promise.all([page.waitForURL((u) => u.searchParams.get("saved") === String(linkedVersion + 2)), page.getByRole("button", { name: "Save as new version" }).click()]);
    await page.getByTestId("changed-verdicts").waitFor();
    await page.getByLabel("Adoption note (e.g. the resolution)").fill("Resolution 8: adjourn no longer interrupts.");
    await page.getByRole("button", { name: `Adopt version ${linkedVersion + 2}` }).click();
    await page.getByTestId("editor-message").filter({ hasText: "now in force" }).waitFor();

    // A verdict's citation opens the clause its rule encodes: postpone indefinitely under amend (SO 20).
    await page.goto(`${BASE_URL}/floor/moves`);
    await page.getByTestId("hyp-empty").waitFor();
    for (const m of ["main", "amend"]) {
      await page.getByTestId("hyp-choice").selectOption(m);
      await page.getByRole("button", { name: "Push" }).click();
    }
    const pi = page.getByTestId("legal-moves").locator('li[data-motion="postpone-indefinitely"][data-in-order="no"]');
    await pi.getByTestId("open-clause").click();
    await pi.getByTestId("clause-text").filter({ hasText: "SO 20 — Precedence of motions" }).waitFor();
    expect(await pi.getByTestId("clause-text").innerText()).toContain("no motion shall be received except");
    await shot(page, "floor-verdict-opens-clause");
  });

  it("fits a phone: the chamber's text and the scenarios at 390 px", async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${BASE_URL}/rulebooks`);
    await page.getByTestId("in-force").locator("a").first().click();
    await page.getByTestId("scenarios").waitFor();
    await page.getByTestId("coverage").waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await shot(page, "rulebook-text-scenarios-phone");
  });
});
