// Fuzzing every API route of the inventory (tests/access/route-inventory.ts) with generated input
// (issue 17, item 5): random JSON, NUL and other control characters, lone surrogates, huge and
// negative numbers, impossible dates, deep nesting, wrong types, in bodies, query strings and path
// parameters, as every role, anonymous and the other chamber's chief clerk. Properties:
//   - never a 5xx;
//   - every 400, 413 and 422 is our error shape and names a field (an issue with a path);
//     401, 403, 404, 409 and 429 are refusals that need not name one;
//   - after any refusal, every table's row count and contents are unchanged (a write detector says
//     when nothing was written; otherwise an md5 of every table's rows decides).
// The normal suite runs a few cases per route with a fixed seed; `npm run fuzz` runs
// GAVELWRIGHT_FUZZ_RUNS cases per route (10 000), GAVELWRIGHT_FUZZ_SEED picks another seed.
// Common practice (property-based testing of input handling; fail closed), no source.
import type { APIRoute } from "astro";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { sql } from "../../src/lib/server/db.ts";
import { activeCount } from "../../src/lib/server/analysis/runner.ts";
import { call, type Session } from "../support/app.ts";
import type { Seeded } from "../support/fixtures.ts";
import { API_ROUTES, ALL_ROLES, type ApiRoute, type Samples } from "../access/route-inventory.ts";
import { seedSamples } from "../access/samples.ts";

const RUNS = Number(process.env.GAVELWRIGHT_FUZZ_RUNS ?? 5);
const SEED = Number(process.env.GAVELWRIGHT_FUZZ_SEED ?? 17);

let s: Seeded;
let samples: Samples;

beforeAll(async () => {
  ({ s, samples } = await seedSamples());
  await settled();
  await watchWrites();
  current = await snapshot();
  seenWrites = await writeCount();
}, 180_000);

afterAll(async () => {
  await unwatchWrites();
});

// ---- the database, counted and digested in one round trip

const VOLATILE = new Set(["session", "verification", "rate_limit"]);
let digestSql: string | null = null;
async function snapshot(): Promise<Record<string, string>> {
  if (!digestSql) {
    const tables = (await sql<{ t: string }[]>`SELECT tablename AS t FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`).map((r) => r.t).filter((t) => !VOLATILE.has(t) && !t.startsWith("__"));
    digestSql = tables.map((t) => `SELECT '${t}' AS t, count(*)::text || ':' || coalesce(md5(string_agg(x::text, '|' ORDER BY x::text)), '') AS d FROM "${t}" x`).join(" UNION ALL ");
  }
  const rows = await sql.unsafe(digestSql);
  return Object.fromEntries(rows.map((r) => [r.t as string, r.d as string]));
}
let current: Record<string, string> = {};

// The write detector: a trigger on every digested table bumps a sequence for each row written
// (and on TRUNCATE). A sequence is not transactional, so a write that was rolled back bumps it too;
// then the digest above decides. An unchanged count means no row of those tables was written, so
// the digest (one md5 of every table, the slow part of each case) is computed only when needed.
const WATCH = "gw_fuzz_writes";
let watched: string[] = [];
let seenWrites = "";
async function watchWrites() {
  watched = (await sql<{ t: string }[]>`SELECT tablename AS t FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`).map((r) => r.t).filter((t) => !VOLATILE.has(t) && !t.startsWith("__"));
  await sql.unsafe(`CREATE SEQUENCE IF NOT EXISTS ${WATCH}; CREATE OR REPLACE FUNCTION ${WATCH}() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN PERFORM nextval('${WATCH}'); RETURN NULL; END $$;`);
  for (const t of watched)
    await sql.unsafe(`DROP TRIGGER IF EXISTS ${WATCH}_row ON "${t}"; DROP TRIGGER IF EXISTS ${WATCH}_truncate ON "${t}";
      CREATE TRIGGER ${WATCH}_row AFTER INSERT OR UPDATE OR DELETE ON "${t}" FOR EACH ROW EXECUTE FUNCTION ${WATCH}();
      CREATE TRIGGER ${WATCH}_truncate AFTER TRUNCATE ON "${t}" FOR EACH STATEMENT EXECUTE FUNCTION ${WATCH}();`);
}
async function unwatchWrites() {
  for (const t of watched) await sql.unsafe(`DROP TRIGGER IF EXISTS ${WATCH}_row ON "${t}"; DROP TRIGGER IF EXISTS ${WATCH}_truncate ON "${t}";`);
  await sql.unsafe(`DROP FUNCTION IF EXISTS ${WATCH}(); DROP SEQUENCE IF EXISTS ${WATCH};`);
}
async function writeCount(): Promise<string> {
  const [r] = await sql.unsafe(`SELECT last_value::text AS v, is_called FROM ${WATCH}`);
  return r.is_called ? (r.v as string) : "0";
}

