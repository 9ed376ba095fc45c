/**
 * The API's one error-to-status table and the helpers every JSON route uses: parse the
 * body with zod, require a signed-in user in a chamber with a permission, answer JSON.
 */
import type { APIContext, APIRoute } from "astro";
import type { z } from "zod";
import { GavelError, isGavelError, parseWith, type ErrorCode } from "../errors.ts";
import { can, type ChamberRole, type Permission } from "../permissions.ts";
import { describeError } from "./log-safe.ts";
import { stringIssues } from "../schema-parts.ts";

export const STATUS: Record<ErrorCode, number> = {
  "invalid-input": 400,
  unprocessable: 422,
  unauthenticated: 401,
  forbidden: 403,
  "not-found": 404,
  conflict: 409,
  "needs-confirmation": 409,
  archived: 409,
  "too-large": 413,
  "limit-exceeded": 422,
  "rate-limited": 429,
  unavailable: 503,
};

export const MAX_JSON_BYTES = 1024 * 1024;

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store", ...headers } });
}

/** Connection-level database failures (server restarting, network cut): retryable, not our fault. */
export function isDatabaseUnavailable(e: unknown): boolean {
  // The driver's error may come wrapped (Drizzle's query error, better-auth's "failed to get session"): follow the causes.
  for (let outer = e, depth = 0; outer && typeof outer === "object" && depth < 4; outer = (outer as { cause?: unknown }).cause, depth++) {
    const err = (outer as { cause?: unknown }).cause ?? outer;
    const code = String((err as { code?: unknown })?.code ?? "");
    if (["ECONNREFUSED", "CONNECTION_ENDED", "CONNECTION_DESTROYED", "CONNECTION_CLOSED", "CONNECT_TIMEOUT", "57P01", "57P02", "57P03"].includes(code) || /^08[0-9A-Z]{3}$/.test(code)) return true;
    // A reset socket is the database's only under a query (a crashing server); a client hanging up resets too.
    if (["ECONNRESET", "EPIPE", "ETIMEDOUT"].includes(code) && (err !== outer || typeof (outer as { query?: unknown }).query === "string")) return true;
  }
  return false;
}

/** PostgreSQL's "data exception" class (22xxx): invalid text for a type, NUL bytes, out-of-range numbers or dates. */
export function isDataException(e: unknown): boolean {
  const err = (e as { cause?: unknown })?.cause ?? e;
  return /^22[0-9A-Z]{3}$/.test(String((err as { code?: unknown })?.code ?? ""));
}

/** The client closed the connection while its request was read: nobody waits for the answer. */
export function isClientAbort(e: unknown): boolean {
  return e instanceof Error && e.message === "aborted" && (e as { code?: unknown }).code === "ECONNRESET" && !(e as { cause?: unknown }).cause;
}

export function errorResponse(e: unknown): Response {
  if (isGavelError(e)) return json(e.toJSON(), STATUS[e.code], e.code === "unavailable" ? { "retry-after": "5" } : {});
  if (isClientAbort(e)) return json({ error: { code: "invalid-input", message: "The request was cut off before it was complete." } }, 400);
  if (isDatabaseUnavailable(e)) {
    console.error("[api] database unavailable:", describeError(e));
    return json({ error: { code: "unavailable", message: "Gavelwright cannot reach its database just now. The request was not completed; try again in a moment." } }, 503, { "retry-after": "5" });
  }
  if (isDataException(e)) {
    // A value the schemas let through and PostgreSQL refused (SQLSTATE class 22): the request is at
    // fault, not the server. Still logged: the schema at the door should have named the field.
    console.error("[api] value refused by the database (a schema should have caught it):", describeError(e));
    return json({ error: { code: "invalid-input", message: "A value in the request cannot be stored or looked up (the database refused it). Nothing was saved.", issues: [{ path: "(database)", message: "a value the database refused" }] } }, 400);
  }
  console.error("[api] unexpected error:", describeError(e));
  return json({ error: { code: "internal", message: "Something went wrong on the server. The request was not completed; nothing was saved." } }, 500);
}

/** Wrap a route handler: GavelErrors become their status; anything else a logged 500. */
export function route(handler: (ctx: APIContext) => Promise<Response | unknown>): APIRoute {
  return async (ctx) => {
    try {
      // Path parameters are input too (a NUL in an id would otherwise reach the database).
      refuseBadText(Object.fromEntries(Object.entries(ctx.params ?? {}).map(([k, v]) => [`params.${k}`, v])), "path");
      const out = await handler(ctx);
      return out instanceof Response ? out : json(out);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/** Read a JSON body (size- and type-checked) and parse it with `schema`. */
export async function readJson<S extends z.ZodType>(request: Request, schema: S, what = "request body", maxBytes = MAX_JSON_BYTES): Promise<z.output<S>> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\b/i.test(type)) throw new GavelError("invalid-input", `${what}: send JSON with the header Content-Type: application/json`, { issues: [{ path: "(content-type)", message: `expected application/json, got ${type || "nothing"}` }] });
  const text = new TextDecoder().decode(await readBody(request, maxBytes, what));
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    throw new GavelError("invalid-input", `${what} is not valid JSON: ${(e as Error).message}`, { issues: [{ path: "(body)", message: "not valid JSON" }] });
  }
  refuseBadText(value, what);
  return parseWith(schema, value, what) as z.output<S>;
}

/**
 * Read a request body of at most `maxBytes`: refused from its declared length, else while it
 * streams in (a chunked body without Content-Length is never buffered past the limit).
 */
export async function readBody(request: Request, maxBytes: number, what = "request body"): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > maxBytes) throw new GavelError("too-large", `${what} is ${declared} bytes; the limit is ${maxBytes}`, { issues: [{ path: "(body)", message: "too large" }] });
  if (!request.body) return new Uint8Array(new ArrayBuffer(0));
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      void reader.cancel().catch(() => {});
      throw new GavelError("too-large", `${what} is larger than ${maxBytes} bytes`, { issues: [{ path: "(body)", message: "too large" }] });
    }
    chunks.push(value);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/**
 * Refuse a value with a string (anywhere, keys included) that the database would refuse or that is
 * never meant as text: NUL, other control characters, half a surrogate pair (src/lib/schema-parts.ts).
 */
export function refuseBadText(value: unknown, what: string): void {
  const issues = stringIssues(value);
  if (issues.length) throw new GavelError("invalid-input", `${what}: ${issues[0].path}: ${issues[0].message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}`, { issues });
}

export function parseQuery<S extends z.ZodType>(url: URL, schema: S): z.output<S> {
  const query = Object.fromEntries(url.searchParams);
  refuseBadText(query, "query");
  return parseWith(schema, query, "query") as z.output<S>;
}

export interface Actor {
  user: NonNullable<App.Locals["user"]>;
  chamber: NonNullable<App.Locals["chamber"]>;
  role: ChamberRole;
}

/** A signed-in user working in a chamber, holding `permission` there (or any role when omitted). */
export function requireActor(locals: App.Locals, permission?: Permission): Actor {
  if (!locals.user) throw new GavelError("unauthenticated", "Sign in first.");
  if (!locals.chamber || !locals.role) throw new GavelError("forbidden", "You do not belong to a chamber yet. Accept an invitation or create a chamber.");
  if (permission && !can(locals.role, permission)) throw new GavelError("forbidden", `Your role in ${locals.chamber.name} does not allow this (${permission}).`);
  return { user: locals.user, chamber: locals.chamber, role: locals.role };
}
