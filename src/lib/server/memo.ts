/**
 * A bounded in-process memo for results that are pure functions of immutable inputs (a rulebook
 * version never changes; the key carries everything else the result depends on). Keeps the
 * promise, so concurrent identical requests share one computation; a failure is not kept.
 * Least recently used entries go first.
 */
export class Memo<V> {
  private readonly entries = new Map<string, Promise<V>>();

  constructor(private readonly max: number) {}

  get(key: string, compute: () => Promise<V>): Promise<V> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const p = compute();
    this.entries.set(key, p);
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value!);
    p.catch(() => this.entries.delete(key));
    return p;
  }
}

/** Keys longer than this are not memoised (computed every time): the memo stays small. */
export const MAX_MEMO_KEY = 64 * 1024;

/** JSON text of `value` as a memo key, or null when it is too deep to serialise or too long to keep. */
export function memoKey(prefix: string, value: unknown): string | null {
  let text: string | undefined;
  try {
    text = JSON.stringify(value);
  } catch {
    return null; // e.g. nesting deeper than the stack: not worth keeping, let the core refuse it
  }
  const key = `${prefix}\u0000${text ?? ""}`;
  return key.length > MAX_MEMO_KEY ? null : key;
}
