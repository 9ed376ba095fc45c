// Screens use the clerk's words (issue 15 item 7): on every page of the route inventory a clerk
// may open, and on the analysis page with a walk-through open, the visible text holds no UUID, no
// ISO 8601 timestamp, no ambiguous numeric date, no known slug of the product's own vocabulary and
// no version code such as "measure+A1". The product's own contract (no outside source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import postgres from "postgres";
import type { Page } from "playwright-core";
import { ACCOUNTS, BASE_URL, browserForFile, signInAs } from "./browser.ts";
import { pageSamples } from "./samples.ts";
import { PAGE_ROUTES, urlOf, type Samples } from "../access/route-inventory.ts";
import { MEASURE_STATUSES } from "../../src/lib/measures/measure-schemas.ts";
import { CHAMBER_ROLES } from "../../src/lib/permissions.ts";

const browser = browserForFile();
let sql: postgres.Sql;
let samples: Samples;

/** Slugs of our own vocabulary that have words of their own on a screen. */
const SLUGS = [...new Set([...MEASURE_STATUSES.filter((s) => s.includes("-")), ...CHAMBER_ROLES.filter((r) => r.includes("-")), "strike-and-insert", "in-nature-of-substitute", "ruled-out", "not-germane", "conflicts-with", "not-sustained"])];

const CHECKS: Array<[string, RegExp]> = [
  ["a UUID", /\b[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\b/i],
  ["an ISO timestamp", /\b\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/],
  ["an ambiguous numeric date", /\b\d{1,2}\/\d{1,2}\/\d{4}\b/],
  ["a version code", /\b[\w-]+\+A\d+/],
  ["a draft's internal key", /\bD-[0-9a-f]{8}\b/],
  ...SLUGS.map((s): [string, RegExp] => [`the slug “${s}”`, new RegExp(`(^|[^\\w-])${s}($|[^\\w-])`)]),
];

/** What the page shows that breaks the clerk's words, one line each. */
async function developerWords(page: Page, where: string): Promise<string[]> {
  const text = await page.evaluate(() => document.body.innerText);
  const out: string[] = [];
  for (const [what, re] of CHECKS) {
    const m = re.exec(text);
    if (m) out.push(`${where} shows ${what}: “…${text.slice(Math.max(0, m.index - 40), m.index + m[0].length + 20).replace(/\s+/g, " ")}…”`);
  }
  return out;
}

beforeAll(async () => {
  sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
  const clerk = ACCOUNTS.find((a) => a.role === "clerk" && a.chamber === "harrowmere")!;
  const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE_URL }, body: JSON.stringify({ email: clerk.email, password: clerk.password }) });
  ({ samples } = await pageSamples(sql, r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ")));
}, 120_000);
afterAll(async () => {
  await sql?.end({ timeout: 1 });
});

describe("the clerk's words on every page", () => {
  it("no UUID, ISO timestamp, numeric date, slug or version code on any page a clerk opens", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const problems: string[] = [];
    const pages = PAGE_ROUTES.filter((p) => p.audience === "signed-in" || (Array.isArray(p.audience) && (p.audience as readonly string[]).includes("clerk")));
    expect(pages.length).toBeGreaterThan(15);
    for (const p of pages) {
      const path = urlOf(p, samples);
      await page.goto(`${BASE_URL}${path}`);
      if (p.file === "orders/[id].astro") await page.getByRole("heading", { name: "The legal orders" }).waitFor({ timeout: 60_000 });
      // The measure's History, with every change opened (before and after).
      if (p.file === "measures/[id]/index.astro") await page.locator("[data-testid=audit-table] details").evaluateAll((ds) => ds.forEach((d) => ((d as HTMLDetailsElement).open = true)));
      problems.push(...(await developerWords(page, path)));
    }
    // The analysis page with an order walked through, and a page that is not found.
    await page.goto(`${BASE_URL}/orders/${samples.estimate}`);
    await page.getByRole("button", { name: "Walk through" }).first().click();
    await page.locator("#walk-through").waitFor();
    problems.push(...(await developerWords(page, "the walk-through")));
    await page.goto(`${BASE_URL}/measures/${samples.estimate}`);
    problems.push(...(await developerWords(page, "a measure that does not exist")));
    await page.close();
    expect(problems).toEqual([]);
  }, 600_000);

  it("a measure with drafts names them as people read them on its page, tree and printout", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const post = async (path: string, data: unknown) => {
      const res = await page.request.post(`${BASE_URL}${path}`, { data, headers: { origin: BASE_URL } });
      expect(res.status(), `${path}: ${await res.text()}`).toBeLessThan(300);
      return res.json();
    };
    const m = await post("/api/measures", { number: `HCR W ${Date.now() % 1_000_000}`, title: "Quay words", subjects: ["harbour"], text: "## Section 1 — Lamps\nEvery quay shall be lit.\n## Section 2 — Dues\nHarbour dues pay for it." });
    for (const [target, title] of [["s1", "Brighter lamps"], ["s2", "Lower dues"]]) await post(`/api/measures/${m.id}/amendments`, { draft: true, form: "insert", target, title, text: "Insert: at night.", subjects: ["harbour"], sponsors: [] });
    const problems: string[] = [];
    for (const path of [`/measures/${m.id}`, `/measures/${m.id}/tree`, `/measures/${m.id}/print`]) {
      await page.goto(`${BASE_URL}${path}`);
      const text = await page.evaluate(() => document.body.innerText);
      expect(text, path).toContain("Draft-1");
      expect(text, path).toContain("Draft-2");
      problems.push(...(await developerWords(page, path)));
    }
    await page.close();
    expect(problems).toEqual([]);
  });

  it("the checks catch what they look for", async () => {
    const page = await browser.freshPage();
    await page.setContent(`<body><p>Status: on-floor, version measure+A1+A2, filed 2026-12-04T15:30:00Z by 1b4e28ba-2fa1-11d2-883f-0016d3cca427 on 12/11/2026, draft D-4d7cf41c</p></body>`);
    const found = await developerWords(page, "sample");
    expect(found.map((f) => f.split(":")[0])).toEqual(["sample shows a UUID", "sample shows an ISO timestamp", "sample shows an ambiguous numeric date", "sample shows a version code", "sample shows a draft's internal key", "sample shows the slug “on-floor”"]);
    await page.close();
  });
});
