/**
 * Fault-test harness: a throwaway PostgreSQL cluster on its own port (so restarting it disturbs
 * no other test), the built app served against it, and helpers to sign in and to kill things.
 * The server is scripts/serve.mjs over the build in GAVELWRIGHT_SERVER_BUILD (scripts/test.mjs
 * passes the build it made for the browser tests) or, when unset, a build made here into .build/faults.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { chownSync, existsSync, mkdtempSync, rmSync, appendFileSync, chmodSync, mkdirSync, readdirSync } from "node:fs";
import { createServer } from "node:net";
import { join, resolve } from "node:path";
import { vi } from "vitest";

export const ROOT = resolve(import.meta.dirname, "../..");
const isRoot = process.getuid?.() === 0;

function pgBin(): string {
  const base = "/usr/lib/postgresql";
  const v = readdirSync(base).filter((d) => existsSync(join(base, d, "bin", "initdb"))).sort((a, b) => Number(b) - Number(a))[0];
  if (!v) throw new Error("PostgreSQL server binaries not found under /usr/lib/postgresql");
  return join(base, v, "bin");
}

function asOwner(bin: string, args: string[]) {
  const r = isRoot ? spawnSync("runuser", ["-u", "postgres", "--", bin, ...args], { encoding: "utf8" }) : spawnSync(bin, args, { encoding: "utf8" });
  if (r.status !== 0) throw new Error(`${bin} ${args.join(" ")} failed: ${r.stdout}\n${r.stderr}`);
  return r;
}

function asOwnerAsync(bin: string, args: string[]): Promise<void> {
  return new Promise((res, rej) => {
    const p = isRoot ? spawn("runuser", ["-u", "postgres", "--", bin, ...args], { stdio: "ignore" }) : spawn(bin, args, { stdio: "ignore" });
    p.on("exit", (code) => (code === 0 ? res() : rej(new Error(`${bin} ${args.join(" ")} exited ${code}`))));
  });
}

export async function freePort(): Promise<number> {
  return new Promise((res, rej) => {
    const srv = createServer();
    srv.unref();
    srv.on("error", rej);
    srv.listen(0, "127.0.0.1", () => {
      const port = (srv.address() as { port: number }).port;
      srv.close(() => res(port));
    });
  });
}

export interface Cluster {
  port: number;
  url(db: string): string;
  start(): Promise<void>;
  stop(mode?: "fast" | "immediate"): Promise<void>;
  destroy(): void;
}

export async function startCluster(): Promise<Cluster> {
  const bin = pgBin();
  const dir = mkdtempSync("/var/tmp/gw-faults-");
  const pgdata = join(dir, "pg");
  mkdirSync(pgdata);
  if (isRoot) {
    const uid = Number(spawnSync("id", ["-u", "postgres"], { encoding: "utf8" }).stdout.trim());
    const gid = Number(spawnSync("id", ["-g", "postgres"], { encoding: "utf8" }).stdout.trim());
    chownSync(dir, uid, gid);
    chownSync(pgdata, uid, gid);
  }
  chmodSync(pgdata, 0o700);
  const port = await freePort();
  asOwner(join(bin, "initdb"), ["-D", pgdata, "-U", "gavelwright", "--auth=trust", "-E", "UTF8", "--locale=C.UTF-8"]);
  const conf = join(pgdata, "postgresql.conf");
  // Appended as the owner would: the file belongs to postgres, but root may write it.
  // synchronous_commit stays on, as in production: with it off, a commit acknowledged just before an
  // immediate (crash) stop is lost with the WAL buffers, and the crash test then lost the session
  // it had just signed in with (every answer after the restart was 401). fsync = off only matters
  // when the machine itself goes down, which these tests never do.
  appendFileSync(conf, `\nlisten_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = '${dir}'\nfsync = off\nmax_connections = 100\n`);
  const log = join(dir, "postgres.log");
  // Asynchronous, so requests in flight in this process keep running while the cluster stops.
  const start = () => asOwnerAsync(join(bin, "pg_ctl"), ["-D", pgdata, "-l", log, "-w", "-t", "60", "start"]);
  const stop = (mode: "fast" | "immediate" = "fast") => asOwnerAsync(join(bin, "pg_ctl"), ["-D", pgdata, "-m", mode, "-w", "stop"]);
  await start();
  return {
    port,
    url: (db) => `postgres://gavelwright@127.0.0.1:${port}/${db}`,
    start,
    stop,
    destroy() {
      spawnSync(isRoot ? "runuser" : join(bin, "pg_ctl"), isRoot ? ["-u", "postgres", "--", join(bin, "pg_ctl"), "-D", pgdata, "-m", "immediate", "-w", "stop"] : ["-D", pgdata, "-m", "immediate", "-w", "stop"]);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export function createDatabase(cluster: Cluster, name: string): string {
  const r = spawnSync("psql", [cluster.url("postgres"), "-qAtc", `CREATE DATABASE ${name}`], { encoding: "utf8" });
  if (r.status !== 0) throw new Error(r.stderr);
  return cluster.url(name);
}

export function runScript(script: string, env: Record<string, string>): void {
  const r = spawnSync(process.execPath, [join(ROOT, "node_modules", "tsx", "dist", "cli.mjs"), script], { cwd: ROOT, env: { ...process.env, ...env }, encoding: "utf8" });
  if (r.status !== 0) throw new Error(`${script} failed: ${r.stdout}\n${r.stderr}`);
}

/** The build folder to serve: the one scripts/test.mjs built, or a fresh build into .build/faults. */
export function serverBuild(): string {
  const given = process.env.GAVELWRIGHT_SERVER_BUILD;
  if (given) return given;
  const out = join(ROOT, ".build", "faults");
  const r = spawnSync(process.execPath, [join(ROOT, "node_modules", "astro", "astro.js"), "build"], { cwd: ROOT, env: { ...process.env, ASTRO_TELEMETRY_DISABLED: "1", GAVELWRIGHT_OUT_DIR: out, GAVELWRIGHT_CACHE_DIR: join(ROOT, ".build", "faults-cache") }, encoding: "utf8" });
  if (r.status !== 0) throw new Error(`astro build failed: ${r.stdout}\n${r.stderr}`);
  return out;
}

