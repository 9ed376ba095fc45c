// Access, route by route (API, in-process): every role the inventory does not allow, anonymous,
// and the other chamber's chief clerk are refused (401, 403 or 404) and change nothing; answers
// to the other chamber carry no Harrowmere record. Allowed roles reading get 200, so the sample
// records are real. Common practice (least privilege, tenant isolation), no source.
import type { APIRoute } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { call, type Session } from "../support/app.ts";
import { tableCounts } from "../support/db.ts";
import type { Seeded } from "../support/fixtures.ts";
import { API_ROUTES, outsiderStatuses, refusedRoles, urlOf, type ApiRoute, type Samples } from "./route-inventory.ts";
import { harrowmereMarkers, seedSamples } from "./samples.ts";
import { sql } from "../../src/lib/server/db.ts";
import { CHAMBER_ROLES, can, type ChamberRole } from "../../src/lib/permissions.ts";
import { DEMO_ACCOUNTS } from "../../src/lib/server/seed/demo-data.ts";

let s: Seeded;
let samples: Samples;
let markers: string[];

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
  markers = await harrowmereMarkers(s.chambers.harrowmere);
}, 120_000);

const modules = new Map<string, Record<string, APIRoute>>();
async function handlerOf(r: ApiRoute): Promise<APIRoute> {
  if (!modules.has(r.file)) modules.set(r.file, await import(/* @vite-ignore */ `../../src/pages/${r.file}`));
  const h = modules.get(r.file)![r.method];
  if (!h) throw new Error(`${r.file} exports no ${r.method}`);
  return h;
}

async function send(r: ApiRoute, as: Session | null) {
  const url = new URL(urlOf(r, samples), "http://127.0.0.1");
  const params = Object.fromEntries(Object.entries(r.params ?? {}).map(([k, key]) => [k, samples[key!]]));
  const raw = r.raw?.(samples);
  return call(await handlerOf(r), r.method, url.pathname + url.search, {
    as,
    params,
    query: Object.fromEntries(url.searchParams),
    ...(raw ? { rawBody: raw.body, headers: { "content-type": raw.contentType } } : r.body ? { body: r.body(samples) } : {}),
  });
}

const guarded = API_ROUTES.filter((r) => r.audience !== "public");
const label = (r: ApiRoute) => `${r.method} ${r.path}`;

describe("the inventory's samples are real", () => {
  it("every allowed role reads every GET route (200)", async () => {
    for (const r of guarded.filter((x) => x.method === "GET" && !x.stream && !x.starterOnly && x.file !== "api/dev/mail.ts")) {
      for (const role of r.audience as readonly string[]) {
        const res = await send(r, s.as[role as keyof Seeded["as"]]);
        expect(res.status, `${label(r)} as ${role}: ${JSON.stringify(res.body).slice(0, 200)}`).toBe(200);
      }
    }
  });
});

describe("refusals", () => {
  it("anonymous: 401 on every route that needs a sign-in, and nothing changes", async () => {
    const before = await tableCounts();
    for (const r of guarded) {
      const res = await send(r, null);
      expect(res.status, label(r)).toBe(401);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("every role the inventory does not allow: 403 (or 404), and nothing changes", async () => {
    const before = await tableCounts();
    let checked = 0;
    for (const r of guarded) {
      for (const role of refusedRoles(r.audience)) {
        const res = await send(r, s.as[role]);
        expect([403, 404], `${label(r)} as ${role}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`).toContain(res.status);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(60);
    expect(await tableCounts()).toEqual(before);
  });

  it("the other chamber's chief clerk: refused wherever a Harrowmere record is named, and nothing changes", async () => {
    const before = await tableCounts();
    for (const r of guarded.filter((x) => x.outsider === "refused")) {
      const res = await send(r, s.outsider);
      expect(outsiderStatuses(r), `${label(r)}: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`).toContain(res.status);
      const text = JSON.stringify(res.body);
      for (const m of markers) expect(text.includes(m), `${label(r)} leaks ${m}`).toBe(false);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("the other chamber's chief clerk reading its own chamber's lists sees no Harrowmere record", async () => {
    for (const r of guarded.filter((x) => x.outsider === "own-chamber" && x.method === "GET")) {
      const res = await send(r, s.outsider);
      expect(res.status, label(r)).toBeLessThan(500);
      const text = typeof res.body === "string" ? res.body : JSON.stringify(res.body);
      for (const m of markers) expect(text.includes(m), `${label(r)} leaks ${m}`).toBe(false);
    }
  });
});

// Colleagues' e-mail addresses go only to roles holding "people:see-email" (chief clerk and
// clerks). Every GET route a role may read is asked, and no colleague's address may appear in
// the answer (one's own may). Distribution and delivery are the circulation desk's own work
// (staff send to those addresses), so the circulation routes and a ruling's `circulations` (the
// deliveries, given only to roles holding "circulation:send") are left out. Common practice
// (data minimisation), no source.
describe("e-mail addresses of people", () => {
  async function addresses(): Promise<string[]> {
    const rows = await sql.unsafe(`SELECT u.email AS v FROM "user" u JOIN member m ON m.user_id = u.id WHERE m.organization_id = $1`, [s.chambers.harrowmere]);
    return rows.map((r) => String(r.v).toLowerCase());
  }
  const own = (role: ChamberRole) => DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === role)!.email.toLowerCase();
  const readable = guarded.filter((r) => r.method === "GET" && !r.stream && !r.starterOnly && r.file !== "api/dev/mail.ts" && !r.file.startsWith("api/circulation/"));

  it("members, staff and observers receive no colleague's address from any route they may read", async () => {
    const all = await addresses();
    expect(all.length).toBeGreaterThan(4);
    let asked = 0;
    for (const role of CHAMBER_ROLES.filter((r) => !can(r, "people:see-email"))) {
      const others = all.filter((e) => e !== own(role));
      for (const r of readable.filter((x) => x.audience === "signed-in" || (Array.isArray(x.audience) && x.audience.includes(role)))) {
        const res = await send(r, s.as[role]);
        const body = can(role, "circulation:send") && res.body && typeof res.body === "object" && "circulations" in res.body ? { ...res.body, circulations: [] } : res.body;
        const text = (typeof body === "string" ? body : JSON.stringify(body)).toLowerCase();
        for (const e of others) expect(text.includes(e), `${label(r)} as ${role} gives ${e}`).toBe(false);
        asked++;
      }
    }
    expect(asked).toBeGreaterThan(30);
  });

  it("the chief clerk and clerks see every colleague's address in the people list", async () => {
    const all = await addresses();
    const people = API_ROUTES.find((r) => r.path === "/api/people")!;
    for (const role of CHAMBER_ROLES.filter((r) => can(r, "people:see-email"))) {
      expect(role === "chief-clerk" || role === "clerk", role).toBe(true);
      const res = await send(people, s.as[role]);
      const got = (res.body as { members: Array<{ email: string | null }> }).members.map((m) => m.email);
      expect(got.sort()).toEqual([...all].sort());
    }
  });
});
