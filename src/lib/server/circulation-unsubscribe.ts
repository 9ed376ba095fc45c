/**
 * Signed unsubscribe tokens: "v1.<payload>.<hmac>" where the payload names the chamber, the
 * list and the address, and the HMAC-SHA256 (keyed by BETTER_AUTH_SECRET) proves we issued it.
 * No expiry: an unsubscribe link in an old message must keep working.
 */
import { createHmac, timingSafeEqual } from "node:crypto";
import { z } from "zod";
import { GavelError } from "../errors.ts";

const payloadSchema = z.object({ c: z.string().min(1), l: z.string().nullable(), e: z.string().min(3) });
export type UnsubscribePayload = { chamberId: string; listId: string | null; email: string };

function key(): string {
  const k = process.env.BETTER_AUTH_SECRET;
  if (!k) throw new Error("BETTER_AUTH_SECRET is not set; unsubscribe links cannot be signed.");
  return `unsubscribe:${k}`;
}

function mac(data: string): string {
  return createHmac("sha256", key()).update(data).digest("base64url");
}

export function signUnsubscribe(p: UnsubscribePayload): string {
  const data = Buffer.from(JSON.stringify({ c: p.chamberId, l: p.listId, e: p.email.toLowerCase() })).toString("base64url");
  return `v1.${data}.${mac(data)}`;
}

export function verifyUnsubscribe(token: string): UnsubscribePayload {
  const bad = () => new GavelError("invalid-input", "This unsubscribe link is not valid (it may have been cut short in the e-mail). Copy the whole link from the message.", { issues: [{ path: "token", message: "not a valid unsubscribe token" }] });
  const [v, data, sig] = token.split(".");
  if (v !== "v1" || !data || !sig) throw bad();
  const expected = Buffer.from(mac(data));
  const given = Buffer.from(sig);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) throw bad();
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(data, "base64url").toString("utf8"));
  } catch {
    throw bad();
  }
  const r = payloadSchema.safeParse(parsed);
  if (!r.success) throw bad();
  return { chamberId: r.data.c, listId: r.data.l, email: r.data.e };
}
