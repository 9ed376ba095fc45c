// The journal of a sitting and the chair's script for every branch (issue 19 item 2; issue 15
// item 6), as a clerk uses them: record a sitting's votes, review its journal, approve it with a
// confirmation that names the sitting, download it; open the chair's script, see the words for
// adoption and for rejection on every branch with the sitting and date, print and download it.
// The product's own contract (no outside source).
import { describe, expect, it } from "vitest";
import { readFileSync, writeFileSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { BASE_URL, browserForFile, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();
const unique = Date.now().toString(36);

async function api(page: Page, method: "GET" | "POST", path: string, data?: unknown) {
  const res = await page.request.fetch(`${BASE_URL}${path}`, { method, data, headers: { origin: BASE_URL } });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

async function download(page: Page, link: string): Promise<{ name: string; bytes: Buffer }> {
  const [d] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: link }).click()]);
  const path = await d.path();
  return { name: d.suggestedFilename(), bytes: readFileSync(path!) };
}

describe("the journal of a sitting", () => {
  it("a clerk records a sitting's votes, reviews the journal, approves it and downloads it", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const title = `Journal sitting ${unique}`;
    // The floor record (kept on the floor page; here through the same API the page uses).
    const { id } = await api(page, "POST", "/api/floor/sittings", { title });
    let revision = 0;
    const rec = async (event: unknown) => (revision = (await api(page, "POST", `/api/floor/sittings/${id}/events`, { revision, event })).revision);
    for (const [motion, ref, text, mover] of [["main", "M1", "That the Assembly approve the Quayside Benches scheme", "Ms Arden"], ["amend", "A1", "Insert 'and shelters'", "Mr Bellweather"]]) {
      await rec({ kind: "made", motion, ref, text, mover });
      await rec({ kind: "seconded" });
      await rec({ kind: "stated" });
    }
    await rec({ kind: "voted", result: "rejected", method: "division", tally: { yes: 12, no: 20, abstain: 3 } });

    await page.goto(`${BASE_URL}/floor/${id}`);
    await Promise.all([page.waitForURL(/\/journal$/), page.getByRole("link", { name: "The journal of this sitting" }).click()]);
    await visible(page.getByRole("heading", { name: `Journal of ${title}`, level: 1 }));
    expect(await textOf(page.getByTestId("journal-status"))).toContain("Not yet approved");
    const items = await textOf(page.getByTestId("journal-items"));
    expect(items).toContain("Ms Arden moved: Main motion M1");
    expect(items).toContain("Question 1. The question was put on Amendment A1 to Main motion M1");
    expect(items).toContain("not agreed to on a division, 12 in favour, 20 against, 3 abstaining");
    await shot(page, "journal-draft");

    await page.getByRole("button", { name: "Approve the journal…" }).click();
    expect(await textOf(page.getByTestId("approve-confirm-text"))).toContain(`Approve the journal of ${title} as the record?`);
    await Promise.all([page.waitForEvent("load"), page.getByRole("button", { name: "Approve the journal", exact: true }).click()]);
    expect(await textOf(page.getByTestId("journal-status"))).toMatch(/^Approved .* by /);
    await visible(page.getByRole("heading", { name: "Correct the journal" }));
    await shot(page, "journal-approved");

    const pdf = await download(page, "Download as PDF");
    expect(pdf.name).toMatch(/^journal-journal-sitting-.*\.pdf$/);
    expect(pdf.bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const docx = await download(page, "Download as Word");
    expect(docx.name).toMatch(/\.docx$/);
    expect(docx.bytes.subarray(0, 2).toString()).toBe("PK");

    await page.setViewportSize({ width: 390, height: 844 });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, "journal-approved-phone");
  });
});

const CSV = [
  "member,bloc,weight,ranking",
  "Moorland Union,Moorland Union,14,measure+A1 > measure+A7 > measure+A1+A2 > Q > measure",
  "Harbour Progressives,Harbour Progressives,12,measure+A7 > measure+A1+A2 > measure+A1 > measure > Q",
  "Civic Reform,Civic Reform,9,measure > measure+A1+A2 > Q > measure+A1 > measure+A7",
  "Independents,Independents,5,measure > measure+A1+A2 > measure+A7 > Q > measure+A1",
].join("\n");

describe("the chair's script", () => {
  it("has words for adoption and rejection on every branch, the sitting and date, and prints and downloads", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/orders`);
    await page.getByLabel("Measure").selectOption({ label: "HCA 12 — Harbour Lighting and Quayside Safety Ordinance" });
    for (const a of ["A1", "A2", "A7"]) await page.getByRole("checkbox", { name: new RegExp(`^${a} \\(`) }).check();
    await page.getByLabel("Title of the estimate").fill(`Script count ${unique}`);
    const dir = mkdtempSync(join(tmpdir(), "gw-script-"));
    writeFileSync(join(dir, "count.csv"), CSV);
    await page.getByLabel("CSV file").setInputFiles(join(dir, "count.csv"));
    await page.getByRole("button", { name: "Preview" }).click();
    await Promise.all([page.waitForURL(/\/orders\/[0-9a-f-]{36}$/), page.getByRole("button", { name: "Save estimate" }).click()]);
    await visible(page.getByRole("heading", { name: "Findings" }), 60_000);
    await page.getByRole("button", { name: "Walk through" }).first().click();
    await visible(page.getByRole("heading", { name: /Vote by vote/ }));
    await Promise.all([page.waitForURL(/\/script\?/), page.getByRole("link", { name: "Open the chair's script for this order" }).click()]);
    await visible(page.getByRole("heading", { name: /Chair's script/, level: 1 }));

    await page.getByLabel("Sitting").fill("Sitting of 9 December");
    await page.getByLabel("Date").fill("9 December 2026");
    await Promise.all([page.waitForURL(/sitting=/), page.getByRole("button", { name: "Put on the script" }).click()]);
    expect(await textOf(page.getByTestId("script-occasion"))).toBe("Sitting of 9 December — 9 December 2026");
    const branches = await textOf(page.getByTestId("script-branches"));
    // Both results of the first question are written out, and more steps than the projected path.
    expect(branches).toContain("Step 1. Amendment to the amendment A2");
    expect(branches).toMatch(/If adopted\s*“The ayes have it, and the amendment to the amendment is agreed to\.”/);
    expect(branches).toMatch(/If rejected\s*“The noes have it, and the amendment to the amendment is not agreed to\.”/);
    expect(branches).toMatch(/Reached after step 1 is rejected\./);
    expect(branches).toContain("Ayes ________ Noes ________ Abstaining ________");
    await shot(page, "script-branches");

    await page.evaluate(() => {
      (window as unknown as { printed: boolean }).printed = false;
      window.print = () => ((window as unknown as { printed: boolean }).printed = true);
    });
    await page.getByRole("button", { name: "Print" }).click();
    expect(await page.evaluate(() => (window as unknown as { printed: boolean }).printed)).toBe(true);
    const pdf = await download(page, "Download as PDF");
    expect(pdf.name).toMatch(/^chairs-script-hca-12\.pdf$/);
    expect(pdf.bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const docx = await download(page, "Download as Word");
    expect(docx.bytes.subarray(0, 2).toString()).toBe("PK");
    const md = await download(page, "Download as Markdown");
    expect(md.bytes.toString()).toContain("Sitting of 9 December — 9 December 2026");

    await page.setViewportSize({ width: 390, height: 844 });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, "script-branches-phone");
  });
});
