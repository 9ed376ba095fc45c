// Browser: staff send the floor-day digest from the circulation page to the clerks' list, see
// what was queued and each recipient's delivery, and the chief clerk finds it in the caught mail.
// Product contract (common practice, no source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { BASE_URL, account, launch, shot, signInAs } from "./browser.ts";

let browser: Awaited<ReturnType<typeof launch>>;
let context: BrowserContext;
let page: Page;
const stamp = Date.now().toString(36);
const sitting = `Digest sitting ${stamp}`;

beforeAll(async () => {
  browser = await launch();
  context = browser.context;
  page = await context.newPage();
});
afterAll(async () => {
  await browser?.close();
});

async function switchTo(role: string) {
  await context.clearCookies();
  await signInAs(page, role);
}

describe("floor-day digest in the browser", () => {
  it("staff send the digest for a sitting and day and see each recipient's delivery", async () => {
    await switchTo("staff");
    await page.goto(`${BASE_URL}/circulation`);
    const form = page.getByRole("form", { name: "Floor-day digest" });
    await expect.poll(() => form.getByTestId("digest-destination").innerText()).toMatch(/clerks' list, Clerks' desk \(\d+ recipients\)/);
    // A sitting recorded on the floor is offered first, its day filled in; another is typed by name.
    const pick = form.getByLabel("Sitting", { exact: true });
    await expect.poll(() => pick.locator("option").count()).toBeGreaterThan(1);
    expect(await pick.locator("option:checked").innerText()).not.toBe("Another sitting…");
    expect(await form.getByLabel("Day").inputValue()).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(await form.getByLabel("Sitting name").count()).toBe(0);
    await pick.selectOption({ label: "Another sitting…" });
    await form.getByLabel("Sitting name").fill(sitting);
    await form.getByLabel("Day").fill("2026-05-14");
    await form.getByLabel("Measure (optional)").fill("HCA 12 — Quayside Bins Order");
    await form.getByRole("button", { name: "Add a finding" }).click();
    await form.getByLabel("Finding 1: about").fill("Amendment 4");
    await form.getByLabel("Finding 1: what").fill("A third-degree amendment is out of order.");
    await form.getByLabel("Proposed order of questions").fill("Amendment 2 to Amendment 1\nAmendment 1 as amended — if Amendment 2 is adopted\nPassage");
    await shot(page, "digest-1-form");
    await form.getByRole("button", { name: "Send the digest" }).click();
    await expect.poll(() => form.getByRole("status").count()).toBe(1);
    expect(await form.getByRole("status").innerText()).toMatch(/^Queued [2-9]\d* messages to Clerks' desk/);
    const table = form.getByTestId("digest-delivery");
    await expect.poll(async () => (await table.innerText().catch(() => "")).match(/Delivered to mail server/g)?.length ?? 0, { timeout: 30_000 }).toBeGreaterThanOrEqual(2);
    const text = await table.innerText();
    expect(text).not.toMatch(/Queued|Failed/);
    expect(text).toContain(account("chief-clerk").email);
    expect(text).toContain(account("clerk").email);
    // The sending is listed under "Sent" with its delivery counts.
    await expect.poll(() => page.getByRole("region", { name: "Sent" }).getByText(`floor-day digest — ${sitting}, 2026-05-14`).count()).toBe(1);
    await shot(page, "digest-2-sent");
  });

  it("the clerks receive it: the chief clerk finds it in the caught mail with the findings and order", async () => {
    await switchTo("chief-clerk");
    await page.goto(`${BASE_URL}/dev/mail`);
    const caught = page.getByTestId("caught");
    const mine = caught.locator("li", { hasText: `${sitting}, 2026-05-14` });
    await expect.poll(async () => mine.count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(2);
    await mine.first().locator("summary").click();
    const body = await mine.first().locator("pre").innerText();
    expect(body).toContain("Out of order Amendment 4: A third-degree amendment is out of order.");
    expect(body).toContain("2. Amendment 1 as amended — if Amendment 2 is adopted");
    await shot(page, "digest-3-caught");
  });

  it("a member neither sees the control nor may send", async () => {
    await switchTo("member");
    const res = await page.goto(`${BASE_URL}/circulation`);
    expect(res?.status()).toBe(403);
    expect(await page.getByRole("form", { name: "Floor-day digest" }).count()).toBe(0);
    const post = await page.evaluate(async () => (await fetch("/api/circulation/digest", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ sitting: "x", date: "2026-05-14" }) })).status);
    expect(post).toBe(403);
  });
});
