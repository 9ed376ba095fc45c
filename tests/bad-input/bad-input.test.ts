// Bad input through the real routes: each request of the corpus gets its 4xx with the error
// code and the field (or part of the request) that is wrong, and the database is unchanged.
// Common practice (validate at the boundary; a refused request writes nothing), no source.
import type { APIRoute } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { call } from "../support/app.ts";
import { tableCounts } from "../support/db.ts";
import type { Seeded } from "../support/fixtures.ts";
import type { Samples } from "../access/route-inventory.ts";
import { seedSamples } from "../access/samples.ts";
import { CORPUS, type BadInput } from "./corpus.ts";

let s: Seeded;
let samples: Samples;

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
}, 120_000);

async function send(c: BadInput) {
  const mod = (await import(/* @vite-ignore */ `../../src/pages/${c.file}`)) as Record<string, APIRoute>;
  const raw = c.raw?.(samples);
  const headers: Record<string, string> = {};
  let rawBody: BodyInit | undefined;
  if (raw) {
    if (raw.body instanceof FormData) {
      const r = new Request("http://x/", { method: "POST", body: raw.body });
      rawBody = await r.arrayBuffer();
      headers["content-type"] = r.headers.get("content-type")!;
    } else rawBody = raw.body;
    if (raw.contentType) headers["content-type"] = raw.contentType;
  } else if (c.json) {
    rawBody = JSON.stringify(c.json(samples));
    headers["content-type"] = "application/json";
  }
  return call(mod[c.method], c.method, "/x", { as: s.as[c.as], params: c.params?.(samples), query: c.query?.(samples), rawBody, headers });
}

describe("bad-input corpus", () => {
  for (const c of CORPUS) {
    it(`${c.name} → ${c.status} ${c.code}, nothing stored`, async () => {
      const before = await tableCounts();
      const res = await send(c);
      const shown = JSON.stringify(res.body).slice(0, 400);
      expect(res.status, shown).toBe(c.status);
      expect(res.body?.error?.code, shown).toBe(c.code);
      expect(typeof res.body.error.message).toBe("string");
      expect(JSON.stringify(res.body.error)).toContain(c.names);
      expect(await tableCounts()).toEqual(before);
    });
  }
});
