// The production server: the Astro build (adapter in middleware mode) behind Node's own HTTP
// server. Files of the client build are served from disk; every other request goes straight to
// the app. (The adapter's standalone server looks on disk for every request, API calls
// included, before handing it to the app; here the list of client files is read once at
// start-up, since a build never changes under a running server.)
//
//   node scripts/serve.mjs                       # serves dist/ on HOST:PORT (127.0.0.1:4321)
//   GAVELWRIGHT_OUT_DIR=.build/x node scripts/serve.mjs
//   GAVELWRIGHT_WORKERS=2 node scripts/serve.mjs # several processes sharing the port (node:cluster)
//
// TLS: SERVER_CERT_PATH and SERVER_KEY_PATH, as with the adapter's own server.
import cluster from "node:cluster";
import { readdirSync, readFileSync } from "node:fs";
import http from "node:http";
import https from "node:https";
import { isIP } from "node:net";
import { isAbsolute, join, relative, resolve, sep } from "node:path";
import { pathToFileURL } from "node:url";
import send from "send";

const ROOT = resolve(import.meta.dirname, "..");
const OUT_DIR = resolve(ROOT, process.env.GAVELWRIGHT_OUT_DIR ?? "dist");
const HOST = process.env.HOST ?? "127.0.0.1";
const PORT = Number(process.env.PORT ?? 4321);
const WORKERS = Number(process.env.GAVELWRIGHT_WORKERS ?? 1);

if (!Number.isInteger(WORKERS) || WORKERS < 1 || WORKERS > 64) {
  console.error(`[gavelwright] GAVELWRIGHT_WORKERS must be a whole number from 1 to 64 (got "${process.env.GAVELWRIGHT_WORKERS}")`);
  process.exit(2);
}

// TRUSTED_PROXIES (src/lib/server/client-address.ts reads it): refuse to start on a malformed
// entry rather than mis-read client addresses.
for (const entry of (process.env.TRUSTED_PROXIES ?? "").split(/[\s,]+/).filter(Boolean)) {
  const [addr, prefix, ...rest] = entry.split("/");
  const family = isIP(addr ?? "");
  const max = family === 4 ? 32 : 128;
  if (!family || rest.length > 0 || (prefix !== undefined && !(/^\d{1,3}$/.test(prefix) && Number(prefix) <= max))) {
    console.error(`[gavelwright] TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range (e.g. 10.0.0.0/8, 192.0.2.7, fd00::/8)`);
    process.exit(2);
  }
}

if (WORKERS > 1 && cluster.isPrimary) runPrimary();
else await serve();

/** Fork the workers; replace one that dies unexpectedly, at most once every few seconds. */
function runPrimary() {
  let stopping = false;
  const lastRestart = new Map();
  const fork = (slot) => cluster.fork({ GAVELWRIGHT_WORKER_SLOT: String(slot) }).on("exit", (code, signal) => {
    if (stopping) return;
    console.error(`[gavelwright] server process ${slot} ended (${signal ?? `exit code ${code}`}); starting a new one`);
    const wait = Math.max(0, 3000 - (Date.now() - (lastRestart.get(slot) ?? 0)));
    setTimeout(() => {
      lastRestart.set(slot, Date.now());
      fork(slot);
    }, wait);
  });
  for (let i = 0; i < WORKERS; i++) fork(i);
  const stop = () => {
    stopping = true;
    for (const w of Object.values(cluster.workers ?? {})) w?.kill("SIGTERM");
    setTimeout(() => process.exit(0), 2000).unref();
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

/** Every file of the client build, as the URL path it is served under. */
function clientFiles(dir) {
  const paths = new Set();
  const walk = (d) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const full = join(d, e.name);
      if (e.isDirectory()) walk(full);
      else if (e.isFile()) paths.add("/" + relative(dir, full).split(sep).join("/"));
    }
  };
  walk(dir);
  return paths;
}

async function serve() {
  const entry = join(OUT_DIR, "server", "entry.mjs");
  const { handler, options } = await import(pathToFileURL(entry).href).catch((e) => {
    console.error(`[gavelwright] cannot load the build at ${entry}: run \`npm run build\` first (${e.message})`);
    process.exit(1);
  });
  if (options?.mode !== "middleware") {
    console.error(`[gavelwright] ${entry} was built for the adapter's ${options?.mode} mode; rebuild with \`npm run build\``);
    process.exit(1);
  }
  const clientDir = join(OUT_DIR, "client");
  const files = clientFiles(clientDir);
  const assetsPrefix = `/${options.assets ?? "_astro"}/`;

  const listener = (req, res) => {
    const path = (req.url ?? "/").split(/[?#]/, 1)[0];
    let decoded;
    try {
      decoded = decodeURIComponent(path);
    } catch {
      res.writeHead(400, { "content-type": "text/plain; charset=utf-8" }).end("Bad request: the address is not valid URL encoding.");
      return;
    }
    if ((req.method === "GET" || req.method === "HEAD") && files.has(decoded)) {
      const stream = send(req, decoded, { root: clientDir, dotfiles: "deny", index: false });
      stream.on("headers", (r) => {
        r.setHeader("x-content-type-options", "nosniff");
        if (decoded.startsWith(assetsPrefix)) r.setHeader("cache-control", "public, max-age=31536000, immutable");
      });
      stream.on("error", (err) => {
        res.statusCode = err.status ?? 500;
        res.end();
      });
      stream.pipe(res);
      return;
    }
    // The connection's peer address reaches the app in locals, where no header can forge it;
    // the app reads X-Forwarded-For only when this peer is in TRUSTED_PROXIES
    // (src/lib/server/client-address.ts).
    handler(req, res, undefined, { peerAddress: req.socket.remoteAddress });
  };

  const certPath = process.env.SERVER_CERT_PATH;
  const keyPath = process.env.SERVER_KEY_PATH;
  const server = certPath && keyPath ? https.createServer({ cert: readFileSync(certPath), key: readFileSync(keyPath) }, listener) : http.createServer(listener);
  server.keepAliveTimeout = 5000;
  server.listen(PORT, HOST, () => {
    if (cluster.isPrimary || process.env.GAVELWRIGHT_WORKER_SLOT === "0")
      console.log(`[gavelwright] serving ${isAbsolute(OUT_DIR) ? relative(ROOT, OUT_DIR) || "." : OUT_DIR} at ${certPath ? "https" : "http"}://${HOST}:${PORT}${WORKERS > 1 ? ` with ${WORKERS} processes` : ""}`);
  });
  const stop = () => {
    server.close();
    server.closeAllConnections?.();
    setTimeout(() => process.exit(0), 500).unref();
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}
