// Accessibility as a test: axe-core with the WCAG 2.2 AA rule tags on every page of the route
// inventory (tests/access/route-inventory.ts), as each role that may open it, anonymous for the
// public pages, plus the not-found and not-permitted answers. Any violation fails.
// Source: W3C, Web Content Accessibility Guidelines (WCAG) 2.2, level AA, as checked by axe-core 4.14.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { ACCOUNTS, BASE_URL, launch, signInAs } from "./browser.ts";
import { CHAMBER_ROLES } from "../../src/lib/permissions.ts";
import { pageSamples } from "./samples.ts";
import { PAGE_ROUTES, urlOf, type PageRoute, type Samples } from "../access/route-inventory.ts";

const AXE = readFileSync(join(process.cwd(), "node_modules", "axe-core", "axe.min.js"), "utf8");
const TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];

let browser: Awaited<ReturnType<typeof launch>>;
let sql: postgres.Sql;
let samples: Samples;

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL (the app's database) is needed to look up the seeded records");
  sql = postgres(process.env.DATABASE_URL, { max: 2, onnotice: () => {} });
  const clerk = ACCOUNTS.find((a) => a.role === "clerk" && a.chamber === "harrowmere")!;
  const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE_URL }, body: JSON.stringify({ email: clerk.email, password: clerk.password }) });
  if (!r.ok) throw new Error(`sign-in: ${r.status}`);
  ({ samples } = await pageSamples(sql, r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ")));
  // The pages' strict content security policy refuses an injected script; axe is ours, not the page's.
  browser = await launch({ bypassCSP: true });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await sql?.end({ timeout: 1 });
});

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/** Every WCAG 2.2 AA violation axe finds on the page, one line each. */
async function violations(page: Page): Promise<string[]> {
  if (!(await page.evaluate(() => "axe" in window))) await page.addScriptTag({ content: AXE });
  const found = (await page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run(c: Document, o: object): Promise<{ violations: Violation[] }> } }).axe;
    return (await axe.run(document, { runOnly: { type: "tag", values: tags }, resultTypes: ["violations"] })).violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  }, TAGS)) as Violation[];
  return found.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.slice(0, 4).map((n) => n.target.join(" ")).join(", ")}${v.nodes.length > 4 ? ` and ${v.nodes.length - 4} more` : ""}`);
}

async function check(page: Page, path: string, who: string, problems: string[]): Promise<void> {
  await page.goto(`${BASE_URL}${path}`);
  for (const v of await violations(page)) problems.push(`${path} as ${who}: ${v}`);
}

const pagesFor = (role: string): PageRoute[] =>
  PAGE_ROUTES.filter((p) => p.audience === "signed-in" ? true : Array.isArray(p.audience) && (p.audience as readonly string[]).includes(role));

describe("axe-core, WCAG 2.2 AA, on every page of the inventory", () => {
  it("public pages, anonymous, and the not-found page", async () => {
    await browser.context.clearCookies();
    const page = await browser.context.newPage();
    const problems: string[] = [];
    for (const p of PAGE_ROUTES.filter((x) => x.audience === "public")) await check(page, urlOf(p, samples).replace(":id", "00000000-0000-4000-8000-000000000000"), "anonymous", problems);
    await check(page, "/no-such-page", "anonymous", problems);
    await page.close();
    expect(problems).toEqual([]);
  }, 300_000);

  for (const role of CHAMBER_ROLES) {
    it(`every page the ${role} may open, the not-found page and (where refused) the not-permitted page`, async () => {
      await browser.context.clearCookies();
      const page = await browser.context.newPage();
      await signInAs(page, role);
      const problems: string[] = [];
      const pages = pagesFor(role);
      expect(pages.length).toBeGreaterThan(15);
      for (const p of pages) {
        if (p.devOnly && role !== "chief-clerk") continue;
        await check(page, urlOf(p, samples), role, problems);
      }
      await check(page, "/measures/no-such-measure", role, problems);
      if (!pagesFor(role).some((p) => p.path === "/rulings/new")) await check(page, "/rulings/new", role, problems);
      await page.close();
      expect(problems).toEqual([]);
    }, 600_000);
  }
});
