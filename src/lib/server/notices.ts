/**
 * PostgreSQL LISTEN/NOTIFY for this server process: one dedicated connection listens on every
 * channel the app uses and hands each notice to the channel's handlers.
 *
 * The connection can drop (PostgreSQL restarted, network). While it is down, notices sent by
 * other servers are lost, so whoever relies on them must know: `isListening()` says whether
 * LISTEN is in place now, and `onListenChange` hooks run when it is lost and when it is back.
 * After a drop the bus retries by itself (1 s, then up to every 5 s) as long as anyone listens.
 */
import { randomUUID } from "node:crypto";
import postgres from "postgres";
import { connectTimeout, reconnectBackoff } from "./db-options.ts";
import { describeError } from "./log-safe.ts";

/** How the LISTEN connection shows in pg_stat_activity. */
export const NOTICES_APPLICATION_NAME = "gavelwright-notices";

type Handler = (payload: string) => void;
type ChangeHook = (listening: boolean) => void;

const handlers = new Map<string, Set<Handler>>();
const changeHooks = new Set<ChangeHook>();
let conn: postgres.Sql | null = null;
let listening = false;
let pending: Promise<void> | null = null;
let retryTimer: NodeJS.Timeout | null = null;
let retryDelay = 1000;

function connection(): postgres.Sql {
  if (conn) return conn;
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set");
  // `onnotify` is what postgres.js's own sql.listen() is built on (it is not in its type
  // definitions); using it directly lets this module see the connection close (`onclose`).
  const options: postgres.Options<Record<string, postgres.PostgresType>> & { onnotify: (channel: string, payload: string) => void } = {
    max: 1,
    idle_timeout: 0,
    max_lifetime: null,
    fetch_types: false,
    connect_timeout: connectTimeout(),
    backoff: reconnectBackoff,
    connection: { application_name: NOTICES_APPLICATION_NAME },
    onnotice: () => {},
    onnotify: (channel, payload) => dispatch(channel, payload),
    // Only the connection in use: one set aside (below) must not unsettle its successor.
    onclose: () => {
      if (conn === created) lost();
    },
  };
  const created = postgres(url, options);
  conn = created;
  return created;
}

/**
 * How long a statement on the LISTEN connection may take before the connection is given up:
 * past the connect timeout, with room to spare. Each is tiny (LISTEN, pg_notify).
 */
const STATEMENT_DEADLINE_MS = Math.max(3000, connectTimeout() * 1000 + 1000);

/**
 * Run a statement on the LISTEN connection, with a deadline. postgres.js (3.4.9) can leave a
 * statement unanswered for good when PostgreSQL is restarted under it; tests/faults saw pg_notify
 * hang that way, and every request waiting on `caughtUp` with it. Past the deadline the statement
 * is refused, the connection is set aside (closed in the background) and the next statement opens
 * a new one, so neither a request nor the reconnection waits on a lost answer.
 */
async function onListenConnection<T>(run: (c: postgres.Sql) => Promise<T>): Promise<T> {
  const c = connection();
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => {
      if (conn === c) {
        conn = null;
        lost();
      }
      c.end({ timeout: 0 }).catch(() => {});
      reject(new Error(`no answer on the LISTEN connection within ${STATEMENT_DEADLINE_MS} ms; it was replaced`));
    }, STATEMENT_DEADLINE_MS);
    timer.unref();
  });
  try {
    return await Promise.race([run(c), late]);
  } finally {
    clearTimeout(timer);
  }
}

function dispatch(channel: string, payload: string) {
  for (const fn of handlers.get(channel) ?? []) {
    try {
      fn(payload);
    } catch (e) {
      console.error(`[notices] a ${channel} handler failed:`, describeError(e));
    }
  }
}

function setListening(value: boolean) {
  if (listening === value) return;
  listening = value;
  for (const hook of changeHooks) hook(value);
}

const quoted = (channel: string) => `"${channel.replace(/"/g, '""')}"`;

/** LISTEN on every channel that has handlers; resolves when all are in place. */
function listenAll(): Promise<void> {
  pending ??= (async () => {
    for (const channel of handlers.keys()) await onListenConnection((c) => c.unsafe(`LISTEN ${quoted(channel)}`));
    retryDelay = 1000;
    setListening(true);
  })().finally(() => {
    pending = null;
  });
  return pending;
}

function lost() {
  setListening(false);
  if (handlers.size > 0) scheduleRetry();
}

