// npm test: the same set-up as npm start (dependencies, PostgreSQL), then every check and test:
//  0. the lint (eslint .) and the type check (astro check: no error, no warning);
//  1. unit and integration tests (vitest) against a fresh test database built from drizzle/;
//  2. fault tests (tests/faults: a throwaway PostgreSQL cluster restarted under load, the server
//     killed mid-analysis) against the built app;
//  3. browser tests (playwright-core + Debian's Chromium) against the built app, served on
//     127.0.0.1:4399 with a freshly seeded database and the local mail catcher.
// TEST_DATABASE_URL / TEST_E2E_DATABASE_URL point at an external server instead.
import { spawn } from "node:child_process";
import { join } from "node:path";
import { build, ensureChromium, ensureDatabase, ensureNodeModules, localDatabaseUrl, log, recreateDatabase, ROOT, runNode, runTs, SetupError, CHROMIUM } from "./lib/setup.mjs";

const PORT = Number(process.env.GAVELWRIGHT_TEST_PORT ?? 4399);
const SMTP_PORT = PORT + 200;
const started = Date.now();
const children = [];

function cleanup() {
  for (const c of children) if (c.exitCode === null) c.kill("SIGTERM");
}
process.on("exit", cleanup);
process.on("SIGINT", () => process.exit(130));

async function waitForServer(url, ms = 60_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      const r = await fetch(url);
      if (r.status < 500) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new SetupError(`the app did not answer at ${url} within ${ms / 1000} s`);
}

const vitest = join(ROOT, "node_modules", "vitest", "vitest.mjs");
const only = process.argv[2]; // "unit" | "browser" | undefined (both)

try {
  ensureNodeModules();
  if (only !== "unit") ensureChromium();
  const base = { ...process.env, ASTRO_TELEMETRY_DISABLED: "1", NODE_ENV: "test" };
  ensureDatabase({ test: true });

  if (only !== "browser") {
    // The house rules as checks: the lint (with the core's boundaries) and the type check, before any test.
    log("lint (eslint) and type check (astro check)…");
    runNode([join(ROOT, "node_modules", "eslint", "bin", "eslint.js"), "."], base);
    runNode([join(ROOT, "node_modules", "astro", "astro.js"), "check", "--minimumFailingSeverity", "warning"], base);
    const testDb = process.env.TEST_DATABASE_URL ?? localDatabaseUrl("gavelwright_test");
    if (!process.env.TEST_DATABASE_URL) recreateDatabase(testDb);
    log("unit and integration tests…");
    runNode([vitest, "run"], { ...base, TEST_DATABASE_URL: testDb });
  }

  if (only !== "unit") {
    const e2eDb = process.env.TEST_E2E_DATABASE_URL ?? localDatabaseUrl("gavelwright_e2e");
    if (!process.env.TEST_E2E_DATABASE_URL) recreateDatabase(e2eDb);
    const env = {
      ...base,
      NODE_ENV: "production",
      DATABASE_URL: e2eDb,
      HOST: "127.0.0.1",
      PORT: String(PORT),
      BETTER_AUTH_URL: `http://127.0.0.1:${PORT}`,
      BETTER_AUTH_SECRET: "browser-test-secret-0123456789abcdef",
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(SMTP_PORT),
      GAVELWRIGHT_DEV_MAILBOX: "1",
      GAVELWRIGHT_RATE_LIMIT: "off",
      GAVELWRIGHT_OUT_DIR: join(ROOT, ".build", "test"),
      GAVELWRIGHT_CACHE_DIR: join(ROOT, ".build", "test-cache"),
    };
    runTs("scripts/migrate.ts", env);
    runTs("scripts/seed.ts", env);
    build(env);
    log("fault tests (PostgreSQL restarted and crashed, the server killed mid-analysis) against the build…");
    runNode([vitest, "run", "-c", "vitest.faults.config.ts"], { ...base, GAVELWRIGHT_SERVER_BUILD: env.GAVELWRIGHT_OUT_DIR });
    const tsx = join(ROOT, "node_modules", "tsx", "dist", "cli.mjs");
    children.push(spawn(process.execPath, [tsx, "scripts/mail-catcher.ts"], { cwd: ROOT, env, stdio: ["ignore", "ignore", "inherit"] }));
    // Two server processes sharing the port, as in production: what one process remembers must
    // never hide another's write (tests/browser/read-your-writes.test.ts and every flow).
    children.push(spawn(process.execPath, [join(ROOT, "scripts", "serve.mjs")], { cwd: ROOT, env: { ...env, GAVELWRIGHT_WORKERS: "2" }, stdio: ["ignore", "ignore", "inherit"] }));
    await waitForServer(`http://127.0.0.1:${PORT}/sign-in`);
    log(`browser tests against http://127.0.0.1:${PORT}, two server processes (Chromium at ${CHROMIUM})…`);
    runNode([vitest, "run", "-c", "vitest.browser.config.ts"], { ...base, GAVELWRIGHT_TEST_URL: `http://127.0.0.1:${PORT}`, DATABASE_URL: e2eDb });
  }
  log(`all tests passed in ${Math.round((Date.now() - started) / 1000)} s`);
  cleanup();
  process.exit(0);
} catch (e) {
  console.error(e instanceof SetupError ? `[gavelwright] ${e.message}` : e);
  cleanup();
  process.exit(1);
}
