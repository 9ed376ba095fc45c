/**
 * Call API routes in-process, as a given user, with the same locals the middleware builds.
 * Lets integration tests exercise every route against the real PostgreSQL without a server.
 */
import type { APIContext, APIRoute } from "astro";
import { auth } from "../../src/lib/server/auth.ts";
import { loadContext, forgetAccessAfter } from "../../src/lib/server/context.ts";

export const BASE = process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:4399";

export interface Session {
  cookie: string;
  userId: string;
}

function cookieFrom(res: Response): string {
  const all = res.headers.getSetCookie();
  return all.map((c) => c.split(";")[0]).join("; ");
}

export async function signUp(email: string, password = "correct-horse-battery", name = "Test Person"): Promise<Session> {
  const res = await auth.api.signUpEmail({ body: { email, password, name }, asResponse: true });
  if (!res.ok) throw new Error(`sign-up failed: ${res.status} ${await res.text()}`);
  const body = (await res.json()) as { user: { id: string } };
  return { cookie: cookieFrom(res), userId: body.user.id };
}

export async function signIn(email: string, password: string): Promise<Session> {
  const res = await auth.api.signInEmail({ body: { email, password }, asResponse: true });
  if (!res.ok) throw new Error(`sign-in failed for ${email}: ${res.status}`);
  const body = (await res.json()) as { user: { id: string } };
  return { cookie: cookieFrom(res), userId: body.user.id };
}

export interface CallOptions {
  as?: Session | null;
  params?: Record<string, string>;
  body?: unknown;
  /** Raw body (for upload and malformed-input tests); wins over `body`. */
  rawBody?: BodyInit;
  headers?: Record<string, string>;
  query?: Record<string, string>;
}

/** Invoke `handler` (an exported GET/POST/… of a route module) at `path`. */
export async function call(handler: APIRoute | undefined, method: string, path: string, opts: CallOptions = {}): Promise<{ status: number; body: any; response: Response }> {
  if (!handler) throw new Error(`route ${path} has no ${method} handler`);
  const url = new URL(path, BASE);
  for (const [k, v] of Object.entries(opts.query ?? {})) url.searchParams.set(k, v);
  const headers = new Headers({ origin: BASE, ...(opts.headers ?? {}) });
  if (opts.as) headers.set("cookie", opts.as.cookie);
  let body: BodyInit | undefined = opts.rawBody;
  if (body === undefined && opts.body !== undefined) {
    body = JSON.stringify(opts.body);
    if (!headers.has("content-type")) headers.set("content-type", "application/json");
  }
  const request = new Request(url, { method, headers, body });
  const locals = { ...(await loadContext(headers)), requestId: "test" } as App.Locals;
  const ctx = { request, url, params: opts.params ?? {}, locals, redirect: (to: string, status = 302) => new Response(null, { status, headers: { location: to } }) } as unknown as APIContext;
  const response = await handler(ctx);
  forgetAccessAfter(method, url.pathname); // as the middleware does
  const text = await response.text();
  let parsed: unknown = text;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  return { status: response.status, body: parsed, response };
}
