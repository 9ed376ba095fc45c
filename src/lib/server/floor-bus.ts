/**
 * Fan-out of floor changes across app servers through PostgreSQL LISTEN/NOTIFY (the process's
 * one LISTEN connection, ./notices.ts), relayed to this process's subscribers (the open event
 * streams). Writers call notifyFloor inside the transaction that records the change, so a
 * notice is delivered exactly when the change commits, and never for a rolled-back one.
 */
import { sql as dsql } from "drizzle-orm";
import { z } from "zod";
import type { Tx } from "./db.ts";
import { onNotice } from "./notices.ts";

export const FLOOR_CHANNEL = "gw_floor";

export const floorNoticeSchema = z.object({ chamberId: z.string(), sittingId: z.string(), revision: z.number().int(), kind: z.string() });
export type FloorNotice = z.output<typeof floorNoticeSchema>;

/** Receive every floor notice from any server; resolves once LISTEN is in place. Returns the unsubscribe. */
export function subscribeFloor(fn: (n: FloorNotice) => void): Promise<() => void> {
  return onNotice(FLOOR_CHANNEL, (payload) => {
    const r = floorNoticeSchema.safeParse((() => { try { return JSON.parse(payload); } catch { return null; } })());
    if (r.success) fn(r.data);
  });
}

/** Queue a notice in the transaction `tx`: PostgreSQL delivers it at commit. */
export async function notifyFloor(tx: Tx, notice: FloorNotice): Promise<void> {
  await tx.execute(dsql`SELECT pg_notify(${FLOOR_CHANNEL}, ${JSON.stringify(notice)})`);
}
