// Clerks' rulebook pages in the browser: edit a motion in the catalogue, see a validation
// error at its exact field, save a new version, adopt it; a member reads without editing.
// The product's own contract (common practice, no source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { BASE_URL, launch, shot, signInAs } from "./browser.ts";

let browser: { context: BrowserContext; close(): Promise<void> };
let page: Page;

beforeAll(async () => {
  browser = await launch();
  page = await browser.context.newPage();
});
afterAll(async () => {
  await browser.close();
});

describe("rulebook pages", () => {
  it("a clerk edits a motion in the catalogue, saves a new version and adopts it", async () => {
    await signInAs(page, "clerk");
    const before = (await (await page.request.get(`${BASE_URL}/api/rulebooks`)).json()) as { inForce: { versionId: string } };
    await page.goto(`${BASE_URL}/rulebooks`);
    await page.getByTestId("in-force").waitFor();
    await shot(page, "rulebooks-library-clerk");

    await page.goto(`${BASE_URL}/rulebooks/new`);
    await page.getByRole("button", { name: "Edit Limit or extend limits of debate" }).click();
    const vote = page.getByLabel("Vote required for Limit or extend limits of debate");
    await vote.waitFor();
    const was = await vote.inputValue();
    const now = was === "two-thirds" ? "majority" : "two-thirds";
    await vote.selectOption(now);

    // A rule with an unknown operator is flagged at its exact field and blocks saving.
    await page.getByRole("tab", { name: /Rules/ }).click();
    await page.locator("details[data-rule] summary").first().click();
    await page.locator("details[data-rule]").first().getByLabel("Show the names used in the file").check();
    const op = page.locator("#f-rules_0_conditions_all_0_operator");
    const opWas = await op.inputValue();
    await op.fill("sortOf");
    await expect.poll(() => page.locator('[data-issue-path="rules.0.conditions.all.0.operator"]').count()).toBe(1);
    expect(await page.getByRole("button", { name: "Save as new version" }).isDisabled()).toBe(true);
    await shot(page, "rulebooks-editor-error-at-field");
    await op.fill(opWas);
    await expect.poll(() => page.locator("[data-issue-path]").count()).toBe(0);

    const note = `Limit debate by ${now} (${Date.now()})`;
    await page.getByLabel("Note for this version").fill(note);
    await Promise.all([page.waitForURL(/\/rulebooks\/[0-9a-f-]+\?saved=\d+/), page.getByRole("button", { name: "Save as new version" }).click()]);
    const saved = Number(new URL(page.url()).searchParams.get("saved"));
    await page.getByText(`Saved as version ${saved}.`).waitFor();
    await page.getByRole("button", { name: "Edit Limit or extend limits of debate" }).click();
    expect(await page.getByLabel("Vote required for Limit or extend limits of debate").inputValue()).toBe(now);

    await page.getByLabel("Adoption note (e.g. the resolution)").fill("Adopted by resolution, browser test");
    await page.getByRole("button", { name: `Adopt version ${saved}` }).click();
    await page.getByTestId("editor-message").filter({ hasText: "now in force" }).waitFor();
    await shot(page, "rulebooks-editor-adopted");

    await page.goto(`${BASE_URL}/rulebooks`);
    await page.getByTestId("in-force").filter({ hasText: `Version ${saved}:` }).waitFor();
    expect(await page.getByTestId("versions").getByText(note).count()).toBe(1);

    // Leave the chamber under the rules it had, for the other browser files: adopt the earlier version again.
    const back = await page.request.post(`${BASE_URL}/api/rulebooks/${before.inForce.versionId}/adopt`, { data: { note: "Browser test: the earlier version again" }, headers: { origin: BASE_URL } });
    expect(back.status()).toBe(201);
    expect(((await back.json()) as { inForce: boolean }).inForce).toBe(true);
  });

  it("a member reads the rulebook in force without edit or adopt controls", async () => {
    const ctx = await launch();
    try {
      const p = await ctx.context.newPage();
      await signInAs(p, "member");
      await p.goto(`${BASE_URL}/rulebooks`);
      await p.getByTestId("in-force").locator("a").click();
      await p.getByRole("button", { name: "Details Limit or extend limits of debate" }).click();
      expect(await p.getByLabel("Vote required for Limit or extend limits of debate").isDisabled()).toBe(true);
      expect(await p.getByRole("button", { name: /^Move / }).count()).toBe(0);
      expect(await p.getByRole("button", { name: "Save as new version" }).count()).toBe(0);
      expect(await p.getByRole("button", { name: /Adopt version/ }).count()).toBe(0);
      await shot(p, "rulebooks-member-read-only");
    } finally {
      await ctx.close();
    }
  });
});