/** Wait for whatever an accepted request started off the request path (analysis workers). */
async function settled() {
  await vi.waitFor(() => expect(activeCount()).toBe(0), { timeout: 120_000, interval: 50 });
}

// ---- generated values

const codeUnits = fc.array(fc.integer({ min: 0, max: 0xffff }), { maxLength: 24 }).map((cs) => String.fromCharCode(...cs));
const HOSTILE_TEXT = [
  "\u0000", "a\u0000b", "\ud800", "x\udfff", "\udc00\ud800", "\u0007bell", "\u001b[31m", "\u007f", "\r", "a\rb", "\f", "\v",
  "=HYPERLINK(\"http://evil.example\")", "@SUM(1)", "+cmd", "-1", "%00", "\\u0000", "' OR 1=1 --", "../../etc/passwd", "<script>x</script>",
  "2026-02-30", "0000-01-01", "2026-13-01", "2026-02-30T10:00:00Z", "0000-01-01T00:00:00Z", "+275760-09-13", "9999999999999999999999",
  "2147483648", "-2147483649", "1e309", "NaN", "", " ", "A".repeat(5000),
];
const text = fc.oneof(fc.constantFrom(...HOSTILE_TEXT), codeUnits, fc.string({ maxLength: 30 }));
const HOSTILE_NUMBERS = [2 ** 31, 2 ** 31 - 1, -(2 ** 31) - 1, 2 ** 53, -(2 ** 53), Number.MAX_SAFE_INTEGER + 2, 1e308, -1e308, -1, 0, -0, 0.5, 1.5, 5e-324];
const number = fc.oneof(fc.constantFrom(...HOSTILE_NUMBERS), fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }));
/** A value nested `depth` levels deep, written out as JSON text only when sent (no deep object for fast-check to print). */
class Deep {
  constructor(
    readonly depth: number,
    readonly kind: "array" | "object",
  ) {}
  text(): string {
    return this.kind === "array" ? `${"[".repeat(this.depth)}"\\u0000"${"]".repeat(this.depth)}` : `${'{"a":'.repeat(this.depth)}"\\u0000"${"}".repeat(this.depth)}`;
  }
  [fc.toStringMethod]() {
    return `Deep(${this.depth} ${this.kind}s)`;
  }
}
/** JSON text of a generated value, with Deep values written out. */
function jsonText(v: unknown): string {
  if (v instanceof Deep) return v.text();
  if (Array.isArray(v)) return `[${v.map(jsonText).join(",")}]`;
  if (v && typeof v === "object") return `{${Object.entries(v).map(([k, x]) => `${JSON.stringify(k)}:${jsonText(x)}`).join(",")}}`;
  return JSON.stringify(v) ?? "null";
}
const nested = fc.tuple(fc.integer({ min: 20, max: 3000 }), fc.constantFrom<"array" | "object">("array", "object")).map(([depth, kind]) => new Deep(depth, kind));
const leaf: fc.Arbitrary<unknown> = fc.oneof({ weight: 4, arbitrary: text }, { weight: 2, arbitrary: number }, { weight: 1, arbitrary: fc.boolean() }, { weight: 1, arbitrary: fc.constant(null) });
const anyJson: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: leaf },
  { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: nested },
  { weight: 2, arbitrary: fc.dictionary(fc.oneof(text, fc.string({ maxLength: 8 })), leaf, { maxKeys: 5 }) },
  { weight: 1, arbitrary: fc.array(leaf, { maxLength: 5 }) },
);

