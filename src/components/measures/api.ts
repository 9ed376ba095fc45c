/** What the measure islands add to the shared API client: a stale write (409) in the clerk's words. */
import { z } from "zod";
import { ApiError } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import { historyAction, historyFieldLabel } from "../../lib/measures/history-words.ts";

const changesSchema = z.array(z.object({ version: z.number(), action: z.string(), by: z.string(), at: z.string(), fields: z.array(z.string()) }));

/**
 * A stale write (409) in the clerk's words: who changed it since it was opened, and what.
 * Other errors keep the server's message.
 */
export function conflictText(e: unknown, fallback: string): string {
  if (!(e instanceof ApiError)) return fallback;
  if (e.status !== 409) return e.message;
  const changes = changesSchema.safeParse(e.details.changes);
  if (!changes.success || changes.data.length === 0) return e.message;
  const who = [...new Set(changes.data.map((c) => c.by))].join(" and ");
  // The action without its entity ("edited", "filed A3"), the fields by their labels.
  const what = changes.data.map((c) => `${historyAction("", c.action).replace(/^.* · /, "")}${c.fields.length ? ` (${c.fields.map((f) => historyFieldLabel(f).toLowerCase()).join(", ")})` : ""} at ${when(c.at)}`).join("; ");
  return `Changed by ${who} since you opened it: ${what}. Your edit was not saved; reload to see their version and make it again.`;
}
