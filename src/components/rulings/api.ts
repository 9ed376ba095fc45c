/**
 * Client-side view of the rulings and circulation API: zod schemas for what the routes answer
 * (fetched JSON is parsed, never cast). Calls go through the shared client (../shared/api.ts).
 */
import { z } from "zod";

export const citationView = z.union([
  z.object({ kind: z.literal("rule"), rulebookVersionId: z.string().nullable().default(null), ruleId: z.string().nullable().default(null), citation: z.string() }),
  z.object({ kind: z.literal("ruling"), rulingId: z.string(), label: z.string().optional() }),
]);
export type CitationView = z.output<typeof citationView>;

export const rulingView = z.object({
  id: z.string(),
  number: z.number(),
  status: z.enum(["draft", "issued"]),
  revision: z.number(),
  version: z.number(),
  raisedById: z.string().nullable(),
  raisedByName: z.string(),
  target: z.object({ kind: z.enum(["motion", "amendment", "finding", "measure", "other"]), ref: z.string().nullable(), label: z.string() }),
  measureId: z.string().nullable(),
  measureLabel: z.string().nullable(),
  amendmentId: z.string().nullable(),
  motion: z.string().nullable(),
  /** The motion by the name the chamber's rulebook gives it. */
  motionName: z.string().nullable().optional(),
  question: z.string(),
  decision: z.enum(["sustained", "not-sustained", "other"]).nullable(),
  decisionNote: z.string(),
  reasoning: z.string(),
  citations: z.array(citationView),
  appeal: z.object({ ayes: z.number(), noes: z.number(), abstentions: z.number(), appellant: z.string(), outcome: z.enum(["chair-sustained", "chair-overruled"]) }).nullable(),
  sittingId: z.string().nullable(),
  sitting: z.string(),
  sittingDate: z.string().nullable(),
  issuedAt: z.string().nullable(),
});
export type RulingView = z.output<typeof rulingView>;

export const messageView = z.object({ id: z.string(), to: z.string(), status: z.enum(["queued", "sending", "sent", "failed", "uncertain"]), attempts: z.number(), lastError: z.string().nullable(), sentAt: z.string().nullable() });
export type MessageView = z.output<typeof messageView>;

export const rulingDetail = z.object({
  ruling: rulingView,
  revisions: z.array(z.object({ revision: z.number(), note: z.string(), issuedByName: z.string(), issuedAt: z.string(), content: z.unknown() })),
  circulations: z.array(z.object({ id: z.string(), listName: z.string(), rulingRevision: z.number().nullable(), sentByName: z.string(), createdAt: z.string(), skipped: z.array(z.object({ email: z.string(), reason: z.string() })).catch([]), messages: z.array(messageView) })),
});
export type RulingDetail = z.output<typeof rulingDetail>;

export const searchResults = z.object({
  results: z.array(rulingView.extend({ snippet: z.string().optional(), rank: z.number().optional(), score: z.number().optional() })),
  /** Approved journals of sittings matching the words (issue 19 item 2). */
  journals: z.array(z.object({ sittingId: z.string(), sitting: z.string(), snippet: z.string(), openedAt: z.string() })).default([]),
});

export const draftingOptions = z.object({
  legislators: z.array(z.object({ id: z.string(), name: z.string(), bloc: z.string(), office: z.string().nullable() })),
  measures: z.array(z.object({ id: z.string(), label: z.string() })),
  amendments: z.array(z.object({ id: z.string(), measureId: z.string(), label: z.string() })),
  sittings: z.array(z.object({ id: z.string(), title: z.string(), date: z.string() })),
  rulebook: z.object({ id: z.string(), label: z.string(), rules: z.array(z.object({ ruleId: z.string(), citation: z.string(), name: z.string() })), motions: z.array(z.object({ id: z.string(), name: z.string() })) }).nullable(),
  rulings: z.array(z.object({ id: z.string(), label: z.string() })),
});
export type DraftingOptions = z.output<typeof draftingOptions>;

export const listView = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  purpose: z.enum(["clerks"]).nullable(),
  entries: z.array(
    z.union([
      z.object({ kind: z.literal("role"), role: z.string() }),
      z.object({ kind: z.literal("user"), userId: z.string(), name: z.string() }),
      z.object({ kind: z.literal("address"), email: z.string(), name: z.string() }),
    ]),
  ),
  version: z.number(),
  recipientCount: z.number().optional(),
});
export type ListView = z.output<typeof listView>;
export const listsView = z.object({ lists: z.array(listView) });

export const STATUS_LABEL: Record<MessageView["status"], string> = { queued: "Queued", sending: "Sending", sent: "Delivered to mail server", failed: "Failed", uncertain: "Uncertain — check before resending" };
export const STATUS_CHIP: Record<MessageView["status"], string> = {
  queued: "border-brass bg-brass-tint text-brass-text",
  sending: "border-brass bg-brass-tint text-brass-text",
  sent: "border-verdict-ok bg-verdict-ok-tint text-verdict-ok",
  failed: "border-verdict-bar bg-verdict-bar-tint text-verdict-bar",
  uncertain: "border-verdict-query bg-verdict-query-tint text-verdict-query",
};