/** Every (path, value) of a JSON value, to replace one of them. */
function paths(v: unknown, at: Array<string | number> = []): Array<Array<string | number>> {
  const out: Array<Array<string | number>> = [at];
  if (v instanceof Deep) return out;
  if (Array.isArray(v)) v.forEach((x, i) => out.push(...paths(x, [...at, i])));
  else if (v && typeof v === "object") for (const [k, x] of Object.entries(v)) out.push(...paths(x, [...at, k]));
  return out;
}
function replaced(v: unknown, path: Array<string | number>, by: unknown): unknown {
  if (path.length === 0) return by;
  const copy: any = Array.isArray(v) ? [...v] : { ...(v as object) };
  copy[path[0]] = replaced(copy[path[0]], path.slice(1), by);
  return copy;
}

/** A body: the route's own valid body with one or two values replaced, or something else entirely. */
function bodyFor(r: ApiRoute): fc.Arbitrary<{ kind: "json"; value: unknown } | { kind: "raw"; bytes: Uint8Array; type: string }> {
  const valid = r.body ? r.body(samples) : r.raw ? undefined : {};
  const mutations: Array<fc.Arbitrary<{ kind: "json"; value: unknown } | { kind: "raw"; bytes: Uint8Array; type: string }>> = [
    anyJson.map((value) => ({ kind: "json" as const, value })),
    fc.tuple(fc.uint8Array({ maxLength: 200 }), fc.constantFrom("application/json", "text/csv", "multipart/form-data; boundary=x", "text/plain")).map(([bytes, type]) => ({ kind: "raw" as const, bytes, type })),
  ];
  if (valid !== undefined) {
    const ps = paths(valid);
    const once = fc.tuple(fc.constantFrom(...ps), anyJson).map(([p, by]) => replaced(valid, p, by));
    const twice = fc.tuple(once, fc.constantFrom(...ps), anyJson).map(([v, p, by]) => replaced(v, p, by));
    const extraKey = fc.tuple(text, anyJson).map(([k, by]) => (valid && typeof valid === "object" && !Array.isArray(valid) ? { ...(valid as object), [k]: by } : valid));
    mutations.push(...[once, once, once, twice, extraKey].map((a) => a.map((value) => ({ kind: "json" as const, value }))));
  }
  if (r.raw) {
    const raw = r.raw(samples);
    if (typeof raw.body === "string") {
      const base = raw.body;
      mutations.push(fc.tuple(fc.nat({ max: base.length }), text).map(([at, t]) => ({ kind: "raw" as const, bytes: new TextEncoder().encode(base.slice(0, at) + t + base.slice(at)), type: raw.contentType })));
    }
  }
  return fc.oneof(...mutations);
}

/** A query: the route's own query with values replaced or keys added, or random keys. */
function queryFor(r: ApiRoute): fc.Arbitrary<Record<string, string>> {
  const valid = r.query ? r.query(samples) : {};
  const KNOWN = ["q", "from", "to", "status", "limit", "page", "pageSize", "outcome", "mode", "format", "order", "measureId", "estimateId", "basedOn", "title", "scope", "kind", "dimensions", "per", "version", "text", "rule", "citation", "exclude", "motion", "measure", "token", "run"];
  const value = fc.oneof(text, number.map(String));
  return fc.oneof(
    fc.constant(valid),
    fc.tuple(fc.constantFrom(...KNOWN), value).map(([k, v]) => ({ ...valid, [k]: v })),
    fc.dictionary(fc.constantFrom(...KNOWN), value, { maxKeys: 4 }).map((d) => ({ ...valid, ...d })),
    fc.dictionary(text, text, { maxKeys: 3 }),
  );
}

type Who = (typeof ALL_ROLES)[number] | "anonymous" | "outsider";
/** Mostly a role the route allows (so the input gets past the permission check), sometimes anyone. */
const allowed = (r: ApiRoute): Who[] => (Array.isArray(r.audience) ? [...(r.audience as Who[])] : ["clerk"]);
const whoFor = (r: ApiRoute) => fc.oneof({ weight: 4, arbitrary: fc.constantFrom<Who>(...allowed(r)) }, { weight: 1, arbitrary: fc.constantFrom<Who>(...ALL_ROLES, "anonymous", "outsider") });
const sessionOf = (w: Who): Session | null => (w === "anonymous" ? null : w === "outsider" ? s.outsider : s.as[w]);

const AUTH_PATHS = ["/api/auth/sign-in/email", "/api/auth/sign-up/email", "/api/auth/update-user", "/api/auth/request-password-reset", "/api/auth/reset-password", "/api/auth/change-password", "/api/auth/organization/create", "/api/auth/organization/set-active", "/api/auth/get-session"];

