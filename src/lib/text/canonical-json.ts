/**
 * The one canonical JSON: JSON text with object keys sorted, so two equal values always print
 * the same (content hashes, the analysis cache key, "is this rulebook section unchanged?").
 * Otherwise exactly JSON.stringify's rules: `toJSON` is used (dates print as ISO text), a property
 * whose value is undefined (or a function) is left out, undefined in an array prints as null, as
 * do NaN and ±Infinity, and a value that is undefined at the top prints as null.
 */
export function canonicalJson(v: unknown): string {
  if (v !== null && typeof v === "object" && typeof (v as { toJSON?: unknown }).toJSON === "function") return canonicalJson((v as { toJSON: () => unknown }).toJSON());
  if (Array.isArray(v)) return `[${v.map((x) => (x === undefined || typeof x === "function" ? "null" : canonicalJson(x))).join(",")}]`;
  if (v !== null && typeof v === "object") {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o)
      .filter((k) => o[k] !== undefined && typeof o[k] !== "function")
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonicalJson(o[k])}`)
      .join(",")}}`;
  }
  if (typeof v === "bigint") throw new TypeError("canonicalJson: a bigint has no JSON form; convert it first");
  return JSON.stringify(v) ?? "null";
}
