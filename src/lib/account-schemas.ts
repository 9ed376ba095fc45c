/** Sign-up, sign-in and reset form inputs: shared by the forms (client) and the tests. */
import { z } from "zod";
import { safe } from "./schema-parts.ts";

export const emailSchema = z.email("enter an e-mail address such as name@example.org").max(254);
export const passwordSchema = safe(z.string().min(10, "use at least 10 characters").max(128, "use at most 128 characters"));

export const signUpSchema = z.object({ name: safe(z.string().trim().min(1, "enter your name").max(120)), email: emailSchema, password: passwordSchema });
export const signInSchema = z.object({ email: emailSchema, password: safe(z.string().min(1, "enter your password")) });
export const forgotSchema = z.object({ email: emailSchema });
export const resetSchema = z.object({ password: passwordSchema, token: safe(z.string().min(1, "the reset link is incomplete")) });

export type FieldErrors = Record<string, string>;

export function fieldErrors(r: { success: false; error: z.ZodError }): FieldErrors {
  const out: FieldErrors = {};
  for (const i of r.error.issues) {
    const k = String(i.path[0] ?? "form");
    out[k] ??= i.message;
  }
  return out;
}
