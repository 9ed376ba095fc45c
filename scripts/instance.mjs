// A throwaway app instance with its own database, build folder and ports, so several people
// (or test runs) can run the app side by side on one machine:
//   node scripts/instance.mjs NAME PORT [--no-build] [--fresh]
// Creates database gw_NAME on the project-local cluster (or uses DATABASE_URL), migrates it,
// seeds the demo, builds into .build/NAME, and serves on 127.0.0.1:PORT with a mail catcher
// on PORT+1000. --fresh drops the database first.
import { spawn, spawnSync } from "node:child_process";
import { join } from "node:path";
import { build, ensureDatabase, ensureEnvFile, ensureNodeModules, loadEnvFile, log, PG, ROOT, runTs, SetupError } from "./lib/setup.mjs";

const [name, portArg, ...flags] = process.argv.slice(2);
if (!name || !/^[a-z0-9_]+$/.test(name) || !/^\d+$/.test(portArg ?? "")) {
  console.error("usage: node scripts/instance.mjs NAME PORT [--no-build] [--fresh]   (NAME: lower-case letters, digits, _)");
  process.exit(2);
}
const port = Number(portArg);
try {
  ensureNodeModules();
  ensureEnvFile();
  loadEnvFile();
  const base = ensureDatabase();
  const url = new URL(base);
  url.pathname = `/gw_${name}`;
  const admin = new URL(base);
  admin.pathname = "/postgres";
  const psql = (sql) => spawnSync("psql", [admin.toString(), "-tAc", sql], { encoding: "utf8" });
  if (flags.includes("--fresh")) psql(`DROP DATABASE IF EXISTS gw_${name} WITH (FORCE)`);
  if (psql(`SELECT 1 FROM pg_database WHERE datname='gw_${name}'`).stdout.trim() !== "1") psql(`CREATE DATABASE gw_${name}`);
  const env = {
    ...process.env,
    ASTRO_TELEMETRY_DISABLED: "1",
    DATABASE_URL: url.toString(),
    HOST: "127.0.0.1",
    PORT: String(port),
    BETTER_AUTH_URL: `http://127.0.0.1:${port}`,
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(port + 1000),
    GAVELWRIGHT_DEV_MAILBOX: "1",
    // Instances are for tests and parallel work: many sign-ins from 127.0.0.1 are expected.
    GAVELWRIGHT_RATE_LIMIT: process.env.GAVELWRIGHT_RATE_LIMIT ?? "off",
    GAVELWRIGHT_OUT_DIR: join(ROOT, ".build", name),
    GAVELWRIGHT_CACHE_DIR: join(ROOT, ".build", `${name}-cache`),
  };
  runTs("scripts/migrate.ts", env);
  runTs("scripts/seed.ts", env);
  if (!flags.includes("--no-build")) build(env);
  const tsx = join(ROOT, "node_modules", "tsx", "dist", "cli.mjs");
  const catcher = spawn(process.execPath, [tsx, "scripts/mail-catcher.ts"], { cwd: ROOT, env, stdio: "inherit" });
  const server = spawn(process.execPath, [join(ROOT, "scripts", "serve.mjs")], { cwd: ROOT, env, stdio: "inherit" });
  const stop = () => {
    catcher.kill("SIGTERM");
    server.kill("SIGTERM");
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
  server.on("exit", (code) => {
    catcher.kill("SIGTERM");
    process.exit(code ?? 0);
  });
  log(`instance ${name}: http://127.0.0.1:${port} (database gw_${name}, mail catcher on ${port + 1000})`);
  void PG;
} catch (e) {
  console.error(e instanceof SetupError ? `[gavelwright] ${e.message}` : e);
  process.exit(1);
}
