/**
 * The one place where counts leave the engine: JSON numbers below 2^53 (exact in every JSON reader),
 * decimal strings at or above it.
 */
export type Count = number | bigint;
export type JsonCount = number | string;

export function countToJson(c: Count): JsonCount {
  const b = typeof c === "bigint" ? c : BigInt(c);
  return b < 9007199254740992n ? Number(b) : b.toString();
}

export function countsToJson(m: ReadonlyMap<string, Count> | Record<string, Count>): Record<string, JsonCount> {
  const entries = m instanceof Map ? [...m.entries()] : Object.entries(m);
  return Object.fromEntries(entries.map(([k, v]) => [k, countToJson(v)]));
}
