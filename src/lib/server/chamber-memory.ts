/**
 * Small per-chamber facts kept in memory between requests (the rulebook adoptions, the roster's
 * names), because the hottest questions ask for them every time. Kept only while this process
 * hears NOTIFY gw_chamber — sent by triggers whenever those tables change, whoever writes
 * (drizzle/0006_change_notices.sql) — and forgotten on the notice, when LISTEN drops, after
 * CHAMBER_MEMORY_TTL_MS, and by writers in this process right after they commit (`forgetChamber`).
 * A value loaded while a notice arrived is not kept.
 */
import { isListening, onListenChange, onNotice } from "./notices.ts";

export const CHAMBER_CHANNEL = "gw_chamber";
const TTL_MS = Math.max(0, Number(process.env.GAVELWRIGHT_CHAMBER_MEMORY_MS ?? 60_000) || 0);
const MAX_CHAMBERS = 1000;

interface Store {
  entries: Map<string, { at: number; value: unknown }>;
}
const stores = new Set<Store>();
let generation = 0;
let subscribed: Promise<unknown> | null = null;

/** Forget what any store holds of `chamberId`, or of every chamber. */
export function forgetChamber(chamberId?: string): void {
  generation++;
  for (const s of stores) chamberId ? s.entries.delete(chamberId) : s.entries.clear();
}

onListenChange(() => forgetChamber());

function subscribe() {
  subscribed ??= onNotice(CHAMBER_CHANNEL, (payload) => forgetChamber(payload || undefined)).catch(() => {
    subscribed = null; // unreachable database: try again later
  });
}

/** `load(chamberId)`, remembered per chamber under the rules above. */
export function chamberMemory<T>(load: (chamberId: string) => Promise<T>): (chamberId: string) => Promise<T> {
  const store: Store = { entries: new Map() };
  stores.add(store);
  return async (chamberId) => {
    if (TTL_MS === 0) return load(chamberId);
    subscribe();
    const now = Date.now();
    const hit = store.entries.get(chamberId);
    if (hit && isListening() && now - hit.at < TTL_MS) return hit.value as T;
    const before = generation;
    const value = await load(chamberId);
    if (before === generation && isListening()) {
      if (store.entries.size >= MAX_CHAMBERS) store.entries.delete(store.entries.keys().next().value!);
      store.entries.set(chamberId, { at: now, value });
    }
    return value;
  };
}
