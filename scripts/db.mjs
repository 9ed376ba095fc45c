// The project-local PostgreSQL cluster, and backups of the app database:
//   npm run db:start | db:stop | db:status
//   npm run db:backup [-- FILE]      pg_dump (custom format) of DATABASE_URL, default backups/gavelwright-<time>.dump
//   npm run db:restore -- FILE       pg_restore into DATABASE_URL, replacing what is there (asks for --yes)
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { ensureDatabase, loadEnvFile, log, pgStatus, pgStop, pgTool, ROOT, SetupError } from "./lib/setup.mjs";

const [cmd, ...args] = process.argv.slice(2);
const redact = (url) => url.replace(/:[^:@/]+@/, ":***@");

function backup(file) {
  const url = ensureDatabase();
  const out = resolve(file ?? join(ROOT, "backups", `gavelwright-${new Date().toISOString().replace(/[:.]/g, "-")}.dump`));
  mkdirSync(dirname(out), { recursive: true });
  const r = spawnSync(pgTool("pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${out}`, url], { encoding: "utf8" });
  if (r.status !== 0) throw new SetupError(`pg_dump failed: ${r.stderr.trim()}`);
  log(`backed up ${redact(url)} to ${out} (${statSync(out).size} bytes)`);
}

function restore(file, yes) {
  if (!file) throw new SetupError("name the backup file: npm run db:restore -- FILE --yes");
  const path = resolve(file);
  if (!existsSync(path)) throw new SetupError(`no such backup file: ${path}`);
  const url = ensureDatabase();
  if (!yes) throw new SetupError(`restoring replaces every table in ${redact(url)}. Run again with --yes to go ahead.`);
  const list = spawnSync(pgTool("pg_restore"), ["--list", path], { encoding: "utf8" });
  if (list.status !== 0) throw new SetupError(`${path} is not a pg_dump custom-format backup: ${list.stderr.trim()}`);
  const r = spawnSync(pgTool("pg_restore"), ["--clean", "--if-exists", "--no-owner", "--no-privileges", "--single-transaction", "--exit-on-error", `--dbname=${url}`, path], { encoding: "utf8" });
  if (r.status !== 0) throw new SetupError(`pg_restore failed (nothing was changed: it ran in one transaction): ${r.stderr.trim()}`);
  // Running app servers keep a few facts in memory for seconds (who is signed in, rulebook
  // adoptions): tell them to forget everything (drizzle/0006_change_notices.sql).
  spawnSync(pgTool("psql"), [url, "-q", "-c", "NOTIFY gw_access, '*'", "-c", "NOTIFY gw_chamber, ''"], { encoding: "utf8" });
  log(`restored ${path} into ${redact(url)}`);
}

try {
  loadEnvFile();
  if (cmd === "start") log(`DATABASE_URL=${redact(ensureDatabase())}`);
  else if (cmd === "stop") pgStop();
  else if (cmd === "status") console.log(JSON.stringify(pgStatus(), null, 2));
  else if (cmd === "backup") backup(args.find((a) => !a.startsWith("--")));
  else if (cmd === "restore") restore(args.find((a) => !a.startsWith("--")), args.includes("--yes"));
  else {
    console.error("usage: node scripts/db.mjs start|stop|status|backup [FILE]|restore FILE --yes");
    process.exit(2);
  }
} catch (e) {
  console.error(e instanceof SetupError ? `[gavelwright] ${e.message}` : e);
  process.exit(1);
}
