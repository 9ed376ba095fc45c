// Shared helpers for browser tests: Debian's Chromium driven by playwright-core.
import { afterAll, beforeAll, expect } from "vitest";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { mkdtempSync, rmSync, mkdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import demoAccounts from "../../src/lib/server/seed/demo-accounts.json";

export const BASE_URL = process.env.GAVELWRIGHT_TEST_URL ?? "http://127.0.0.1:4399";
export const SHOTS = join(process.cwd(), "test-results", "screenshots");
export const ACCOUNTS = demoAccounts;

/** `bypassCSP`: let a test inject a script of its own (axe-core) into pages served under the strict policy. */
export async function launch(options: { bypassCSP?: boolean } = {}): Promise<{ context: BrowserContext; close(): Promise<void> }> {
  mkdirSync(SHOTS, { recursive: true });
  const profile = mkdtempSync(join(tmpdir(), "gw-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    viewport: { width: 1360, height: 900 },
    bypassCSP: options.bypassCSP ?? false,
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"],
  });
  context.on("page", waitForIslandsOnNavigation);
  const newPage = context.newPage.bind(context);
  context.newPage = async () => waitForIslandsOnNavigation(await newPage());
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Resolves once every Astro island on the page has hydrated (Astro removes the `ssr` attribute
 * from an island when its component has mounted). Before that, a click on a React form button
 * does a plain form submission and a filled field is reset by hydration.
 */
export async function islandsReady(page: Page, timeout = 30_000): Promise<void> {
  await page.waitForFunction(() => document.querySelector("astro-island[ssr]") === null, undefined, { timeout });
}

const patched = new WeakSet<Page>();
/** Make `goto`, `reload`, `goBack` and `waitForURL` also wait for the page's islands to hydrate. */
export function waitForIslandsOnNavigation(page: Page): Page {
  if (patched.has(page)) return page;
  patched.add(page);
  for (const name of ["goto", "reload", "goBack", "waitForURL"] as const) {
    const original = (page[name] as (...a: unknown[]) => Promise<unknown>).bind(page);
    (page as unknown as Record<string, unknown>)[name] = async (...args: unknown[]) => {
      const result = await original(...args);
      await islandsReady(page);
      return result;
    };
  }
  return page;
}

export function account(role: string, chamber = "harrowmere") {
  const a = ACCOUNTS.find((x) => x.role === role && x.chamber === chamber);
  if (!a) throw new Error(`no demo account for ${role} in ${chamber}`);
  return a;
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await Promise.all([page.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 20_000 }), page.getByRole("button", { name: "Sign in" }).click()]);
}

export async function signInAs(page: Page, role: string, chamber = "harrowmere"): Promise<void> {
  const a = account(role, chamber);
  await signIn(page, a.email, a.password);
}

export async function shot(page: Page, name: string): Promise<string> {
  const path = join(SHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/**
 * At phone width (390 × 844): `locator` is visible and fits across the screen, a screenshot
 * `<name>-phone` is taken, and the page goes back to the desktop width it opened at.
 */
export async function fitsPhone(page: Page, locator: import("playwright-core").Locator, name: string): Promise<void> {
  await page.setViewportSize({ width: 390, height: 844 });
  try {
    await visible(locator);
    const box = await locator.first().boundingBox();
    expect(box, `${name}: shown at phone width`).not.toBeNull();
    expect(box!.x, `${name}: starts on screen`).toBeGreaterThanOrEqual(0);
    expect(box!.x + box!.width, `${name}: fits the phone's 390 px`).toBeLessThanOrEqual(390);
    await shot(page, `${name}-phone`);
  } finally {
    await page.setViewportSize({ width: 1360, height: 900 });
  }
}

/** The text of the first element matching `locator`, once it is visible. */
export async function textOf(locator: import("playwright-core").Locator, timeout = 15_000): Promise<string> {
  await locator.first().waitFor({ state: "visible", timeout });
  return (await locator.first().innerText()).trim();
}

/** Wait until `locator` is visible (fails the test on timeout). */
export async function visible(locator: import("playwright-core").Locator, timeout = 15_000): Promise<void> {
  await locator.first().waitFor({ state: "visible", timeout });
}

/**
 * One browser for a whole test file: launched before its tests, closed after. `freshPage` forgets
 * the previous person (cookies) and opens a new page.
 */
export function browserForFile(): { readonly context: BrowserContext; freshPage(): Promise<Page> } {
  let browser: Awaited<ReturnType<typeof launch>> | undefined;
  beforeAll(async () => {
    browser = await launch();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return {
    get context() {
      return browser!.context;
    },
    async freshPage() {
      await browser!.context.clearCookies();
      return browser!.context.newPage();
    },
  };
}

/**
 * One browser page for a whole test file. `signInFresh` forgets the previous person (cookies)
 * and signs in as `role`.
 */
export function pageForFile(): { readonly page: Page; signInFresh(role: string): Promise<void> } {
  const b = browserForFile();
  let page: Page;
  beforeAll(async () => {
    page = await b.freshPage();
  });
  return {
    get page() {
      return page;
    },
    async signInFresh(role: string) {
      await page.context().clearCookies();
      await signInAs(page, role);
    },
  };
}

/**
 * Add sponsors with the sponsor picker inside `scope`, as a clerk does: open the search, read the
 * roster entry at each position of the list offered, type part of that name to filter, then choose
 * it. `how` is "click" (mouse) or "tap" (touch; the page's context needs hasTouch). Returns the
 * names added, as the list shows them ("Name (Bloc)").
 */
export async function pickSponsors(scope: import("playwright-core").Locator | Page, positions: number[], how: "click" | "tap" = "click"): Promise<string[]> {
  const search = scope.getByRole("combobox", { name: "Sponsors" });
  const list = scope.getByRole("listbox", { name: "Legislators" });
  const added: string[] = [];
  for (const i of positions) {
    await search.fill("");
    await search.click();
    const entry = (await list.getByRole("option").nth(i).innerText()).trim();
    const name = entry.replace(/\s*\([^)]*\)$/, "");
    await search.fill(name);
    const option = list.getByRole("option", { name: entry, exact: true }).first();
    await (how === "tap" ? option.tap() : option.click());
    await visible(scope.getByRole("button", { name: `Remove ${name}`, exact: true }));
    added.push(entry);
  }
  return added;
}
