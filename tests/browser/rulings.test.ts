// Browser: a clerk records and issues a ruling, a staff member circulates it to a list, the
// messages arrive at the local mail catcher (/dev/mail), and a search finds the ruling.
// Product contract (common practice, no source).
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { BASE_URL, pageForFile, shot } from "./browser.ts";

const shared = pageForFile();
let page: Page;
const stamp = Date.now().toString(36);
const marker = `quillmark${stamp}`;
const target = `Motion to refer the Quayside Bins Order (${stamp})`;
const citation = `Standing Order 44(${stamp})`;
let rulingUrl = "";
let rulingNumber = "";
let unsubscribeLink = "";

beforeAll(() => {
  page = shared.page;
});
const switchTo = (role: string) => shared.signInFresh(role);

describe("rulings in the browser", () => {
  it("a clerk records a ruling as a draft and issues it", async () => {
    await switchTo("clerk");
    await page.goto(`${BASE_URL}/rulings`);
    await page.getByRole("link", { name: "Record a ruling" }).click();
    await page.waitForURL(/\/rulings\/new$/);
    const raisedBy = page.getByLabel("Raised by");
    await expect.poll(async () => raisedBy.locator("option").count()).toBeGreaterThan(1);
    await raisedBy.selectOption({ index: 3 });
    await page.getByLabel("What it was raised against").fill(target);
    // Motions and rules are offered by their names and citations, never by the rulebook's ids.
    await page.getByLabel("Motion concerned (optional)").selectOption({ label: "Refer to a standing committee" });
    const ruleChoices = (await page.getByLabel(/^Rule of /).locator("option").allInnerTexts()).slice(1);
    expect(ruleChoices.length).toBeGreaterThan(5);
    for (const text of ruleChoices) expect(text).not.toMatch(/^[a-z0-9]+(?:-[a-z0-9]+)+\b/);
    await page.getByLabel("Question put to the chair").fill("Is a motion to refer in order while the previous question is pending?");
    await page.getByLabel("Point of order sustained").check();
    await page.getByLabel("Reasoning").fill(`The previous question outranks the motion to commit; while it is pending, a motion to refer cannot be made. The ${marker} test phrase marks this ruling.`);
    await page.getByLabel("Or a citation as printed").fill(citation);
    await page.getByRole("button", { name: "Add rule citation" }).click();
    await page.getByLabel("The decision was appealed").check();
    await page.getByLabel("To sustain the chair").fill("17");
    await page.getByLabel("Against", { exact: true }).fill("17");
    await expect.poll(() => page.getByText("a tie sustains the chair").count()).toBe(1);
    await page.getByLabel("Sitting", { exact: true }).fill("Demo sitting");
    await shot(page, "rulings-1-draft-form");
    await page.getByRole("button", { name: "Save draft" }).click();
    await page.waitForURL(/\/rulings\/[0-9a-f-]{36}$/);
    rulingUrl = page.url();
    await expect.poll(() => page.getByText("Draft", { exact: true }).count()).toBeGreaterThan(0);
    await page.getByRole("button", { name: "Issue ruling" }).click();
    // Issuing is final: the dialog names the ruling and says so before anything happens.
    const dialog = page.getByTestId("ruling-confirm");
    await expect.poll(() => dialog.getByRole("heading", { name: /^Issue Ruling \d+\?$/ }).count()).toBe(1);
    expect(await dialog.innerText()).toContain("cannot be undone");
    await dialog.getByRole("button", { name: "Issue it" }).click();
    await expect.poll(() => page.getByText(/is issued\./).count()).toBe(1);
    const h1 = (await page.locator("h1").textContent()) ?? "";
    rulingNumber = /Ruling (\d+)/.exec(h1)?.[1] ?? "";
    expect(rulingNumber).not.toBe("");
    await expect.poll(() => page.getByText("Revision 1").count()).toBe(1);
    // The motion concerned reads as the chamber's rulebook names it, not as its id ("commit").
    expect(await page.locator("dd", { hasText: "Refer to a standing committee" }).count()).toBe(1);
    expect(await page.locator("dd .gw-chip").allInnerTexts()).not.toContain("commit");
    await shot(page, "rulings-2-issued");
  });

  it("a staff member circulates it to a list and sees per-recipient delivery", async () => {
    await switchTo("staff");
    await page.goto(rulingUrl);
    expect(await page.getByRole("button", { name: "Issue ruling" }).count()).toBe(0);
    const list = page.getByLabel("Distribution list");
    await expect.poll(async () => list.locator("option").count()).toBeGreaterThan(1);
    await list.selectOption({ label: await list.locator("option", { hasText: "Press gallery" }).first().innerText() });
    await page.getByRole("button", { name: "Send by e-mail" }).click();
    await expect.poll(() => page.getByText(/Queued \d+ messages?/).count()).toBe(1);
    const table = page.getByTestId("delivery").first();
    await expect.poll(async () => (await table.innerText()).match(/Delivered to mail server/g)?.length ?? 0, { timeout: 30_000 }).toBeGreaterThanOrEqual(2);
    expect(await table.innerText()).not.toMatch(/Queued|Failed/);
    await shot(page, "rulings-3-circulated");
    await page.goto(`${BASE_URL}/circulation`);
    await expect.poll(() => page.getByText(`Ruling ${rulingNumber} —`, { exact: false }).count()).toBeGreaterThan(0);
    await shot(page, "rulings-4-circulation-desk");
  });

  it("the messages appear in the local mail catcher", async () => {
    await switchTo("chief-clerk");
    await page.goto(`${BASE_URL}/dev/mail`);
    const caught = page.getByTestId("caught");
    const subject = `Ruling ${rulingNumber} — ${target}`;
    await expect.poll(async () => caught.locator("li", { hasText: subject }).count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(2);
    const first = caught.locator("li", { hasText: subject }).first();
    await first.locator("summary").click();
    expect(await first.innerText()).toContain(marker);
    await shot(page, "rulings-5-caught-mail");
    unsubscribeLink = /(http\S+\/unsubscribe\?token=\S+)/.exec(await first.locator("pre").innerText())?.[1] ?? "";
    expect(unsubscribeLink).not.toBe("");
  });

  it("a recipient unsubscribes through the signed link, without signing in", async () => {
    await page.context().clearCookies();
    await page.goto(unsubscribeLink);
    expect(await page.getByText("Press gallery").count()).toBeGreaterThan(0);
    await page.getByRole("button", { name: "Unsubscribe" }).click();
    await expect.poll(() => page.getByText("You are unsubscribed.").count()).toBe(1);
    await shot(page, "rulings-7-unsubscribed");
  });

  it("a later search finds it by a word of its reasoning and by its citation", async () => {
    await switchTo("member");
    await page.goto(`${BASE_URL}/rulings`);
    await page.getByLabel("Search rulings").fill(marker);
    await page.getByRole("button", { name: "Search", exact: true }).click();
    const results = page.getByTestId("results");
    await expect.poll(async () => results.locator("li").count()).toBe(1);
    expect(await results.innerText()).toContain(target);
    await shot(page, "rulings-6-search");
    await page.getByLabel("Search rulings").fill(`"${citation}"`);
    await page.getByRole("button", { name: "Search", exact: true }).click();
    await expect.poll(async () => (await results.innerText()).includes(target)).toBe(true);
    await results.getByRole("link", { name: new RegExp(`Ruling ${rulingNumber}:`) }).click();
    await page.waitForURL(rulingUrl);
    expect(await page.getByText("a tie sustains the chair").count()).toBeGreaterThan(0);
    expect(await page.getByRole("heading", { name: "Circulate" }).count()).toBe(0);
  });

  it("a clerk corrects the issued ruling as a new revision, keeping the history", async () => {
    await switchTo("clerk");
    await page.goto(rulingUrl);
    await page.getByRole("button", { name: "Record a correction" }).click();
    await page.getByLabel("What does this correction change?").fill("Names the standing order in the reasoning");
    const reasoning = page.getByLabel("Reasoning");
    await reasoning.fill(`${await reasoning.inputValue()} See ${citation}.`);
    await page.getByRole("button", { name: "Issue correction" }).click();
    await expect.poll(() => page.getByText("Correction issued as a new revision.").count()).toBe(1);
    const history = page.getByRole("region", { name: "History" });
    await expect.poll(async () => (await history.innerText()).includes("Revision 2")).toBe(true);
    expect(await history.innerText()).toContain("Revision 1");
    await history.getByText("Text of revision 1").click();
    await shot(page, "rulings-8-revision");
  });
});
