// Access to pages over HTTP against the running app: for every page of the route inventory
// (tests/access/route-inventory.ts), anonymous visitors are sent to sign-in, roles not allowed
// are refused (403/404 or sent elsewhere), the other chamber's chief clerk is refused Harrowmere's
// records and sees none of them anywhere; HTML and script typed into text fields are shown as
// text; the content security policy lets every island run (no CSP errors in the console); cookies
// are HttpOnly and SameSite; the security headers are on every page.
// Common practice (OWASP: access control, XSS prevention, secure headers), no source.
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { ACCOUNTS, BASE_URL, launch, shot } from "./browser.ts";
import { apiAs, pageSamples } from "./samples.ts";
import { PAGE_ROUTES, refusedRoles, urlOf, type PageRoute, type Samples } from "../access/route-inventory.ts";

const XSS = `<script>alert("gw")</script><img src=x onerror="alert(1)">`;
const stamp = Date.now().toString(36);
let sql: postgres.Sql;
const cookies: Record<string, string> = {};
let samples: Samples;
let markers: string[];
let xssMeasure = "";
let xssRuling = "";

async function signIn(email: string, password: string): Promise<{ cookie: string; setCookie: string[] }> {
  const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE_URL }, body: JSON.stringify({ email, password }) });
  if (!r.ok) throw new Error(`sign-in ${email}: ${r.status}`);
  const setCookie = r.headers.getSetCookie();
  return { cookie: setCookie.map((c) => c.split(";")[0]).join("; "), setCookie };
}

const api = apiAs;

const get = (path: string, cookie?: string) => fetch(`${BASE_URL}${path}`, { headers: cookie ? { cookie } : {}, redirect: "manual" });

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL (the app's database) is needed to look up the seeded records");
  sql = postgres(process.env.DATABASE_URL, { max: 2, onnotice: () => {} });
  for (const a of ACCOUNTS) cookies[a.chamber === "harrowmere" ? a.role : `outsider-${a.role}`] = (await signIn(a.email, a.password)).cookie;
  samples = await pageSamples(sql, cookies.clerk);
  const [h] = await sql`SELECT id FROM organization WHERE slug LIKE 'harrowmere%'`;
  const rows = await sql`
    SELECT id::text AS v FROM measures WHERE chamber_id = ${h.id}
    UNION SELECT id::text FROM rulings WHERE chamber_id = ${h.id}
    UNION SELECT id::text FROM estimates WHERE chamber_id = ${h.id}
    UNION SELECT id::text FROM rulebook_versions WHERE chamber_id = ${h.id}
    UNION SELECT id::text FROM sittings WHERE chamber_id = ${h.id}
    UNION SELECT id::text FROM legislators WHERE chamber_id = ${h.id}
    UNION SELECT u.email FROM "user" u JOIN member m ON m.user_id = u.id WHERE m.organization_id = ${h.id} AND u.email LIKE '%harrowmere%'`;
  markers = rows.map((r) => String(r.v));

  const m = await api("/api/measures", cookies.clerk, { number: `XSS ${stamp}`, title: XSS, committee: XSS, sections: [{ heading: XSS, text: XSS }] });
  xssMeasure = m.id;
  await api(`/api/measures/${m.id}/amendments`, cookies.member, { form: "insert", target: "measure", title: XSS, text: XSS });
  const [legislator] = await sql`SELECT id FROM legislators WHERE chamber_id = ${h.id} ORDER BY name LIMIT 1`;
  const r = await api("/api/rulings", cookies.clerk, {
    raisedById: legislator.id,
    target: { kind: "motion", ref: "previous-question", label: XSS },
    motion: "previous-question",
    question: XSS,
    decision: "not-sustained",
    reasoning: XSS,
    citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }],
    sitting: XSS,
    sittingDate: "2026-04-02",
  });
  xssRuling = r.id;
}, 120_000);

afterAll(async () => {
  await sql?.end({ timeout: 1 });
});

const isRefusal = (res: Response, path: string) => {
  if ([401, 403, 404].includes(res.status)) return true;
  const to = res.headers.get("location");
  return res.status >= 300 && res.status < 400 && !!to && new URL(to, BASE_URL).pathname !== path.replace(/\?.*$/, "");
};

const label = (p: PageRoute) => p.path;
const noMarkers = (html: string, what: string) => {
  for (const m of markers) expect(html.includes(m), `${what} shows Harrowmere's ${m}`).toBe(false);
};

