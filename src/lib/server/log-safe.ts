/**
 * Errors as the server log may show them: a failed query is logged without its parameters
 * (they can be session tokens, e-mail addresses or ruling text); anything else with its stack.
 */
export function describeError(e: unknown): string {
  if (!(e instanceof Error)) return String(e);
  const query = (e as { query?: unknown }).query;
  const cause = (e as { cause?: { code?: unknown; message?: unknown } }).cause;
  if (typeof query === "string" || "parameters" in e || "params" in e) {
    const what = typeof query === "string" ? ` (${query.replace(/\s+/g, " ").slice(0, 200)})` : "";
    const why = [cause?.code ?? (e as { code?: unknown }).code, cause instanceof Error ? cause.message : e.message.split("\n")[0]].filter(Boolean).join(" ");
    return `query failed${what}: ${why.replace(/params:.*$/s, "")}`;
  }
  return e.stack ?? `${e.name}: ${e.message}`;
}