export interface Server {
  base: string;
  proc: ChildProcess;
  output(): string;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

export async function startServer(build: string, env: Record<string, string>, port: number): Promise<Server> {
  const base = `http://127.0.0.1:${port}`;
  const chunks: string[] = [];
  const proc = spawn(process.execPath, [join(ROOT, "scripts", "serve.mjs")], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: "production", HOST: "127.0.0.1", PORT: String(port), BETTER_AUTH_URL: base, BETTER_AUTH_SECRET: "faults-test-secret-0123456789abcdef0123", GAVELWRIGHT_RATE_LIMIT: "off", GAVELWRIGHT_OUT_DIR: build, ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  proc.stdout!.on("data", (d) => chunks.push(String(d)));
  proc.stderr!.on("data", (d) => chunks.push(String(d)));
  // Wait for the first answer (vi.waitFor retries; no sleeping); a server that exits says why.
  await vi.waitFor(
    async () => {
      if (proc.exitCode !== null) throw new Error(`server exited: ${chunks.join("")}`);
      if ((await fetch(`${base}/sign-in`)).status >= 500) throw new Error("server not ready");
    },
    { timeout: 60_000, interval: 100 },
  );
  return {
    base,
    proc,
    output: () => chunks.join(""),
    kill: (signal = "SIGTERM") =>
      new Promise((res) => {
        if (proc.exitCode !== null || proc.signalCode !== null) return res();
        proc.once("exit", () => res());
        proc.kill(signal);
      }),
  };
}

/** Sign in over HTTP as the browser does; returns the Cookie header value. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${base}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: base }, body: JSON.stringify({ email, password }) });
  if (!r.ok) throw new Error(`sign-in ${email}: ${r.status} ${await r.text()}`);
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}
