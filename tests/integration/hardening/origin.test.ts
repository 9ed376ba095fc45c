// Issue 17, item 6: every state-changing API route refuses a cross-site request in the middleware,
// before any work is done; the probe found JSON routes relying on the browser's preflight alone.
// (OWASP Cross-Site Request Forgery Prevention Cheat Sheet, "Verifying Origin with standard
// headers" and "Fetch Metadata headers", paraphrase.) The middleware is run as Astro runs it,
// with `next` standing for the route: a refused request never reaches it.
import type { APIContext } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { onRequest } from "../../../src/middleware.ts";
import { crossSiteRefusal } from "../../../src/lib/server/origin-check.ts";
import { BASE } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let seeded: Seeded;
beforeAll(async () => {
  seeded = await seedChambers();
});

/** Run the middleware for one request; whether the route behind it ran, and the answer. */
async function through(method: string, path: string, headers: Record<string, string>): Promise<{ reached: boolean; status: number; body: any }> {
  const url = new URL(path, BASE);
  const request = new Request(url, { method, headers: { cookie: seeded.as["clerk"].cookie, "content-type": "application/json", ...headers }, body: method === "GET" ? undefined : "{}" });
  let reached = false;
  const ctx = { request, url, locals: {}, params: {}, redirect: () => new Response(null, { status: 302 }) } as unknown as APIContext;
  const res = (await onRequest(ctx, async () => {
    reached = true;
    return new Response("{}", { status: 200, headers: { "content-type": "application/json" } });
  })) as Response;
  const text = await res.text();
  return { reached, status: res.status, body: text ? JSON.parse(text) : null };
}

describe("cross-site writes are refused before the route runs", () => {
  for (const method of ["POST", "PUT", "PATCH", "DELETE"]) {
    it(`${method} from another origin: 403 forbidden`, async () => {
      const r = await through(method, "/api/measures", { origin: "https://evil.example" });
      expect(r).toMatchObject({ reached: false, status: 403, body: { error: { code: "forbidden" } } });
    });
  }

  it("a null origin, a look-alike origin and a cross-site fetch without Origin are refused too", async () => {
    const cases: Array<Record<string, string>> = [{ origin: "null" }, { origin: `${BASE}.evil.example` }, { origin: BASE.replace("http:", "https:") }, { "sec-fetch-site": "cross-site" }, { "sec-fetch-site": "same-site" }];
    for (const headers of cases)
      expect(await through("POST", "/api/moves", headers)).toMatchObject({ reached: false, status: 403 });
  });

  it("the app's own pages, tools without Origin, and reads go through", async () => {
    expect((await through("POST", "/api/moves", { origin: BASE, "sec-fetch-site": "same-origin" })).reached).toBe(true);
    expect((await through("POST", "/api/moves", {})).reached).toBe(true);
    expect((await through("GET", "/api/measures", { origin: "https://evil.example" })).reached).toBe(true);
  });

  it("the refusal carries the security headers", async () => {
    const url = new URL("/api/measures", BASE);
    const request = new Request(url, { method: "POST", headers: { origin: "https://evil.example" }, body: "{}" });
    const res = (await onRequest({ request, url, locals: {}, params: {} } as unknown as APIContext, async () => new Response("{}"))) as Response;
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("crossSiteRefusal: only writes to the API are checked", () => {
    const post = (path: string) => new Request(new URL(path, BASE), { method: "POST", headers: { origin: "https://evil.example" } });
    expect(crossSiteRefusal(post("/api/rulings"), "/api/rulings", [BASE])?.code).toBe("forbidden");
    expect(crossSiteRefusal(post("/sign-in"), "/sign-in", [BASE])).toBeNull();
  });
});
