/**
 * Reading JSON the database stores. Two kinds of column:
 *
 * - written only by our own code from values it built (a board, a mail's headers, an audit
 *   snapshot, who was skipped): typed at the column (`jsonb(...).$type<T>()`) and read as typed;
 * - holding what a person or a file supplied (a distribution list's entries, an estimate's rows,
 *   a ruling's citations and appeal): checked at the door on write, and parsed again with the same
 *   zod schema on read by `readStored`, which THROWS when the stored value is not in that shape,
 *   so a damaged row fails loudly (a logged 500) instead of reading as empty — a corrupt
 *   distribution list must not quietly send to nobody.
 */
import type { z } from "zod";

/** A stored value that is not in the shape its schema says: a server fault, never the caller's. */
export class StoredDataError extends Error {
  override readonly name = "StoredDataError";
  constructor(
    readonly what: string,
    readonly issues: Array<{ path: string; message: string }>,
  ) {
    super(`stored ${what} is not in its expected shape: ${issues.slice(0, 5).map((i) => `${i.path || "(root)"}: ${i.message}`).join("; ")}`);
  }
}

/** The stored value parsed with `schema`; throws StoredDataError (never returns a default) when it does not fit. */
export function readStored<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  throw new StoredDataError(
    what,
    r.error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message })),
  );
}