describe("page access", () => {
  it("allowed roles see every page (200), so the samples are real", async () => {
    for (const p of PAGE_ROUTES.filter((x) => Array.isArray(x.audience) && x.file !== "dev/mail.astro")) {
      for (const role of p.audience as readonly string[]) {
        const res = await get(urlOf(p, samples), cookies[role]);
        expect(res.status, `${label(p)} as ${role}`).toBe(200);
      }
    }
  });

  it("anonymous visitors are sent to sign-in from every page that needs one", async () => {
    for (const p of PAGE_ROUTES.filter((x) => x.audience !== "public")) {
      const res = await get(urlOf(p, samples));
      expect([302, 303, 307], label(p)).toContain(res.status);
      expect(new URL(res.headers.get("location")!, BASE_URL).pathname, label(p)).toBe("/sign-in");
    }
  });

  it("roles the inventory does not allow are refused or sent elsewhere", async () => {
    let checked = 0;
    for (const p of PAGE_ROUTES) {
      for (const role of refusedRoles(p.audience)) {
        const path = urlOf(p, samples);
        const res = await get(path, cookies[role]);
        expect(isRefusal(res, path), `${label(p)} as ${role}: ${res.status}`).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(8);
  });

  it("the other chamber's chief clerk is refused Harrowmere's records and sees none of them on any page", async () => {
    for (const p of PAGE_ROUTES.filter((x) => x.audience !== "public" || x.path === "/sign-in")) {
      const path = urlOf(p, samples);
      const res = await get(path, cookies["outsider-chief-clerk"]);
      const html = await res.text();
      if (p.outsider === "refused") expect(isRefusal(res, path), `${label(p)}: ${res.status}`).toBe(true);
      else expect(res.status, label(p)).toBeLessThan(500);
      if (!p.devOnly) noMarkers(html, label(p));
    }
  });
});

describe("hardening in the browser", () => {
  it("HTML and script typed into text fields are shown as text on the pages", async () => {
    for (const path of [`/measures/${xssMeasure}`, `/measures/${xssMeasure}/print`, `/measures/${xssMeasure}/tree`, "/measures", `/rulings/${xssRuling}`]) {
      const html = await (await get(path, cookies.clerk)).text();
      expect(html, path).not.toContain(`<script>alert("gw")`);
      expect(html, path).not.toMatch(/<img src=x onerror/);
      expect(html, path).toMatch(/&lt;script&gt;|\\u003cscript|&amp;lt;script/);
    }
  });

  it("every island runs under the content security policy: no CSP errors, no script from a text field runs", async () => {
    const browser = await launch();
    try {
      const page: Page = await browser.context.newPage();
      const problems: string[] = [];
      page.on("console", (m) => {
        if (/content security policy|refused to (execute|load|apply|connect)/i.test(m.text())) problems.push(`${page.url()}: ${m.text()}`);
      });
      page.on("pageerror", (e) => problems.push(`${page.url()}: ${e.message}`));
      page.on("dialog", (d) => {
        problems.push(`dialog on ${page.url()}: ${d.message()}`);
        void d.dismiss();
      });
      const clerk = ACCOUNTS.find((a) => a.role === "clerk" && a.chamber === "harrowmere")!;
      await page.goto(`${BASE_URL}/sign-in`);
      await page.getByLabel("E-mail").fill(clerk.email);
      await page.getByLabel("Password").fill(clerk.password);
      await Promise.all([page.waitForURL((u) => !u.pathname.startsWith("/sign-in")), page.getByRole("button", { name: "Sign in" }).click()]);
      const pages = ["/", "/measures", `/measures/${samples.measure}`, `/measures/${samples.measure}/tree`, `/measures/${xssMeasure}`, `/measures/${xssMeasure}/tree`, "/rulebooks", `/rulebooks/${samples.rulebookVersion}`, "/floor", `/floor/${samples.sitting}`, "/floor/moves", "/orders", `/orders/${samples.estimate}`, "/rulings", `/rulings/${xssRuling}`, "/circulation", "/people"];
      for (const path of pages) {
        await page.goto(`${BASE_URL}${path}`);
        await page.waitForLoadState("networkidle");
        // Islands hydrate: astro-island elements lose their ssr attribute once they have run.
        await expect.poll(() => page.locator("astro-island[ssr]").count(), { timeout: 15_000, message: `islands on ${path}` }).toBe(0);
      }
      await page.goto(`${BASE_URL}/measures/${xssMeasure}`);
      await shot(page, "access-xss-measure");
      expect(await page.evaluate(() => document.querySelectorAll("img[src='x']").length)).toBe(0);
      expect(problems).toEqual([]);
    } finally {
      await browser.close();
    }
  });

  it("sign-in cookies are HttpOnly and SameSite; pages carry the security headers", async () => {
    const a = ACCOUNTS.find((x) => x.role === "observer")!;
    const { setCookie } = await signIn(a.email, a.password);
    const session = setCookie.find((c) => /session_token=/.test(c));
    expect(session).toBeTruthy();
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=(Lax|Strict)/i);
    for (const path of ["/sign-in", "/measures"]) {
      const res = await get(path, cookies.observer);
      expect(res.headers.get("content-security-policy"), path).toMatch(/frame-ancestors 'none'/);
      expect(res.headers.get("content-security-policy"), path).toMatch(/object-src 'none'/);
      expect(res.headers.get("x-content-type-options"), path).toBe("nosniff");
      expect(res.headers.get("x-frame-options"), path).toBe("DENY");
    }
  });
});
