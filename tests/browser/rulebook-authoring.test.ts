// Rulebook authoring as a clerk does it, in the browser only: re-rank two motions by keyboard in the
// order of precedence, change a threshold and the filing deadline, add a rule through the guided
// builder and read its sentence, save, and compare the two versions in plain words. The demo
// chamber's order of precedence follows Robert's Rules of Order Revised (1915), Order of Precedence
// of Motions (close debate, i.e. the previous question, ranks below lay on the table); the rest is
// the product's own contract (common practice, no source).
import { describe, expect, it } from "vitest";
import { BASE_URL, pageForFile, shot } from "./browser.ts";

const f = pageForFile();

const placeOf = async (name: string) => {
  const li = f.page.getByTestId("precedence-list").locator("li", { has: f.page.locator(`[data-motion]`, { hasText: name }) }).first();
  return Number(await li.getAttribute("data-place"));
};

describe("rulebook authoring", () => {
  it("a clerk re-ranks by keyboard, changes a threshold and a deadline, adds a rule through the builder, saves and compares in plain words", async () => {
    const page = f.page;
    await f.signInFresh("clerk");
    await page.goto(`${BASE_URL}/rulebooks/new`);
    await page.getByTestId("precedence-list").waitFor();
    await shot(page, "authoring-precedence");

    // Keyboard: focus "move up" on Close debate and press Enter until it is above Lay on the table.
    const before = { close: await placeOf("Close debate"), table: await placeOf("Lay on the table") };
    const up = page.getByRole("button", { name: "Move Close debate up" });
    for (let n = 0; n < 20 && (await placeOf("Close debate")) >= (await placeOf("Lay on the table")); n++) {
      await up.focus();
      await page.keyboard.press("Enter");
      await expect.poll(() => page.getByTestId("order-announce").innerText()).toMatch(/Close debate moved up/);
    }
    expect(await placeOf("Close debate")).toBeLessThan(await placeOf("Lay on the table"));
    expect(before.close === before.table || before.close > before.table || (await placeOf("Close debate")) < before.close).toBe(true);

    // A threshold: the vote limit debate needs.
    await page.getByRole("button", { name: "Edit Limit or extend limits of debate" }).click();
    const vote = page.getByLabel("Vote required for Limit or extend limits of debate");
    const voteWas = await vote.inputValue();
    const voteNow = voteWas === "two-thirds" ? "majority" : "two-thirds";
    await vote.selectOption(voteNow);
    await shot(page, "authoring-characteristics");

    // The filing deadline.
    await page.getByRole("tab", { name: /Amendments, voting/ }).click();
    const deadline = page.getByLabel("Filing deadline (hours before the sitting)");
    const hoursWas = await deadline.inputValue();
    const hoursNow = hoursWas === "24" ? "48" : "24";
    await deadline.fill(hoursNow);

    // A rule through the builder: Take a recess is out of order once debate has begun.
    await page.getByRole("tab", { name: /Rules/ }).click();
    await page.getByRole("button", { name: "+ Add a rule" }).click();
    const rule = page.locator("details[data-rule]").last();
    await rule.getByLabel("Compared with").selectOption({ label: "Take a recess" });
    await rule.getByRole("button", { name: "+ Condition" }).click();
    await rule.getByLabel("What", { exact: true }).nth(1).selectOption({ label: "Whether debate has begun" });
    await rule.getByLabel("Citation (the clause of the chamber's rules)").fill("Harrowmere Standing Orders (fictional) SO 99");
    await rule.getByLabel("Message shown when the rule applies").fill("A recess may not be moved once debate has begun.");
    await expect.poll(() => rule.getByTestId("rule-sentence").innerText()).toBe("Take a recess is out of order when debate has begun.");
    await shot(page, "authoring-rule-builder");

    const note = `Authoring test ${Date.now()}`;
    await page.getByLabel("Note for this version").fill(note);
    await expect.poll(() => page.locator("[data-issue-path]").count()).toBe(0);
    await Promise.all([page.waitForURL(/\/rulebooks\/[0-9a-f-]+\?saved=\d+/), page.getByRole("button", { name: "Save as new version" }).click()]);
    const saved = Number(new URL(page.url()).searchParams.get("saved"));
    await page.getByText(`Saved as version ${saved}.`).waitFor();

    // The comparison page without a choice asks for two versions; the defaults are the last two.
    await page.goto(`${BASE_URL}/rulebooks/compare`);
    await page.getByTestId("choose-versions").waitFor();
    await shot(page, "authoring-compare-choose");
    await Promise.all([page.waitForURL(/compare\?from=.+&to=.+/), page.getByRole("button", { name: "Compare" }).click()]);
    await page.getByTestId("diff").waitFor();
    const changes = await page.getByTestId("plain-change").allInnerTexts();
    const text = changes.join("\n");
    expect(text).toContain(`Filing deadline: ${hoursWas} hours → ${hoursNow} hours`);
    expect(text).toMatch(/SO 64/);
    expect(text).toMatch(/Close debate: .*→ ranks above .*Lay on the table/);
    expect(text).toContain(`Limit or extend limits of debate — vote required: ${voteWas === "two-thirds" ? "two-thirds → a majority" : "a majority → two-thirds"}`);
    expect(text).toContain("Rule added: Take a recess is out of order when debate has begun. (Harrowmere Standing Orders (fictional) SO 99)");
    expect(text).not.toMatch(/[{}]|hoursBefore|filingDeadline/);
    // The file comparison is behind a toggle.
    expect(await page.getByText("filingDeadline").isVisible()).toBe(false);
    await shot(page, "authoring-compare-plain");
  });

  it("a clerk drags a motion above another, and gives two motions equal rank", async () => {
    const page = f.page;
    await page.goto(`${BASE_URL}/rulebooks/new`);
    await page.getByTestId("precedence-list").waitFor();
    const list = page.getByTestId("precedence-list");
    await list.locator('[data-motion="recess"]').dragTo(list.locator('[data-motion="fix-time-to-adjourn"]'));
    await expect.poll(() => placeOf("Take a recess")).toBe(1);
    expect(await placeOf("Fix the time to which to adjourn")).toBe(2);
    // US House Rule XVI cl. 4(c) (paraphrase): equal privilege is one place holding both motions.
    await page.getByRole("button", { name: "Equal with above: Fix the time to which to adjourn takes equal rank with the motion above" }).click();
    await expect.poll(() => placeOf("Fix the time to which to adjourn")).toBe(1);
    expect(await placeOf("Take a recess")).toBe(1);
    expect(await list.locator("li").first().getByText("equal rank").count()).toBe(2);
    await shot(page, "authoring-drag-and-tie");
  });

  it("fits the page at phone width", async () => {
    const page = f.page;
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${BASE_URL}/rulebooks/new`);
    await page.getByTestId("precedence-list").waitFor();
    await page.getByRole("button", { name: "Edit Amend" }).first().click();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await shot(page, "authoring-phone");
    await page.getByRole("tab", { name: /Rules/ }).click();
    await page.locator("details[data-rule] summary").first().click();
    await page.locator("details[data-rule]").first().getByLabel("What", { exact: true }).first().waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await shot(page, "authoring-phone-rules");
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.reload();
    await page.getByTestId("precedence-list").waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
  });
  it("a clerk starts a new version from a template in the library and saves it", async () => {
    // The library offers the shipped templates (README, "Rulebook templates"); the general-law template
    // follows Robert's Rules of Order Revised (1915), whose "Postpone Indefinitely" (§34) is a motion of
    // its catalogue. Saving adds a version; nothing is adopted (common practice, no source: the chamber
    // adopts a rulebook by its own decision).
    const page = f.page;
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.goto(`${BASE_URL}/rulebooks`);
    const versions = page.getByTestId("versions");
    await versions.waitFor();
    // The version to put back at the end, so the other files keep working on the demo's text.
    const rows = await versions.locator("tbody tr").evaluateAll((trs) =>
      trs.map((tr) => ({ n: Number(tr.querySelector("td")?.textContent), href: tr.querySelector("a")?.getAttribute("href") ?? "" })),
    );
    const latest = rows.reduce((a, b) => (b.n > a.n ? b : a));
    const inForceBefore = await versions.getByText("In force").count();

    const entry = page.getByTestId("template").filter({ has: page.locator("span.font-semibold", { hasText: /^General parliamentary law$/ }) });
    await entry.getByTestId("template-source").waitFor();
    await Promise.all([page.waitForURL(/\/rulebooks\/new\?template=/), entry.getByRole("link", { name: "Start from this" }).click()]);
    await page.getByTestId("precedence-list").waitFor();
    await expect.poll(() => page.getByText("New version from the template “General parliamentary law”").count()).toBe(1);
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toBe("General parliamentary law");
    expect(await page.getByTestId("precedence-list").locator("[data-motion]", { hasText: "Postpone indefinitely" }).count()).toBeGreaterThan(0);
    expect(await page.getByLabel("Note for this version").inputValue()).toBe("Started from the template “General parliamentary law”");
    await shot(page, "authoring-from-template");

    await Promise.all([page.waitForURL(/\/rulebooks\/[0-9a-f-]+\?saved=\d+/), page.getByRole("button", { name: "Save as new version" }).click()]);
    const saved = Number(new URL(page.url()).searchParams.get("saved"));
    expect(saved).toBe(latest.n + 1);
    await page.getByText(`Saved as version ${saved}.`).waitFor();

    await page.goto(`${BASE_URL}/rulebooks`);
    const row = versions.locator("tbody tr").filter({ has: page.locator("td", { hasText: new RegExp(`^${saved}$`) }) });
    await expect.poll(() => row.innerText()).toMatch(/General parliamentary law\s*\(from the template “General parliamentary law”\)/);
    // Saving is not adopting: what was in force is still in force, and the new row is not.
    expect(await versions.getByText("In force").count()).toBe(inForceBefore);
    expect(await row.getByText("In force").count()).toBe(0);

    // Put the demo's text back as the latest version (a clerk's own way: "use this text as the next version").
    await page.goto(`${BASE_URL}${latest.href}`);
    await page.getByRole("button", { name: `Use this text as the next version after ${saved}` }).click();
    await page.getByLabel("Note for this version").fill("Back to the chamber's text after trying a template");
    await Promise.all([page.waitForURL(/\/rulebooks\/[0-9a-f-]+\?saved=\d+/), page.getByRole("button", { name: "Save as new version" }).click()]);
    expect(Number(new URL(page.url()).searchParams.get("saved"))).toBe(saved + 1);
  });
});
