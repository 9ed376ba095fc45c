// The app on a phone (390 px wide, touch): every page of the route inventory fits the screen
// (no sideways scrolling), the navigation folds behind a Menu button that opens and closes
// (aria-expanded, Escape, focus), and the sponsor picker works by touch. The product's own
// contract (issue 15, item 9); WCAG 2.2 SC 1.4.10 Reflow (content usable at 320 CSS px without
// scrolling in two dimensions) is the principle behind the width check.
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { BASE_URL, account, pickSponsors, shot, signIn, visible, waitForIslandsOnNavigation } from "./browser.ts";
import { pageSamples } from "./samples.ts";
import { PAGE_ROUTES, urlOf, type Samples } from "../access/route-inventory.ts";

let browser: Browser;
let context: BrowserContext;
let page: Page;
let sql: postgres.Sql;
let samples: Samples;

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL (the app's database) is needed to look up the seeded records");
  sql = postgres(process.env.DATABASE_URL, { max: 2, onnotice: () => {} });
  browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", headless: true, args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"] });
  context = await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 });
  page = waitForIslandsOnNavigation(await context.newPage());
  const clerk = account("clerk");
  await signIn(page, clerk.email, clerk.password);
  const cookie = (await context.cookies()).map((c) => `${c.name}=${c.value}`).join("; ");
  samples = (await pageSamples(sql, cookie)).samples;
}, 120_000);

afterAll(async () => {
  await sql?.end({ timeout: 1 });
  await browser?.close();
});

async function open(path: string) {
  await page.goto(`${BASE_URL}${path}`);
}

// Measured against the 390 px the context sets, not window.innerWidth: a mobile browser widens its
// layout viewport (innerWidth) to take in a page that overflows, which would hide the overflow.
const widths = async () => ({ ...(await page.evaluate(() => ({ doc: document.documentElement.scrollWidth, body: document.body.scrollWidth }))), viewport: page.viewportSize()!.width });

describe("on a phone (390 px)", () => {
  it("no page of the route inventory is wider than the screen, as the clerk", async () => {
    const pages = PAGE_ROUTES.filter((p) => !p.devOnly && (p.audience === "public" || p.audience === "signed-in" || p.audience.includes("clerk")) && !["/sign-in", "/sign-up", "/forgot-password", "/reset-password", "/unsubscribe", "/invitations/:id"].includes(p.path));
    expect(pages.length).toBeGreaterThan(15);
    const wide: string[] = [];
    for (const p of pages) {
      const path = urlOf(p, samples);
      await open(path);
      const w = await widths();
      if (w.doc > w.viewport || w.body > w.viewport) {
        wide.push(`${p.path}: ${w.doc} px wide`);
        await shot(page, `phone-too-wide-${p.file.replace(/[^a-z0-9]+/gi, "-")}`);
      }
    }
    // Every estimate of the chamber too (ballots and spatial pages differ), beyond the inventory's one sample.
    const all = await sql`SELECT e.id, e.title FROM estimates e JOIN organization o ON o.id = e.chamber_id WHERE o.slug LIKE 'harrowmere%' AND e.kind = 'spatial' ORDER BY e.created_at LIMIT 3`;
    expect(all.length).toBeGreaterThan(0);
    for (const e of all) {
      await open(`/orders/${e.id}`);
      const w = await widths();
      if (w.doc > w.viewport) wide.push(`estimate “${e.title}”: ${w.doc} px wide`);
    }
    expect(wide).toEqual([]);
    await open("/");
    await shot(page, "phone-desk");
  }, 240_000);

  it("the Menu button opens and closes the navigation (aria-expanded, Escape, focus)", async () => {
    await open("/");
    const menu = page.getByRole("button", { name: "Menu" });
    const nav = page.getByRole("navigation", { name: "Areas" });
    expect(await menu.getAttribute("aria-expanded")).toBe("false");
    expect(await nav.isVisible()).toBe(false);
    // Closed, the header takes a small part of the first screen.
    const header = await page.locator("header").boundingBox();
    expect(header!.height).toBeLessThan(120);
    await menu.tap();
    await visible(nav);
    expect(await menu.getAttribute("aria-expanded")).toBe("true");
    await expect.poll(() => page.evaluate(() => document.activeElement?.textContent?.trim())).toBe("Desk");
    await shot(page, "phone-menu-open");
    await page.keyboard.press("Escape");
    await expect.poll(() => nav.isVisible()).toBe(false);
    expect(await menu.getAttribute("aria-expanded")).toBe("false");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("gw-menu-button");
    // Open again and follow a link: the next page starts folded.
    await menu.tap();
    await Promise.all([page.waitForURL(/\/measures$/), nav.getByRole("link", { name: "Measures & trees" }).tap()]);
    expect(await page.getByRole("button", { name: "Menu" }).getAttribute("aria-expanded")).toBe("false");
    expect(await page.getByRole("navigation", { name: "Areas" }).isVisible()).toBe(false);
    // The Menu button closes it too.
    await page.getByRole("button", { name: "Menu" }).tap();
    await visible(page.getByRole("navigation", { name: "Areas" }));
    await page.getByRole("button", { name: "Menu" }).tap();
    await expect.poll(() => page.getByRole("navigation", { name: "Areas" }).isVisible()).toBe(false);
  });

  it("the sponsor picker works by touch: type to filter, tap to add, tap a chip's button to remove", async () => {
    const [m] = await sql`SELECT m.id FROM measures m JOIN organization o ON o.id = m.chamber_id WHERE o.slug LIKE 'harrowmere%' AND m.number = 'HCA 12'`;
    await open(`/measures/${m.id}`);
    const form = page.getByTestId("file-amendment");
    await form.getByRole("combobox", { name: "Sponsors" }).scrollIntoViewIfNeeded();
    const chips = form.getByTestId("sponsor-chips").locator("input[name=sponsors]");
    const before = await chips.count();
    const [first, second] = await pickSponsors(form, [0, 2], "tap");
    expect(await chips.count()).toBe(before + 2);
    const chosen = await form.getByTestId("sponsor-chips").innerText();
    expect(chosen).toContain(first);
    expect(chosen).toContain(second);
    // Filtering: a name that is on no roster offers nothing.
    await form.getByRole("combobox", { name: "Sponsors" }).fill("Zzqx");
    expect(await form.getByRole("listbox", { name: "Legislators" }).getByRole("option").count()).toBe(0);
    await visible(form.getByText("No legislator on the roster matches “Zzqx”."));
    await form.getByRole("combobox", { name: "Sponsors" }).fill("");
    await shot(page, "phone-sponsor-picker");
    const name = first.replace(/\s*\([^)]*\)$/, "");
    await form.getByRole("button", { name: `Remove ${name}`, exact: true }).first().tap();
    expect(await chips.count()).toBe(before + 1);
    expect(await form.getByTestId("sponsor-chips").innerText()).not.toContain(first);
    // Keyboard: arrows and Enter add the highlighted name without sending the form.
    const search = form.getByRole("combobox", { name: "Sponsors" });
    await search.focus();
    await search.fill(name);
    await page.keyboard.press("Enter");
    expect(await chips.count()).toBe(before + 2);
    expect(page.url()).toContain(`/measures/${m.id}`);
    const w = await widths();
    expect(w.doc).toBeLessThanOrEqual(w.viewport);
  });
});
