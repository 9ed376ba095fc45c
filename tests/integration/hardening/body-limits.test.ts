// Every route that reads a body has a size limit, enforced while the body streams in: a client
// sending an endless chunked body (no Content-Length) gets 413 after at most the limit has been
// read, never an unbounded buffer. Common practice (OWASP: limit request sizes), no source.
import type { APIContext, APIRoute } from "astro";
import { beforeAll, describe, expect, it } from "vitest";
import { loadContext } from "../../../src/lib/server/context.ts";
import { errorResponse, isDatabaseUnavailable } from "../../../src/lib/server/http.ts";
import { BASE, type Session } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import type { Seeded } from "../../support/fixtures.ts";
import { API_ROUTES, urlOf, type ApiRoute, type Samples } from "../../access/route-inventory.ts";
import { seedSamples } from "../../access/samples.ts";

let s: Seeded;
let samples: Samples;
beforeAll(async () => {
  ({ s, samples } = await seedSamples());
}, 120_000);

// Routes that take no body at all.
// (A journal is never edited: its PUT answers 409 before reading anything.)
const NO_BODY = new Set(["POST api/circulation/messages/[id]/retry.ts", "POST api/people/removed/[id].ts", "PUT api/floor/sittings/[id]/journal/index.ts"]);
const readers = API_ROUTES.filter((r) => ["POST", "PUT", "PATCH"].includes(r.method) && r.audience !== "public" && !NO_BODY.has(`${r.method} ${r.file}`));
const MULTIPART = new Set(["api/measures/upload.ts", "api/rulebooks/import.ts", "api/rulebooks/text/index.ts"]);
const CHUNK = 64 * 1024;
const CEILING = 20 * 1024 * 1024; // above every limit (uploads: 5 MB, recorded-vote CSV: 8 MB, an ideal-point estimate request: 16 MB, + framing)

function endless(): { stream: ReadableStream<Uint8Array>; sent: () => number } {
  let sent = 0;
  const chunk = new Uint8Array(CHUNK).fill(0x20);
  return {
    sent: () => sent,
    stream: new ReadableStream<Uint8Array>({
      pull(c) {
        if (sent > 64 * 1024 * 1024) return c.close(); // a hard stop so a missing limit fails instead of hanging
        sent += CHUNK;
        c.enqueue(chunk);
      },
    }),
  };
}

function contentType(r: ApiRoute): string {
  if (MULTIPART.has(r.file)) return "multipart/form-data; boundary=x";
  if (r.file === "api/estimates/import.ts") return "text/csv";
  return "application/json";
}

async function sendEndless(r: ApiRoute, as: Session) {
  const mod = (await import(/* @vite-ignore */ `../../../src/pages/${r.file}`)) as Record<string, APIRoute>;
  const url = new URL(urlOf(r, samples), BASE);
  const headers = new Headers({ origin: BASE, cookie: as.cookie, "content-type": contentType(r) });
  const body = endless();
  const request = new Request(url, { method: r.method, headers, body: body.stream, duplex: "half" } as RequestInit);
  const locals = { ...(await loadContext(headers)), requestId: "test" } as App.Locals;
  const params = Object.fromEntries(Object.entries(r.params ?? {}).map(([k, key]) => [k, samples[key!]]));
  const ctx = { request, url, params, locals, redirect: () => new Response(null, { status: 302 }) } as unknown as APIContext;
  const res = await mod[r.method](ctx);
  return { status: res.status, body: await res.json(), sent: body.sent() };
}

describe("request body limits", () => {
  it("covers every route that reads a body", () => {
    expect(readers.length).toBeGreaterThan(25);
  });

  it("an endless chunked body gets 413 on every such route, having read no more than the limit", async () => {
    const before = await tableCounts();
    for (const r of readers) {
      const role = (r.audience as readonly string[])[0] as keyof Seeded["as"];
      const res = await sendEndless(r, s.as[role]);
      expect(res.status, `${r.method} ${r.path}: ${JSON.stringify(res.body).slice(0, 200)}`).toBe(413);
      expect(res.body.error.code).toBe("too-large");
      expect(res.sent, `${r.method} ${r.path} read ${res.sent} bytes`).toBeLessThan(CEILING);
    }
    expect(await tableCounts()).toEqual(before);
  });
});

describe("a client that hangs up", () => {
  it("is not a database outage: 400, not 503 (the socket reset of a client is not the database's)", async () => {
    const abort = Object.assign(new Error("aborted"), { code: "ECONNRESET" });
    expect(isDatabaseUnavailable(abort)).toBe(false);
    expect(errorResponse(abort).status).toBe(400);
    // The database's own reset arrives under a query (wrapped by the driver or Drizzle): 503.
    const dbReset = Object.assign(new Error("Failed query: select 1\nparams: "), { query: "select 1", cause: Object.assign(new Error("read ECONNRESET"), { code: "ECONNRESET" }) });
    expect(isDatabaseUnavailable(dbReset)).toBe(true);
    expect(errorResponse(dbReset).status).toBe(503);
  });
});

describe("a database outage and a bug", () => {
  // Common practice, no source: 503 tells a client to retry; a bug must not look retryable.
  it("an outage seen through better-auth's or Drizzle's wrapper is still an outage (503); a bug is a 500", () => {
    const refused = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:54339"), { code: "ECONNREFUSED" });
    const drizzleWrapped = Object.assign(new Error("Failed query: select 1"), { query: "select 1", cause: refused });
    const authWrapped = Object.assign(new Error("Failed to get session"), { status: "INTERNAL_SERVER_ERROR", cause: drizzleWrapped });
    expect(isDatabaseUnavailable(authWrapped)).toBe(true);
    expect(errorResponse(authWrapped).status).toBe(503);
    const shutdown = Object.assign(new Error("terminating connection due to administrator command"), { code: "57P01" });
    expect(isDatabaseUnavailable(Object.assign(new Error("Failed to get session"), { cause: shutdown }))).toBe(true);
    const bug = new TypeError("Cannot read properties of undefined (reading 'id')");
    expect(isDatabaseUnavailable(bug)).toBe(false);
    expect(errorResponse(bug).status).toBe(500);
    const badSql = Object.assign(new Error("Failed query"), { query: "select nope", cause: Object.assign(new Error('column "nope" does not exist'), { code: "42703" }) });
    expect(isDatabaseUnavailable(badSql)).toBe(false);
    expect(errorResponse(badSql).status).toBe(500);
  });
});
