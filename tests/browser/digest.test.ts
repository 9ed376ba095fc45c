// Browser: staff send the floor-day digest from the circulation page to the clerks' list (or to
// another list of the chamber they choose), see what was queued and each recipient's delivery,
// and the chief clerk finds it in the caught mail.
// Product contract (common practice, no source).
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { BASE_URL, account, fitsPhone, pageForFile, shot } from "./browser.ts";

const shared = pageForFile();
let page: Page;
const stamp = Date.now().toString(36);
const sitting = `Digest sitting ${stamp}`;
const readersSitting = `Readers' sitting ${stamp}`;
const readersList = `Digest readers ${stamp}`;
const readersAddress = `readers-${stamp}@harrowmere.example.org`;

beforeAll(() => {
  page = shared.page;
});
const switchTo = (role: string) => shared.signInFresh(role);

describe("floor-day digest in the browser", () => {
  it("staff send the digest for a sitting and day and see each recipient's delivery", async () => {
    await switchTo("staff");
    await page.goto(`${BASE_URL}/circulation`);
    const form = page.getByRole("form", { name: "Floor-day digest" });
    await expect.poll(() => form.getByTestId("digest-destination").innerText(), { timeout: 10_000 }).toMatch(/clerks' list, Clerks' desk \(\d+ recipients\)/);
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
    await expect.poll(() => page.getByRole("region", { name: "Sent" }).getByText(`floor-day digest — ${sitting}, 14 May 2026`).count()).toBe(1);
    await shot(page, "digest-2-sent");

    // Sending the same sitting's digest to the same list again asks first; cancelling sends nothing.
    const sentRows = () => page.getByRole("region", { name: "Sent" }).getByText(`floor-day digest — ${sitting}, 14 May 2026`).count();
    await form.getByRole("button", { name: "Send the digest" }).click();
    const dialog = page.getByTestId("digest-repeat");
    await expect.poll(() => dialog.getByRole("heading", { name: "Send the digest again?" }).count()).toBe(1);
    expect(await dialog.innerText()).toContain(`The digest for ${sitting} already went to “Clerks' desk”`);
    expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    await shot(page, "digest-2c-repeat");
    await fitsPhone(page, dialog, "digest-2c-repeat");
    await dialog.getByRole("button", { name: "Cancel" }).click();
    expect(await sentRows()).toBe(1);
    await form.getByRole("button", { name: "Send the digest" }).click();
    await dialog.getByRole("button", { name: "Send it again" }).click();
    await expect.poll(sentRows).toBe(2);
  });

  it("staff may choose another list of the chamber instead, and only that list is sent the digest", async () => {
    const made = await page.evaluate(
      async ([name, email]) => (await fetch("/api/circulation/lists", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ name, entries: [{ kind: "address", email, name: "Digest readers" }] }) })).status,
      [readersList, readersAddress],
    );
    expect(made).toBe(201);
    await page.goto(`${BASE_URL}/circulation`);
    const form = page.getByRole("form", { name: "Floor-day digest" });
    const sendTo = form.getByLabel("Send to");
    // The clerks' list stays the default choice.
    await expect.poll(() => sendTo.locator("option").allInnerTexts(), { timeout: 10_000 }).toContain(`${readersList} (1 recipient)`);
    expect(await sendTo.locator("option:checked").innerText()).toBe("The clerks' list (Clerks' desk)");
    await sendTo.selectOption({ label: `${readersList} (1 recipient)` });
    expect(await form.getByTestId("digest-destination").innerText()).toBe(`Goes to the list ${readersList} (1 recipient).`);
    await form.getByLabel("Sitting", { exact: true }).selectOption({ label: "Another sitting…" });
    await form.getByLabel("Sitting name").fill(readersSitting);
    await form.getByLabel("Day").fill("2026-05-15");
    await shot(page, "digest-2b-chosen-list");
    await form.getByRole("button", { name: "Send the digest" }).click();
    await expect.poll(() => form.getByRole("status").count()).toBe(1);
    expect(await form.getByRole("status").innerText()).toBe(`Queued 1 message to ${readersList}.`);
    const table = form.getByTestId("digest-delivery");
    await expect.poll(async () => (await table.innerText().catch(() => "")).match(/Delivered to mail server/g)?.length ?? 0, { timeout: 30_000 }).toBe(1);
    expect(await table.innerText()).toContain(readersAddress);
    await shot(page, "digest-2c-chosen-list-sent");
  });

  it("the clerks receive it: the chief clerk finds it in the caught mail with the findings and order", async () => {
    await switchTo("chief-clerk");
    await page.goto(`${BASE_URL}/dev/mail`);
    const caught = page.getByTestId("caught");
    const mine = caught.locator("li", { hasText: `${sitting}, 14 May 2026` });
    await expect.poll(async () => mine.count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(2);
    await mine.first().locator("summary").click();
    const body = await mine.first().locator("pre").innerText();
    expect(body).toContain("Out of order Amendment 4: A third-degree amendment is out of order.");
    expect(body).toContain("2. Amendment 1 as amended — if Amendment 2 is adopted");
    await shot(page, "digest-3-caught");
    // The digest sent to the chosen list reached its one address, not the clerks.
    const readers = caught.locator("li", { hasText: `${readersSitting}, 15 May 2026` });
    await expect.poll(async () => readers.count(), { timeout: 20_000 }).toBe(1);
    expect(await readers.innerText()).toContain(readersAddress);
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
