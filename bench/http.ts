/**
 * HTTP load benchmark (`npm run bench:http`, also run by `npm run bench`): the built server
 * (scripts/serve.mjs) on loopback, with its own freshly seeded database, under autocannon — 50
 * concurrent connections for 30 s each against (1) the legal-moves question and (2) the
 * amendment-tree read of the demo measure, once per server configuration in BENCH_WORKERS
 * (default "1,2": one process, then two processes sharing the port, GAVELWRIGHT_WORKERS).
 * Reports p50, p95, p99 latency and errors; writes bench/results/http.json. Target: p95 < 50 ms,
 * no errors. Not a test: nothing here fails the build. Traffic goes to 127.0.0.1 only, bounded in
 * time. The load generator runs on the same machine and takes CPU from the server.
 */
import autocannon from "autocannon";
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { join } from "node:path";
import postgres from "postgres";
// Plain-JS set-up helpers shared with npm start / npm test.
import { build, ensureDatabase, ensureNodeModules, localDatabaseUrl, recreateDatabase, ROOT, runTs } from "../scripts/lib/setup.mjs";

const PORT = Number(process.env.BENCH_PORT ?? 4499);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const WORKERS = (process.env.BENCH_WORKERS ?? "1,2").split(",").map(Number);
const BASE = `http://127.0.0.1:${PORT}`;

async function waitFor(url: string, ms = 60_000): Promise<void> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no answer from ${url}`);
}

async function signIn(email: string, password: string): Promise<string> {
  const r = await fetch(`${BASE}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE }, body: JSON.stringify({ email, password }) });
  if (!r.ok) throw new Error(`sign-in failed: ${r.status}`);
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

interface Row {
  name: string;
  workers: number;
  requests: number;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  non2xx: number;
}

/** The q-quantile (nearest rank) of sorted values. */
const quantile = (sorted: number[], q: number) => sorted[Math.max(0, Math.ceil(q * sorted.length) - 1)] ?? NaN;

function run(name: string, workers: number, opts: autocannon.Options): Promise<Row> {
  return new Promise((resolve, reject) => {
    // Every response's time, for exact percentiles (autocannon's summary has no p95).
    const times: number[] = [];
    const instance = autocannon({ ...opts, connections: CONNECTIONS, duration: SECONDS }, (err, r) => {
      if (err) return reject(err);
      times.sort((a, b) => a - b);
      resolve({ name, workers, requests: r.requests.total, rps: Math.round(r.requests.average), p50: quantile(times, 0.5), p95: quantile(times, 0.95), p99: quantile(times, 0.99), errors: r.errors + r.timeouts, non2xx: r.non2xx });
    });
    instance.on("response", (_client, _status, _bytes, ms) => times.push(ms));
  });
}

const children: ChildProcess[] = [];
try {
  ensureNodeModules();
  ensureDatabase({ test: true });
  const dbUrl = process.env.BENCH_DATABASE_URL ?? localDatabaseUrl("gavelwright_bench");
  if (!process.env.BENCH_DATABASE_URL) recreateDatabase(dbUrl);
  const env = {
    ...process.env,
    ASTRO_TELEMETRY_DISABLED: "1",
    NODE_ENV: "production",
    DATABASE_URL: dbUrl,
    HOST: "127.0.0.1",
    PORT: String(PORT),
    BETTER_AUTH_URL: BASE,
    BETTER_AUTH_SECRET: "bench-secret-0123456789abcdef0123456789",
    GAVELWRIGHT_RATE_LIMIT: "off",
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(PORT + 1000),
    GAVELWRIGHT_OUT_DIR: join(ROOT, ".build", "bench"),
    GAVELWRIGHT_CACHE_DIR: join(ROOT, ".build", "bench-cache"),
  };
  runTs("scripts/migrate.ts", env);
  runTs("scripts/seed.ts", env);
  if (process.env.BENCH_NO_BUILD !== "1") build(env);
  const [measure] = await (async () => {
    const sql = postgres(dbUrl, { max: 1 });
    try {
      return await sql`SELECT m.id FROM measures m JOIN organization o ON o.id = m.chamber_id WHERE o.slug = 'harrowmere' ORDER BY m.number LIMIT 1`;
    } finally {
      await sql.end();
    }
  })();
  if (!measure) throw new Error("the demo measure is missing from the seed");
  const movesBody = JSON.stringify({ state: { pending: [{ motion: "main" }, { motion: "amend" }], floor: { debateBegun: true } } });
  const rows: Row[] = [];
  for (const workers of WORKERS) {
    const server = spawn(process.execPath, [join(ROOT, "scripts", "serve.mjs")], { cwd: ROOT, env: { ...env, GAVELWRIGHT_WORKERS: String(workers) }, stdio: ["ignore", "ignore", "inherit"] });
    children.push(server);
    await waitFor(`${BASE}/sign-in`);
    const cookie = await signIn("member@harrowmere.example", "demo-member-pass");
    const headers = { cookie, origin: BASE, "content-type": "application/json" };
    // Warm up both routes (JIT, connection pool, every process) before measuring.
    for (let i = 0; i < 50; i++) {
      await fetch(`${BASE}/api/moves`, { method: "POST", headers, body: movesBody });
      await fetch(`${BASE}/api/measures/${measure.id}/tree`, { headers });
    }
    rows.push(await run("legal moves (POST /api/moves)", workers, { url: `${BASE}/api/moves`, method: "POST", headers, body: movesBody }));
    rows.push(await run("tree read (GET /api/measures/:id/tree)", workers, { url: `${BASE}/api/measures/${measure.id}/tree`, headers }));
    server.kill("SIGTERM");
    await new Promise((r) => server.once("exit", r));
  }

  console.log(`\nHTTP load on ${cpus()[0]?.model ?? "this machine"} (${cpus().length} cores), ${CONNECTIONS} connections × ${SECONDS} s, loopback`);
  console.log("route".padEnd(42) + "procs".padStart(6) + "requests".padStart(10) + "req/s".padStart(8) + "p50 ms".padStart(8) + "p95 ms".padStart(8) + "p99 ms".padStart(8) + "errors".padStart(8) + "non-2xx".padStart(9) + "  target p95<50ms");
  for (const r of rows)
    console.log(r.name.padEnd(42) + String(r.workers).padStart(6) + String(r.requests).padStart(10) + String(r.rps).padStart(8) + r.p50.toFixed(1).padStart(8) + r.p95.toFixed(1).padStart(8) + r.p99.toFixed(1).padStart(8) + String(r.errors).padStart(8) + String(r.non2xx).padStart(9) + (r.p95 < 50 && r.errors === 0 && r.non2xx === 0 ? "  met" : "  NOT met"));
  mkdirSync(join(ROOT, "bench", "results"), { recursive: true });
  writeFileSync(join(ROOT, "bench", "results", "http.json"), JSON.stringify({ at: new Date().toISOString(), connections: CONNECTIONS, seconds: SECONDS, rows }, null, 2));
} finally {
  for (const c of children) c.kill("SIGTERM");
}
