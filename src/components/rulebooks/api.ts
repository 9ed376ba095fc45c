/** Browser-side calls to the rulebook and floor APIs: every answer is parsed with zod, errors keep their code, issues and details. */
import { z } from "zod";

export const issueSchema = z.object({ path: z.string(), message: z.string() });
export type Issue = z.output<typeof issueSchema>;

const errorBodySchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), issues: z.array(issueSchema).default([]), details: z.record(z.string(), z.unknown()).optional() }),
});

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues: Issue[] = [],
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

async function answer<S extends z.ZodType>(res: Response, schema: S): Promise<z.output<S>> {
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    throw new ApiError(res.status, "internal", `The server answered ${res.status} without JSON.`);
  }
  if (!res.ok) {
    const e = errorBodySchema.safeParse(body);
    if (e.success) throw new ApiError(res.status, e.data.error.code, e.data.error.message, e.data.error.issues, e.data.error.details);
    throw new ApiError(res.status, "internal", `The server answered ${res.status}.`);
  }
  const r = schema.safeParse(body);
  if (!r.success) throw new ApiError(res.status, "internal", "The server's answer was not in the expected shape.");
  return r.data;
}

export async function getJson<S extends z.ZodType>(url: string, schema: S): Promise<z.output<S>> {
  return answer(await fetch(url, { headers: { accept: "application/json" } }), schema);
}

export async function sendJson<S extends z.ZodType>(url: string, method: string, body: unknown, schema: S): Promise<z.output<S>> {
  return answer(await fetch(url, { method, headers: { "content-type": "application/json", accept: "application/json" }, body: JSON.stringify(body) }), schema);
}

export async function sendForm<S extends z.ZodType>(url: string, form: FormData, schema: S): Promise<z.output<S>> {
  return answer(await fetch(url, { method: "POST", body: form }), schema);
}

export const when = (d: string | Date) => new Date(d).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
export const day = (d: string | Date) => new Date(d).toLocaleDateString("en-GB", { dateStyle: "medium", timeZone: "UTC" });