function scheduleRetry() {
  if (retryTimer) return;
  retryTimer = setTimeout(() => {
    retryTimer = null;
    listenAll().catch((e) => {
      console.error("[notices] LISTEN failed, retrying:", describeError(e));
      retryDelay = Math.min(retryDelay * 2, 5000);
      scheduleRetry();
    });
  }, retryDelay);
  retryTimer.unref();
}

/**
 * Receive every notice on `channel` from any server. Resolves once LISTEN is in place (rejects
 * if the database cannot be reached; the bus keeps retrying). Returns the unsubscribe.
 */
export async function onNotice(channel: string, fn: Handler): Promise<() => void> {
  let set = handlers.get(channel);
  const isNew = !set;
  if (!set) handlers.set(channel, (set = new Set()));
  set.add(fn);
  const off = () => {
    set.delete(fn);
  };
  try {
    if (isNew && listening) await onListenConnection((c) => c.unsafe(`LISTEN ${quoted(channel)}`));
    else if (!listening) await listenAll();
  } catch (e) {
    off();
    scheduleRetry();
    throw e;
  }
  return off;
}

/** Whether LISTEN is in place right now (notices from other servers are arriving). */
export function isListening(): boolean {
  return listening;
}

/** Run `hook(false)` when the LISTEN connection is lost and `hook(true)` when it is back. */
export function onListenChange(hook: ChangeHook): () => void {
  changeHooks.add(hook);
  return () => void changeHooks.delete(hook);
}

const FENCE_CHANNEL = "gw_fence";
const FENCE_WAIT_MS = 2000;
const QUIET_AFTER_LOST_NOTICE_MS = 30_000;
const fences = new Map<string, () => void>();
let fenceListening: Promise<unknown> | null = null;
let inflight: Promise<boolean> | null = null;
let next: Promise<boolean> | null = null;

/**
 * Resolves true once this process has heard every notice of every transaction that committed
 * before the call, false when that cannot be known now (then whatever was remembered has been
 * forgotten). How: send a notice of our own and wait for it to come back — PostgreSQL delivers
 * notices in commit order, so everything committed earlier has been handed to its handlers by
 * then. Calls made while one such round trip is in flight share the next one, so under load one
 * round trip serves many requests. What is remembered is used only after this (read your writes,
 * and anyone else's, on every server).
 */
export function caughtUp(): Promise<boolean> {
  if (!listening) return Promise.resolve(false);
  if (!inflight) {
    inflight = roundTrip().finally(() => {
      inflight = null;
    });
    return inflight;
  }
  // The one in flight may have been sent before this call: wait for the next.
  next ??= inflight.then(() => {
    next = null;
    return caughtUp();
  });
  return next;
}

async function roundTrip(): Promise<boolean> {
  let timedOut = false;
  try {
    fenceListening ??= onNotice(FENCE_CHANNEL, (token) => fences.get(token)?.()).catch((e) => {
      fenceListening = null;
      throw e;
    });
    await fenceListening;
    const token = randomUUID();
    let timer: NodeJS.Timeout | undefined;
    const back = new Promise<boolean>((resolve) => {
      fences.set(token, () => resolve(true));
      timer = setTimeout(() => resolve(false), FENCE_WAIT_MS);
    });
    try {
      await onListenConnection((c) => c`SELECT pg_notify(${FENCE_CHANNEL}, ${token})`);
      if (await back) return true;
      timedOut = true;
    } finally {
      clearTimeout(timer);
      fences.delete(token);
    }
  } catch {
    /* the database is away: the connection's close starts the reconnection */
  }
  for (const hook of changeHooks) hook(false);
  if (timedOut && listening) {
    // The notice was sent but never came back: notices do not reach this process (as behind a
    // transaction pooler). Remember nothing for a while rather than make every request wait.
    listening = false;
    if (retryTimer) clearTimeout(retryTimer);
    retryTimer = setTimeout(() => {
      retryTimer = null;
      if (handlers.size > 0) listenAll().catch(() => scheduleRetry());
    }, QUIET_AFTER_LOST_NOTICE_MS);
    retryTimer.unref();
  }
  return false;
}

/** Stop listening and close the connection (for scripts that end, such as the seed). */
export async function endNotices(): Promise<void> {
  handlers.clear();
  fenceListening = null;
  inflight = next = null;
  if (retryTimer) clearTimeout(retryTimer);
  retryTimer = null;
  const c = conn;
  conn = null;
  setListening(false);
  await c?.end({ timeout: 1 });
}
