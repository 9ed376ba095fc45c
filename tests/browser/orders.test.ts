// A clerk builds an estimate from an uploaded CSV, sees the order analysis of HCA 12, picks an order
// and opens (and prints) the chair's script; a member's private estimate stays private; the spatial
// view shows the status quo's win set. The product's own contract (no outside source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BrowserContext } from "playwright-core";
import { BASE_URL, launch, shot, signInAs, textOf, visible } from "./browser.ts";

let browser: Awaited<ReturnType<typeof launch>>;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function freshPage(context: BrowserContext) {
  await context.clearCookies();
  return context.newPage();
}

const unique = Date.now().toString(36);
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
  await visible(page.getByText("measure+A1+A2", { exact: true }));
}

describe("voting orders", () => {
  it("a clerk uploads a CSV estimate, sees the analysis, picks an order and prints the chair's script", async () => {
    const page = await freshPage(browser.context);
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
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    expect(await textOf(page.getByText(/The order of questions decides the outcome/))).toBeTruthy();
    await visible(page.getByText(/projections from an estimate/).first());
    expect(await textOf(page.getByText(/Legal orders of questions: 3/))).toBeTruthy();
    await shot(page, "orders-analysis");
    await page.getByRole("button", { name: "Walk through" }).first().click();
    await visible(page.getByRole("heading", { name: /Vote by vote/ }));
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

  it("a member's private estimate is not visible to the clerk", async () => {
    const page = await freshPage(browser.context);
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
    const other = await freshPage(browser.context);
    await signInAs(other, "clerk");
    await other.goto(`${BASE_URL}/orders`);
    await visible(other.getByRole("heading", { name: "Estimates you can see" }));
    expect(await other.getByText(title).count()).toBe(0);
    const res = await other.goto(url);
    expect(res?.status()).toBe(404);
  });

  it("the spatial view shows the status quo's win set and moves a bloc with the keyboard", async () => {
    const page = await freshPage(browser.context);
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByRole("link", { name: "Lighting and cost: where the blocs stand" }).click();
    await visible(page.getByRole("heading", { name: "Where members stand" }));
    const win = page.getByTestId("win-set");
    expect(await win.locator("circle").count()).toBeGreaterThan(0);
    expect(await textOf(page.getByText(/Win set of Q: union of/))).toBeTruthy();
    await shot(page, "orders-spatial");
    const bloc = page.getByRole("button", { name: /^Moorland Union: 14 votes at \(2, 3\)/ });
    await bloc.focus();
    await page.keyboard.press("ArrowRight");
    await visible(page.getByRole("button", { name: /^Moorland Union: 14 votes at \(2.5, 3\)/ }));
    await visible(page.getByRole("button", { name: "Save these positions as a new version" }));
    await shot(page, "orders-spatial-moved");
  });
});
