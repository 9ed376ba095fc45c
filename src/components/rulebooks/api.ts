/** Browser-side calls to the rulebook and floor APIs: every answer is parsed with zod, errors keep their code, issues and details. */
import type { z } from "zod";
import { apiCall } from "../shared/api.ts";

export { ApiError, type Issue } from "../shared/api.ts";

export function getJson<S extends z.ZodType>(url: string, schema: S): Promise<z.output<S>> {
  return apiCall(schema, url);
}

export function sendJson<S extends z.ZodType>(url: string, method: string, body: unknown, schema: S): Promise<z.output<S>> {
  return apiCall(schema, url, { method, body });
}

export function sendForm<S extends z.ZodType>(url: string, form: FormData, schema: S): Promise<z.output<S>> {
  return apiCall(schema, url, { method: "POST", form });
}

export const when = (d: string | Date) => new Date(d).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
export const day = (d: string | Date) => new Date(d).toLocaleDateString("en-GB", { dateStyle: "medium", timeZone: "UTC" });