// ---- the requests

const modules = new Map<string, Record<string, APIRoute>>();
async function handlerOf(r: ApiRoute): Promise<APIRoute> {
  if (!modules.has(r.file)) modules.set(r.file, await import(/* @vite-ignore */ `../../src/pages/${r.file}`));
  return modules.get(r.file)![r.method]!;
}

interface Case {
  who: Who;
  body: { kind: "json"; value: unknown } | { kind: "raw"; bytes: Uint8Array; type: string };
  query: Record<string, string>;
  params: Record<string, string>;
  authPath: string;
  authMethod: string;
}

function caseFor(r: ApiRoute): fc.Arbitrary<Case> {
  const realParams = Object.fromEntries(Object.entries(r.params ?? {}).map(([k, key]) => [k, samples[key!]]));
  // A never-ending stream is only called with parameters that do not name a real record.
  const params = Object.keys(realParams).length === 0 ? fc.constant({}) : r.stream ? fc.record(Object.fromEntries(Object.keys(realParams).map((k) => [k, text]))) : fc.oneof({ weight: 4, arbitrary: fc.constant(realParams) }, { weight: 1, arbitrary: fc.record(Object.fromEntries(Object.keys(realParams).map((k) => [k, text]))) as fc.Arbitrary<Record<string, string>> });
  // fast-check prints a failing case with our short description (a deep value would overflow its printer).
  return fc.record({ who: whoFor(r), body: bodyFor(r), query: queryFor(r), params: params as fc.Arbitrary<Record<string, string>>, authPath: fc.constantFrom(...AUTH_PATHS), authMethod: fc.constantFrom("POST", "POST", "GET") }).map((c) => Object.assign(c, { [fc.toStringMethod]: () => shown(c, { status: 0, body: null }) }));
}

async function send(r: ApiRoute, c: Case) {
  const method = r.method === "ALL" ? c.authMethod : r.method;
  const path = r.method === "ALL" ? c.authPath : "/x";
  const sendsBody = !["GET", "DELETE"].includes(method);
  const body = sendsBody ? (c.body.kind === "json" ? { rawBody: jsonText(c.body.value), headers: { "content-type": "application/json" } } : { rawBody: c.body.bytes as BodyInit, headers: { "content-type": c.body.type } }) : {};
  return call(await handlerOf(r), method, path, { as: sessionOf(c.who), params: c.params, query: c.query, ...body });
}

const REFUSALS_WITHOUT_FIELD = new Set([401, 403, 404, 405, 409, 429]);
const shown = (c: Case, res: { status: number; body: unknown }) => `${res.status} ${JSON.stringify(res.body)?.slice(0, 300)} for ${c.who} ${JSON.stringify({ query: c.query, params: c.params, body: c.body.kind === "json" ? c.body.value : `<${c.body.bytes.length} bytes ${c.body.type}>` }, (_k, v) => (v instanceof Deep ? `Deep(${v.depth} ${v.kind}s)` : typeof v === "string" && v.length > 80 ? `${v.slice(0, 80)}…` : v))?.slice(0, 600)}`;

async function check(r: ApiRoute, c: Case) {
  const t0 = Date.now();
  const res = await send(r, c);
  if (process.env.GAVELWRIGHT_FUZZ_TRACE) console.log(`${Date.now() - t0} ms ${res.status} ${r.method} ${r.path} ${JSON.stringify(c.query).slice(0, 120)} ${JSON.stringify(c.body.kind === "json" ? c.body.value : "raw")?.slice(0, 120)}`);
  const why = shown(c, res);
  expect(res.status, why).toBeLessThan(500);
  if (res.status < 400) {
    await settled();
    const writes = await writeCount();
    if (writes !== seenWrites) current = await snapshot();
    seenWrites = writes;
    return;
  }
  if (!REFUSALS_WITHOUT_FIELD.has(res.status)) {
    if (r.method === "ALL") {
      // better-auth's own answers: a JSON message (its validation names the field in it).
      expect(typeof (res.body?.message ?? res.body?.error?.message), why).toBe("string");
    } else {
      expect(typeof res.body?.error?.code, why).toBe("string");
      expect(Array.isArray(res.body.error.issues) && res.body.error.issues.length > 0, why).toBe(true);
      for (const i of res.body.error.issues) {
        expect(typeof i.path === "string" && i.path.length > 0, why).toBe(true);
        expect(i.path, `refused by the database, not at the door: ${why}`).not.toBe("(database)");
      }
    }
  }
  const writes = await writeCount();
  if (writes === seenWrites) return; // nothing was written
  seenWrites = writes;
  const after = await snapshot();
  const before = current;
  current = after; // one failure must not poison the comparisons after it
  const changed = Object.keys({ ...before, ...after }).filter((t) => before[t] !== after[t]);
  expect(changed, `the database changed after a refusal: ${why}`).toEqual([]);
}

