// Focus moves to the message after every action a person takes, so a keyboard or screen-reader
// user lands on what happened: a refused sign-in, a filing, a recorded vote, a walk-through of an
// order. Source: W3C, WCAG 2.2, success criteria 3.3.1 (Error Identification) and 4.1.3 (Status
// Messages); moving focus to the result is common practice for form results, no single source.
import { describe, expect, it } from "vitest";
import postgres from "postgres";
import type { Page } from "playwright-core";
import { BASE_URL, account, browserForFile, signInAs, textOf } from "./browser.ts";

const browser = browserForFile();

/** The focused element's role and text, once focus has landed on an element matching `selector`. */
async function focusedOn(page: Page, selector: string): Promise<{ role: string | null; text: string }> {
  await page.waitForFunction((s) => document.activeElement?.matches(s) === true, selector, { timeout: 15_000 });
  return page.evaluate(() => ({ role: document.activeElement!.getAttribute("role"), text: (document.activeElement as HTMLElement).innerText.trim() }));
}

async function api(page: Page, method: "GET" | "POST", path: string, data?: unknown) {
  const res = await page.request.fetch(`${BASE_URL}${path}`, { method, data, headers: { origin: BASE_URL } });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

describe("focus follows the message", () => {
  it("a refused sign-in: focus is on the message saying why", async () => {
    const page = await browser.freshPage();
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel("E-mail").fill(account("clerk").email);
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    const f = await focusedOn(page, "[role=alert]");
    expect(f.text).toContain("do not match");
    await page.close();
  });

  it("filing an amendment: focus is on the confirmation naming it", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const number = `HCA F${Date.now() % 1_000_000}`;
    const m = await api(page, "POST", "/api/measures", { number, title: "Focus test ordinance", subjects: ["lighting"], text: "## Section 1\nSubjects: lighting\nLine one.\nLine two." });
    await page.context().clearCookies();
    await signInAs(page, "member");
    await page.goto(`${BASE_URL}/measures/${m.id}`);
    const form = page.getByTestId("file-amendment");
    await form.getByLabel("Form").selectOption("insert");
    await form.getByLabel("Short title").fill("Focus on the receipt");
    await form.getByLabel("Text of the amendment").fill("Each lamp shall be inspected yearly.");
    await form.getByLabel("Subject tags").fill("lighting");
    // Filing reloads the page to list the new row; the confirmation is focused once it has.
    const reloaded = page.waitForEvent("load");
    await form.getByRole("button", { name: "File amendment" }).click();
    await reloaded;
    const f = await focusedOn(page, "[data-testid=file-amendment] [aria-label='Filing confirmation']");
    expect(f.text).toMatch(/Filed as Amendment A\d+/);
    await page.close();
  });

  it("recording a vote: focus is on the notice of what was recorded", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/floor`);
    const title = `Focus sitting ${Date.now()}`;
    await page.getByLabel("Open a new sitting").fill(title);
    await page.getByRole("button", { name: "Open sitting" }).click();
    await page.getByTestId("sitting-select").locator("option", { hasText: title }).waitFor({ state: "attached" });
    const sittingId = await page.getByTestId("sitting-select").inputValue();
    await page.getByTestId("stack-empty").waitFor();
    for (const event of [{ kind: "made", motion: "main", ref: "M1", text: "That the Assembly approve the focus scheme" }, { kind: "seconded" }, { kind: "stated" }]) {
      const s = await api(page, "GET", `/api/floor/sittings/${sittingId}`);
      await api(page, "POST", `/api/floor/sittings/${sittingId}/events`, { revision: s.sitting.revision, event });
    }
    await page.getByTestId("vote-question").filter({ hasText: "M1" }).waitFor({ timeout: 20_000 });
    const form = page.getByRole("form", { name: /Vote on/ });
    await form.getByRole("radio", { name: "Adopted" }).check();
    await form.getByRole("radio", { name: "Division (counted)" }).check();
    await form.getByLabel("Ayes").fill("21");
    await form.getByLabel("Noes").fill("9");
    await form.getByRole("button", { name: "Record the vote…" }).click();
    // The confirmation takes the focus first, then the notice once recorded.
    expect((await focusedOn(page, "[data-testid=vote-confirm]")).text).toContain("Record:");
    await page.getByRole("button", { name: "Yes, record it" }).click();
    const f = await focusedOn(page, "[data-testid=record-notice]");
    expect(f.text).toContain("Recorded: Voted");
    expect(f.role).toBe("status");
    await page.close();
  });

  it("walking through an order: focus is on the walk-through's heading", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
    const [e] = await sql`SELECT e.id FROM estimates e JOIN organization o ON o.id = e.chamber_id WHERE o.slug LIKE 'harrowmere%' AND e.kind = 'ballots' ORDER BY e.created_at LIMIT 1`.finally(() => sql.end());
    await page.goto(`${BASE_URL}/orders/${e.id}`);
    const walk = page.getByRole("button", { name: "Walk through" }).first();
    await walk.waitFor({ timeout: 60_000 });
    await walk.click();
    const f = await focusedOn(page, "#walk-h");
    expect(f.text).toMatch(/^Vote by vote: /);
    expect(await textOf(page.locator("#walk-through"))).toContain("Projected outcome");
    await page.close();
  });
});
