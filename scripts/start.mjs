// npm start: install what is missing, start PostgreSQL and the mail catcher, migrate, seed the
// demo chamber, build, and serve. Stop with Ctrl-C (PostgreSQL keeps running: npm run db:stop).
import { spawn } from "node:child_process";
import { join } from "node:path";
import { build, ensureDatabase, ensureEnvFile, ensureNodeModules, loadEnvFile, log, ROOT, runTs, SetupError } from "./lib/setup.mjs";

const children = [];
function stopAll(code = 0) {
  for (const c of children) if (c.exitCode === null) c.kill("SIGTERM");
  setTimeout(() => process.exit(code), 300).unref();
}

try {
  ensureNodeModules();
  ensureEnvFile();
  loadEnvFile();
  const env = { ...process.env, ASTRO_TELEMETRY_DISABLED: "1" };
  env.DATABASE_URL = ensureDatabase();
  env.HOST ??= "127.0.0.1";
  env.PORT ??= "4321";
  env.BETTER_AUTH_URL ??= `http://${env.HOST === "0.0.0.0" ? "127.0.0.1" : env.HOST}:${env.PORT}`;
  if (!env.SMTP_HOST) {
    env.SMTP_HOST = "127.0.0.1";
    env.SMTP_PORT ??= "2525";
    env.GAVELWRIGHT_DEV_MAILBOX = "1";
  }
  runTs("scripts/migrate.ts", env);
  runTs("scripts/seed.ts", env);
  build(env);
  if (env.GAVELWRIGHT_DEV_MAILBOX === "1") {
    const catcher = spawn(process.execPath, [join(ROOT, "node_modules", "tsx", "dist", "cli.mjs"), "scripts/mail-catcher.ts"], { cwd: ROOT, env, stdio: "inherit" });
    children.push(catcher);
  }
  const server = spawn(process.execPath, ["scripts/serve.mjs"], { cwd: ROOT, env, stdio: "inherit" });
  children.push(server);
  server.on("exit", (code) => stopAll(code ?? 0));
  process.on("SIGINT", () => stopAll(0));
  process.on("SIGTERM", () => stopAll(0));
  const { DEMO_ACCOUNTS } = await import("./lib/demo-accounts.mjs");
  log(`Gavelwright is starting at ${env.BETTER_AUTH_URL}`);
  log("demo accounts (fictional chambers; see README.md):");
  for (const a of DEMO_ACCOUNTS) log(`  ${a.role.padEnd(12)} ${a.email.padEnd(34)} password: ${a.password}   (${a.chamber})`);
  if (env.GAVELWRIGHT_DEV_MAILBOX === "1") log(`outgoing mail is caught locally on 127.0.0.1:${env.SMTP_PORT}; the chief clerk sees it at /dev/mail`);
} catch (e) {
  console.error(e instanceof SetupError ? `[gavelwright] ${e.message}` : e);
  stopAll(1);
}