// ---- systematic cases: each value of the route's own valid request replaced by each value the
// database would refuse (the probe's findings: NUL, half a surrogate pair, a control character,
// int4 overflow, impossible dates), as a role the route allows.

const MUST_REFUSE_TEXT = ["a\u0000b", "\ud800", "x\u0007y"];
const MUST_REFUSE_NUMBERS = [2 ** 31, -(2 ** 31) - 1, 2 ** 53];
const IMPOSSIBLE_DATES = ["2026-02-30", "0000-01-01", "2026-02-30T10:00:00Z", "0000-01-01T00:00:00Z"];
/** Query parameters the probe named (search text, dates, page sizes, versions), tried on every route. */
const QUERY_KEYS = ["q", "from", "text", "limit", "version"];

function systematic(r: ApiRoute): Case[] {
  const base = { who: allowed(r)[0], authPath: "/api/auth/update-user", authMethod: "POST", params: Object.fromEntries(Object.entries(r.params ?? {}).map(([k, key]) => [k, samples[key!]])) };
  if (r.stream) return MUST_REFUSE_TEXT.map((t) => ({ ...base, params: Object.fromEntries(Object.keys(base.params).map((k) => [k, t])), query: {}, body: { kind: "json", value: {} } }));
  const validQuery = r.query ? r.query(samples) : {};
  const validBody = r.body ? r.body(samples) : {};
  const out: Case[] = [];
  const withBody = (value: unknown): Case => ({ ...base, query: validQuery, body: { kind: "json", value } });
  if (!["GET", "DELETE"].includes(r.method) && !r.raw) {
    let strings = 0;
    // A long document (a rulebook has hundreds of strings) is sampled evenly: 40 paths at most.
    const all = paths(validBody);
    const step = Math.max(1, Math.ceil(all.length / 40));
    for (const p of all.filter((_, i) => i % step === 0)) {
      const v = p.reduce<any>((o, k) => o?.[k], validBody);
      if (typeof v === "string") {
        // NUL everywhere; the other refusals (same code path) on the first strings only, to keep the suite short.
        for (const t of strings++ < 12 ? MUST_REFUSE_TEXT : MUST_REFUSE_TEXT.slice(0, 1)) out.push(withBody(replaced(validBody, p, t)));
        if (/^\d{4}-\d{2}-\d{2}/.test(v)) for (const d of IMPOSSIBLE_DATES) out.push(withBody(replaced(validBody, p, d)));
      } else if (typeof v === "number") for (const n of MUST_REFUSE_NUMBERS) out.push(withBody(replaced(validBody, p, n)));
    }
  }
  for (const key of new Set([...Object.keys(validQuery), ...QUERY_KEYS]))
    for (const v of ["a\u0000b", "2147483648", "2026-02-30"]) out.push({ ...base, query: { ...validQuery, [key]: v }, body: { kind: "json", value: validBody } });
  if (Object.keys(base.params).length) for (const t of MUST_REFUSE_TEXT) out.push({ ...base, query: validQuery, body: { kind: "json", value: validBody }, params: Object.fromEntries(Object.keys(base.params).map((k) => [k, t])) });
  return out;
}

describe("every value the database would refuse, in every field of every route's own request", () => {
  for (const r of API_ROUTES) {
    it(`${r.method} ${r.path}`, async () => {
      for (const c of systematic(r)) await check(r, c);
    }, 120_000);
  }
});

describe(`fuzzing every API route (${RUNS} cases each, seed ${SEED})`, () => {
  for (const r of API_ROUTES) {
    it(`${r.method} ${r.path}`, async () => {
      await fc.assert(
        fc.asyncProperty(caseFor(r), (c) => check(r, c)),
        { numRuns: RUNS, seed: SEED, endOnFailure: true },
      );
    }, Math.max(30_000, RUNS * 3_000));
  }
});
