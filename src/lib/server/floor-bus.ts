/**
 * Fan-out of floor changes across app servers through PostgreSQL LISTEN/NOTIFY. Each process
 * holds one LISTEN connection (postgres.js keeps a single dedicated connection for all of a
 * client's listens) and relays notices to its own subscribers (the open event streams).
 * Writers call notifyFloor inside the transaction that records the change, so a notice is
 * delivered exactly when the change commits, and never for a rolled-back one.
 */
import { sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { sql, type Tx } from "./db.ts";

export const FLOOR_CHANNEL = "gw_floor";

export const floorNoticeSchema = z.object({ chamberId: z.string(), sittingId: z.string(), revision: z.number().int(), kind: z.string() });
export type FloorNotice = z.output<typeof floorNoticeSchema>;

type Listener = (n: FloorNotice) => void;
const listeners = new Set<Listener>();
let listening: Promise<unknown> | null = null;

function ensureListening(): Promise<unknown> {
  listening ??= sql
    .listen(FLOOR_CHANNEL, (payload) => {
      const r = floorNoticeSchema.safeParse((() => { try { return JSON.parse(payload); } catch { return null; } })());
      if (!r.success) return;
      for (const fn of listeners) {
        try {
          fn(r.data);
        } catch (e) {
          console.error("[floor] subscriber failed:", e);
        }
      }
    })
    .catch((e) => {
      listening = null;
      throw e;
    });
  return listening;
}

/** Receive every floor notice from any server; resolves once LISTEN is in place. Returns the unsubscribe. */
export async function subscribeFloor(fn: Listener): Promise<() => void> {
  listeners.add(fn);
  try {
    await ensureListening();
  } catch (e) {
    listeners.delete(fn);
    throw e;
  }
  return () => void listeners.delete(fn);
}

/** Queue a notice in the transaction `tx`: PostgreSQL delivers it at commit. */
export async function notifyFloor(tx: Tx, notice: FloorNotice): Promise<void> {
  await tx.execute(dsql`SELECT pg_notify(${FLOOR_CHANNEL}, ${JSON.stringify(notice)})`);
}
