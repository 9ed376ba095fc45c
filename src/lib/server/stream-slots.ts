/**
 * A cap on the live-floor event streams one user holds open in this server process
 * (GAVELWRIGHT_MAX_STREAMS_PER_USER, default 8): each open stream keeps a connection, a
 * subscriber and a heartbeat timer, so one account must not be able to hold hundreds. A browser
 * tab holds one; the cap leaves room for several tabs and a reconnect racing the old stream's end.
 * Counted per process (each process of GAVELWRIGHT_WORKERS has its own), released when the
 * stream ends for any reason.
 */
const open = new Map<string, number>();

export function maxStreamsPerUser(): number {
  const v = Number(process.env.GAVELWRIGHT_MAX_STREAMS_PER_USER ?? 8);
  return Number.isInteger(v) && v > 0 ? v : 8;
}

/** Take one of `userId`'s stream slots: the release function (idempotent), or null when all are taken. */
export function claimStreamSlot(userId: string): (() => void) | null {
  const n = open.get(userId) ?? 0;
  if (n >= maxStreamsPerUser()) return null;
  open.set(userId, n + 1);
  let released = false;
  return () => {
    if (released) return;
    released = true;
    const left = (open.get(userId) ?? 1) - 1;
    if (left > 0) open.set(userId, left);
    else open.delete(userId);
  };
}

/** Streams `userId` holds open in this process (for tests and diagnostics). */
export function openStreams(userId: string): number {
  return open.get(userId) ?? 0;
}
