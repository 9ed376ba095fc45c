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
