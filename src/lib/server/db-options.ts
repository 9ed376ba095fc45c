// Connection settings shared by every postgres.js client of the server (the pool in db.ts, the
// LISTEN connection in notices.ts). No side effects: importing this opens no connection.

/**
 * Seconds to wait for a connection to the database before giving up, so that during an outage
 * a request answers 503 promptly instead of hanging (DATABASE_CONNECT_TIMEOUT, default 2).
 */
export function connectTimeout(): number {
  const v = Number(process.env.DATABASE_CONNECT_TIMEOUT ?? 2);
  return Number.isFinite(v) && v > 0 ? v : 2;
}

/**
 * Seconds before a closed connection of the pool tries again (postgres.js `backoff`). The driver's
 * default grows as 3^n/100 s up to 20 s, counted over the whole pool, and requests queued behind the
 * pool wait out that delay: during an outage they hung for up to 20 s before their 503, and after the
 * database came back the pool reconnected only when the delay ran out (tests/faults). A refused
 * connection costs nothing, so try again within half a second at most.
 */
export function reconnectBackoff(retries: number): number {
  return Math.min(0.05 * 2 ** retries, 0.5);
}
