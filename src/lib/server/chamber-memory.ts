/**
 * Facts kept in memory between requests, because the hottest questions ask for them every
 * time: per chamber (its rulebook adoptions, its roster's names) and per measure (its tree as
 * read). Kept only while this process hears NOTIFY — sent by triggers whenever the underlying
 * tables change, whoever writes (drizzle/0006, 0007) — and forgotten on the notice, when LISTEN
 * drops, and after MEMORY_TTL_MS. A value loaded while a notice arrived is not kept, and a kept
 * value is used only once this process has heard every notice committed before the request
 * (`caughtUp` in ./notices.ts), so a write on any server is seen by the next request anywhere.
 *
 *   gw_chamber  payload: chamber id ('' = every chamber)  → chamber facts, and the chamber's measures
 *   gw_measure  payload: measure id                        → that measure's facts
 */
import { caughtUp, isListening, onListenChange, onNotice } from "./notices.ts";

export const CHAMBER_CHANNEL = "gw_chamber";
export const MEASURE_CHANNEL = "gw_measure";
const TTL_MS = Math.max(0, Number(process.env.GAVELWRIGHT_MEMORY_MS ?? 60_000) || 0);
const MAX_ENTRIES = 2000;

interface Entry {
  at: number;
  chamberId: string;
  value: unknown;
}
const chamberStores = new Set<Map<string, Entry>>();
const measureStores = new Set<Map<string, Entry>>();
let generation = 0;
let subscribed: Promise<unknown> | null = null;

/** Forget what is held of `chamberId` (its facts and its measures'), or of every chamber. */
export function forgetChamber(chamberId?: string): void {
  generation++;
  for (const s of [...chamberStores, ...measureStores]) {
    if (!chamberId) s.clear();
    else for (const [k, e] of s) if (e.chamberId === chamberId) s.delete(k);
  }
}

/** Forget what is held of one measure. */
export function forgetMeasure(measureId: string): void {
  generation++;
  for (const s of measureStores) s.delete(measureId);
}

onListenChange(() => forgetChamber());

function subscribe() {
  subscribed ??= Promise.all([onNotice(CHAMBER_CHANNEL, (p) => forgetChamber(p || undefined)), onNotice(MEASURE_CHANNEL, (p) => forgetMeasure(p))]).catch(() => {
    subscribed = null; // unreachable database: try again later
  });
}

async function recall<T>(store: Map<string, Entry>, key: string, chamberId: string, load: () => Promise<T>, stillGood?: (value: T) => boolean): Promise<T> {
  if (TTL_MS === 0) return load();
  subscribe();
  // Only after hearing every notice committed before now (a write on any server).
  if (store.has(key) && (await caughtUp())) {
    const hit = store.get(key);
    if (hit && hit.chamberId === chamberId && Date.now() - hit.at < TTL_MS && (!stillGood || stillGood(hit.value as T))) return hit.value as T;
  }
  const now = Date.now();
  const before = generation;
  const value = await load();
  if (before === generation && isListening()) {
    if (store.size >= MAX_ENTRIES) store.delete(store.keys().next().value!);
    store.set(key, { at: now, chamberId, value });
  }
  return value;
}

/** `load(chamberId)`, remembered per chamber under the rules above. Callers must not mutate the value. */
export function chamberMemory<T>(load: (chamberId: string) => Promise<T>): (chamberId: string) => Promise<T> {
  const store = new Map<string, Entry>();
  chamberStores.add(store);
  return (chamberId) => recall(store, chamberId, chamberId, () => load(chamberId));
}

/**
 * `load(chamberId, measureId)`, remembered per measure under the rules above; `stillGood` can
 * refuse a remembered value on facts that change without a write (the rulebook in force on a
 * date). Callers must not mutate the value.
 */
export function measureMemory<T>(load: (chamberId: string, measureId: string) => Promise<T>, stillGood?: (value: T) => boolean): (chamberId: string, measureId: string) => Promise<T> {
  const store = new Map<string, Entry>();
  measureStores.add(store);
  return (chamberId, measureId) => recall(store, measureId, chamberId, () => load(chamberId, measureId), stillGood);
}
