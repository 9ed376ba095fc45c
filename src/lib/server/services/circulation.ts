/**
 * Circulation: distribution lists, sending a ruling (or a floor-day digest) to a list through
 * the transactional outbox, per-recipient delivery status, and unsubscribes. A sending writes
 * one `circulations` row and one outbox row per recipient in the caller's transaction, so the
 * ruling and its queued messages commit together.
 */
import { and, asc, desc, eq, inArray, isNull, or, sql as dsql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { safe, version } from "../../schema-parts.ts";
import { db, type Tx } from "../db.ts";
import { baseUrl } from "../auth.ts";
import { member, organization, user } from "../../db/schema/auth.ts";
import { circulations, distributionLists, mailSuppressions, outbox } from "../../db/schema/mail.ts";
import { rulings } from "../../db/schema/rulings.ts";
import { GavelError } from "../../errors.ts";
import { distributionListSchema, listEntrySchema, type ListEntry } from "../../circulation/distribution-list.ts";
import { floorDigestSchema, renderFloorDigest, type FloorDigest } from "../../rulings/render-floor-digest.ts";
import { renderRulingMail, type RulingForMail } from "../../rulings/render-ruling-mail.ts";
import { appealTallySchema, citationSchema } from "../../rulings/ruling-content.ts";
import { readStored } from "../stored-json.ts";
import { enqueueMail, requeueMail } from "../mail.ts";
import { signUnsubscribe, verifyUnsubscribe } from "../circulation-unsubscribe.ts";
import type { Actor } from "../http.ts";
import { dateStyleOf, formatDateTime } from "../../text/dates.ts";

const uuid = z.uuid();
export const listInputSchema = distributionListSchema;
export const listUpdateSchema = distributionListSchema.extend({ version: version() });
export const sendSchema = z.object({
  rulingId: uuid,
  listId: uuid,
  /** Send even though this revision of the ruling already went to this list. */
  confirm: z.boolean().default(false),
});
/** The digest, and optionally the chamber's list to send it to (`listId`; without it, the clerks' list). */
export const digestSchema = floorDigestSchema.extend({ listId: safe(z.string().max(200)).nullish(), confirm: z.boolean().default(false) });
export const unsubscribeSchema = z.object({ token: safe(z.string().min(10).max(2000)) });

type ListRow = typeof distributionLists.$inferSelect;
type RulingRow = typeof rulings.$inferSelect;
const listNotFound = () => new GavelError("not-found", "No such distribution list in this chamber.");

/** A list's entries were typed by a person: parsed on every read, and a damaged list throws (it never sends to nobody). */
function entriesOf(row: ListRow): ListEntry[] {
  return readStored(z.array(listEntrySchema), row.entries, `entries of the distribution list "${row.name}"`);
}

function toList(row: ListRow) {
  return { id: row.id, name: row.name, description: row.description, purpose: row.purpose, entries: entriesOf(row), version: row.version, updatedAt: row.updatedAt.toISOString() };
}

export interface Recipient {
  email: string;
  name: string;
}

/** Everyone a list reaches today: role holders and named people still in the chamber, outside addresses; one message per address. */
export async function resolveRecipients(tx: Tx | typeof db, chamberId: string, entries: ListEntry[]): Promise<Recipient[]> {
  const roles = entries.flatMap((e) => (e.kind === "role" ? [e.role] : []));
  const userIds = entries.flatMap((e) => (e.kind === "user" ? [e.userId] : []));
  const people =
    roles.length || userIds.length
      ? await tx
          .select({ id: user.id, name: user.name, email: user.email, role: member.role })
          .from(member)
          .innerJoin(user, eq(member.userId, user.id))
          .where(and(eq(member.organizationId, chamberId), or(roles.length ? inArray(member.role, roles) : dsql`false`, userIds.length ? inArray(user.id, userIds) : dsql`false`)))
          .orderBy(asc(user.email))
      : [];
  const out = new Map<string, Recipient>();
  for (const p of people) out.set(p.email.toLowerCase(), { email: p.email.toLowerCase(), name: p.name });
  for (const e of entries) if (e.kind === "address" && !out.has(e.email)) out.set(e.email, { email: e.email, name: e.name });
  return [...out.values()];
}

async function checkEntries(actor: Actor, entries: ListEntry[]) {
  const ids = entries.flatMap((e, i) => (e.kind === "user" ? [{ id: e.userId, i }] : []));
  if (!ids.length) return entries;
  const found = await db.select({ id: user.id, name: user.name }).from(member).innerJoin(user, eq(member.userId, user.id)).where(and(eq(member.organizationId, actor.chamber.id), inArray(user.id, ids.map((x) => x.id))));
  const missing = ids.filter((x) => !found.some((f) => f.id === x.id));
  if (missing.length) throw new GavelError("unprocessable", `entries.${missing[0].i}.userId: no such person in this chamber`, { issues: missing.map((m) => ({ path: `entries.${m.i}.userId`, message: "no such person in this chamber" })) });
  return entries.map((e) => (e.kind === "user" ? { ...e, name: found.find((f) => f.id === e.userId)!.name } : e));
}

function nameTaken(e: unknown): boolean {
  const err = e as { code?: string; cause?: { code?: string } };
  return err?.code === "23505" || err?.cause?.code === "23505";
}

export async function listLists(actor: Actor) {
  const rows = await db.select().from(distributionLists).where(eq(distributionLists.chamberId, actor.chamber.id)).orderBy(asc(distributionLists.name));
  const out = [];
  for (const r of rows) out.push({ ...toList(r), recipientCount: (await resolveRecipients(db, actor.chamber.id, entriesOf(r))).length });
  return { lists: out };
}

export async function getList(actor: Actor, id: string) {
  if (!uuid.safeParse(id).success) throw listNotFound();
  const [row] = await db.select().from(distributionLists).where(and(eq(distributionLists.id, id), eq(distributionLists.chamberId, actor.chamber.id)));
  if (!row) throw listNotFound();
  const recipients = await resolveRecipients(db, actor.chamber.id, entriesOf(row));
  const suppressed = await db.select({ email: mailSuppressions.email }).from(mailSuppressions).where(and(eq(mailSuppressions.chamberId, actor.chamber.id), or(eq(mailSuppressions.listId, row.id), isNull(mailSuppressions.listId))));
  const off = new Set(suppressed.map((s) => s.email));
  return { list: toList(row), recipients: recipients.map((r) => ({ ...r, unsubscribed: off.has(r.email) })) };
}

export async function createList(actor: Actor, input: z.output<typeof listInputSchema>) {
  const entries = await checkEntries(actor, input.entries);
  try {
    return await db.transaction(async (tx) => {
      if (input.purpose) await tx.update(distributionLists).set({ purpose: null }).where(and(eq(distributionLists.chamberId, actor.chamber.id), eq(distributionLists.purpose, input.purpose)));
      const [row] = await tx.insert(distributionLists).values({ chamberId: actor.chamber.id, name: input.name, description: input.description, purpose: input.purpose, entries }).returning();
      return toList(row);
    });
  } catch (e) {
    if (nameTaken(e)) throw new GavelError("conflict", `A list named "${input.name}" already exists in this chamber.`, { issues: [{ path: "name", message: "already used by another list" }] });
    throw e;
  }
}

export async function updateList(actor: Actor, id: string, input: z.output<typeof listUpdateSchema>) {
  if (!uuid.safeParse(id).success) throw listNotFound();
  const entries = await checkEntries(actor, input.entries);
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.select().from(distributionLists).where(and(eq(distributionLists.id, id), eq(distributionLists.chamberId, actor.chamber.id))).for("update");
      if (!row) throw listNotFound();
      if (row.version !== input.version) throw new GavelError("conflict", `The list "${row.name}" was changed by someone else (version ${input.version}, now ${row.version}). Reload it and reapply your change.`, { details: { currentVersion: row.version } });
      if (input.purpose) await tx.update(distributionLists).set({ purpose: null }).where(and(eq(distributionLists.chamberId, actor.chamber.id), eq(distributionLists.purpose, input.purpose)));
      const [out] = await tx
        .update(distributionLists)
        .set({ name: input.name, description: input.description, purpose: input.purpose, entries, version: row.version + 1, updatedAt: new Date() })
        .where(eq(distributionLists.id, id))
        .returning();
      return toList(out);
    });
  } catch (e) {
    if (nameTaken(e)) throw new GavelError("conflict", `A list named "${input.name}" already exists in this chamber.`, { issues: [{ path: "name", message: "already used by another list" }] });
    throw e;
  }
}

export async function deleteList(actor: Actor, id: string) {
  if (!uuid.safeParse(id).success) throw listNotFound();
  const rows = await db.delete(distributionLists).where(and(eq(distributionLists.id, id), eq(distributionLists.chamberId, actor.chamber.id))).returning({ id: distributionLists.id });
  if (!rows.length) throw listNotFound();
  return { deleted: id };
}

function unsubscribeUrl(chamberId: string, listId: string | null, email: string): string {
  return `${baseUrl()}/unsubscribe?token=${encodeURIComponent(signUnsubscribe({ chamberId, listId, email }))}`;
}

async function suppressedFor(tx: Tx | typeof db, chamberId: string, listId: string | null): Promise<Set<string>> {
  const rows = await tx
    .select({ email: mailSuppressions.email })
    .from(mailSuppressions)
    .where(and(eq(mailSuppressions.chamberId, chamberId), listId ? or(eq(mailSuppressions.listId, listId), isNull(mailSuppressions.listId)) : isNull(mailSuppressions.listId)));
  return new Set(rows.map((r) => r.email));
}

async function chamberName(tx: Tx | typeof db, chamberId: string): Promise<string> {
  const [o] = await tx.select({ name: organization.name }).from(organization).where(eq(organization.id, chamberId));
  return o?.name ?? "Gavelwright";
}

interface Sender {
  chamberId: string;
  userId: string | null;
  name: string;
}

/** Write one sending and its per-recipient messages in `tx`; `render` builds each recipient's message. */
async function enqueueToList(tx: Tx, sender: Sender, list: ListRow, kind: "ruling" | "floor-digest", meta: { rulingId?: string; rulingRevision?: number; ref: string }, render: (unsubscribeUrl: string) => { subject: string; text: string; html: string }) {
  const recipients = await resolveRecipients(tx, sender.chamberId, entriesOf(list));
  const off = await suppressedFor(tx, sender.chamberId, list.id);
  const to = recipients.filter((r) => !off.has(r.email));
  const skipped = recipients.filter((r) => off.has(r.email)).map((r) => ({ email: r.email, reason: "unsubscribed" }));
  const sample = render(unsubscribeUrl(sender.chamberId, list.id, "sample@invalid"));
  const [c] = await tx
    .insert(circulations)
    .values({ chamberId: sender.chamberId, kind, rulingId: meta.rulingId ?? null, rulingRevision: meta.rulingRevision ?? null, listId: list.id, listName: list.name, subject: sample.subject, skipped, sentBy: sender.userId, sentByName: sender.name })
    .returning();
  for (const r of to) {
    const link = unsubscribeUrl(sender.chamberId, list.id, r.email);
    const m = render(link);
    await enqueueMail(
      {
        kind,
        ref: meta.ref,
        chamberId: sender.chamberId,
        circulationId: c.id,
        dedupeKey: `circulation:${c.id}:${r.email}`,
        to: r.name ? `"${r.name.replace(/["\\\r\n]/g, "")}" <${r.email}>` : r.email,
        subject: m.subject,
        text: m.text,
        html: m.html,
        headers: { "List-Unsubscribe": `<${link}>`, "X-Gavelwright-Circulation": c.id },
      },
      tx,
    );
  }
  return { id: c.id, listId: list.id, listName: list.name, subject: c.subject, queued: to.length, skipped };
}

function mailRuling(r: RulingRow): RulingForMail {
  return {
    number: r.number,
    revision: r.revision,
    raisedByName: r.raisedByName,
    targetLabel: r.targetLabel,
    measureLabel: r.measureLabel,
    question: r.question,
    decision: r.decision,
    decisionNote: r.decisionNote ?? "",
    reasoning: r.reasoning,
    citations: readStored(z.array(citationSchema), r.citations, `citations of ruling ${r.number}`).map((c) => (c.kind === "rule" ? { kind: "rule" as const, citation: c.citation, ruleId: c.ruleId } : { kind: "ruling" as const, label: c.label })),
    appeal: readStored(appealTallySchema.nullable(), r.appeal, `appeal of ruling ${r.number}`),
    sitting: r.sitting,
    sittingDate: r.sittingDate,
  };
}

async function loadList(tx: Tx | typeof db, chamberId: string, listId: string): Promise<ListRow> {
  if (!uuid.safeParse(listId).success) throw listNotFound();
  const [list] = await tx.select().from(distributionLists).where(and(eq(distributionLists.id, listId), eq(distributionLists.chamberId, chamberId)));
  if (!list) throw listNotFound();
  return list;
}

function assertIssued(ruling: RulingRow): void {
  if (ruling.status !== "issued") throw new GavelError("conflict", `Ruling ${ruling.number} is a draft; only issued rulings are circulated.`, { details: { status: ruling.status } });
}

/** Queue an issued ruling's circulation to a list of the chamber already loaded (loadList). */
async function circulateRulingTo(tx: Tx, actor: Actor, ruling: RulingRow, list: ListRow) {
  const name = await chamberName(tx, actor.chamber.id);
  const url = `${baseUrl()}/rulings/${ruling.id}`;
  return enqueueToList(tx, { chamberId: actor.chamber.id, userId: actor.user.id, name: actor.user.name }, list, "ruling", { rulingId: ruling.id, rulingRevision: ruling.revision, ref: ruling.id }, (u) =>
    renderRulingMail({ chamberName: name, ruling: mailRuling(ruling), rulingUrl: url, unsubscribeUrl: u }),
  );
}

/** Queue a ruling's circulation to a list inside the caller's transaction (the ruling must be issued). */
export async function circulateRulingInTx(tx: Tx, actor: Actor, ruling: RulingRow, listId: string) {
  assertIssued(ruling);
  return circulateRulingTo(tx, actor, ruling, await loadList(tx, actor.chamber.id, listId));
}

/**
 * The one repeat question of a sending (a ruling's revision, a sitting's digest): when a sending
 * matching `match` already went, ask first (409 needs-confirmation, sent again with `confirm`), for
 * its recipients would get it twice (common practice, no source). `what` names the thing sent
 * ("Ruling 4"); the list is named as `listName` when given, else by the name it was sent under.
 */
async function askBeforeSendingAgain(tx: Tx, actor: Actor, match: SQL | undefined, what: string, listName?: string): Promise<void> {
  const [earlier] = await tx
    .select({ at: circulations.createdAt, by: circulations.sentByName, listName: circulations.listName })
    .from(circulations)
    .where(and(eq(circulations.chamberId, actor.chamber.id), match))
    .orderBy(desc(circulations.createdAt))
    .limit(1);
  if (!earlier) return;
  const list = listName ?? earlier.listName;
  const when = formatDateTime(earlier.at, dateStyleOf(actor.chamber));
  throw new GavelError("needs-confirmation", `${what} already went to “${list}” on ${when} (sent by ${earlier.by}). Its recipients would get it twice. Send it again anyway?`, {
    details: { reason: "already-circulated", list },
  });
}

export async function circulateRuling(actor: Actor, input: z.output<typeof sendSchema>) {
  return db.transaction(async (tx) => {
    // The row lock serialises sendings of one ruling, so two sent at once cannot both miss the earlier one.
    const [ruling] = await tx.select().from(rulings).where(and(eq(rulings.id, input.rulingId), eq(rulings.chamberId, actor.chamber.id))).for("update");
    if (!ruling) throw new GavelError("not-found", "No such ruling in this chamber.");
    assertIssued(ruling);
    const list = await loadList(tx, actor.chamber.id, input.listId);
    if (!input.confirm) await askBeforeSendingAgain(tx, actor, and(eq(circulations.rulingId, ruling.id), eq(circulations.rulingRevision, ruling.revision), eq(circulations.listId, list.id)), `Ruling ${ruling.number}`, list.name);
    return circulateRulingTo(tx, actor, ruling, list);
  });
}

/** The clerks' list as the digest's list when the chamber has none yet: the role holders, recorded without a list. */
function roleClerks(chamberId: string): ListRow {
  return { id: null as unknown as string, chamberId, name: "Clerks (chief clerk and clerks)", description: "", purpose: "clerks", entries: [{ kind: "role", role: "chief-clerk" }, { kind: "role", role: "clerk" }], version: 1, createdAt: new Date(), updatedAt: new Date() };
}

/**
 * Where a digest goes: the chamber's list `listId` when given (another chamber's list, or none, is
 * a 422 naming `listId`), else the chamber's clerks' list (purpose "clerks"), else null: every
 * chief clerk and clerk, recorded without a list.
 */
async function digestListOf(t: Tx, chamberId: string, listId: string | null | undefined): Promise<ListRow | null> {
  if (listId) {
    const [chosen] = uuid.safeParse(listId).success ? await t.select().from(distributionLists).where(and(eq(distributionLists.id, listId), eq(distributionLists.chamberId, chamberId))) : [];
    if (!chosen) throw new GavelError("unprocessable", "listId: no such distribution list in this chamber.", { issues: [{ path: "listId", message: "no such distribution list in this chamber" }] });
    return chosen;
  }
  const [clerks] = await t.select().from(distributionLists).where(and(eq(distributionLists.chamberId, chamberId), eq(distributionLists.purpose, "clerks")));
  return clerks ?? null;
}

/** Queue the digest to the list digestListOf chose (null: the clerks by role, recorded without a list). */
async function enqueueDigestTo(t: Tx, chamberId: string, digest: FloorDigest, sentBy: { userId: string | null; name: string }, chosen: ListRow | null) {
  const name = await chamberName(t, chamberId);
  const ref = `${digest.sitting} ${digest.date}`;
  if (chosen) return enqueueToList(t, { chamberId, ...sentBy }, chosen, "floor-digest", { ref }, (u) => renderFloorDigest({ chamberName: name, digest, unsubscribeUrl: u }));
  // No clerks' list yet: send to the role holders directly, recorded without a list.
  const list = roleClerks(chamberId);
  const recipients = await resolveRecipients(t, chamberId, entriesOf(list));
  const off = await suppressedFor(t, chamberId, null);
  const [c] = await t
    .insert(circulations)
    .values({ chamberId, kind: "floor-digest", listId: null, listName: list.name, subject: renderFloorDigest({ chamberName: name, digest, unsubscribeUrl: null }).subject, skipped: recipients.filter((r) => off.has(r.email)).map((r) => ({ email: r.email, reason: "unsubscribed" })), sentBy: sentBy.userId, sentByName: sentBy.name })
    .returning();
  let queued = 0;
  for (const r of recipients.filter((r) => !off.has(r.email))) {
    const link = unsubscribeUrl(chamberId, null, r.email);
    const m = renderFloorDigest({ chamberName: name, digest, unsubscribeUrl: link });
    await enqueueMail({ kind: "floor-digest", ref, chamberId, circulationId: c.id, dedupeKey: `circulation:${c.id}:${r.email}`, to: r.email, subject: m.subject, text: m.text, html: m.html, headers: { "List-Unsubscribe": `<${link}>` } }, t);
    queued++;
  }
  return { id: c.id, listId: null, listName: list.name, subject: c.subject, queued, skipped: c.skipped };
}

/**
 * Queue the floor-day digest (the tree's findings and the proposed order of questions) to the
 * chamber's clerks' list (the list marked purpose "clerks"; without one, every chief clerk and
 * clerk), or to the chamber's list `listId` when given: another chamber's list, or none, is a
 * 422 naming `listId` and queues nothing. Other areas call this with their content; pass `tx` to
 * commit with your own change.
 */
export async function enqueueFloorDigest(chamberId: string, digestInput: unknown, sentBy: { userId: string | null; name: string }, tx?: Tx, options: { listId?: string | null } = {}) {
  const digest: FloorDigest = floorDigestSchema.parse(digestInput);
  const run = async (t: Tx) => enqueueDigestTo(t, chamberId, digest, sentBy, await digestListOf(t, chamberId, options.listId));
  return tx ? run(tx) : db.transaction(run);
}

/**
 * Send the floor-day digest from the circulation desk. The digest for a sitting and day that already
 * went to the same list asks first (409 needs-confirmation, sent again with `confirm`), as a ruling
 * does: its recipients would get it twice (common practice, no source).
 */
export async function sendFloorDigest(actor: Actor, input: z.output<typeof digestSchema>) {
  const { listId, confirm, ...rest } = input;
  const digest: FloorDigest = floorDigestSchema.parse(rest);
  return db.transaction(async (tx) => {
    // One sending of a digest at a time per chamber, so two sent at once cannot both miss the other.
    await tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${"floor-digest:" + actor.chamber.id}))`);
    // A list named that is not this chamber's is refused first (422 on listId), before any repeat question.
    const list = await digestListOf(tx, actor.chamber.id, listId);
    if (!confirm) {
      const subject = renderFloorDigest({ chamberName: await chamberName(tx, actor.chamber.id), digest, unsubscribeUrl: null }).subject;
      await askBeforeSendingAgain(tx, actor, and(eq(circulations.kind, "floor-digest"), eq(circulations.subject, subject), list ? eq(circulations.listId, list.id) : isNull(circulations.listId)), `The digest for ${digest.sitting}`);
    }
    return enqueueDigestTo(tx, actor.chamber.id, digest, { userId: actor.user.id, name: actor.user.name }, list);
  });
}

const STATUSES = ["queued", "sending", "sent", "failed", "uncertain"] as const;

export async function listCirculations(actor: Actor, limit = 50) {
  const cs = await db.select().from(circulations).where(eq(circulations.chamberId, actor.chamber.id)).orderBy(desc(circulations.createdAt)).limit(limit);
  const counts = cs.length
    ? await db.select({ circulationId: outbox.circulationId, status: outbox.status, n: dsql<number>`count(*)::int` }).from(outbox).where(inArray(outbox.circulationId, cs.map((c) => c.id))).groupBy(outbox.circulationId, outbox.status)
    : [];
  return {
    circulations: cs.map((c) => ({
      id: c.id,
      kind: c.kind,
      rulingId: c.rulingId,
      rulingRevision: c.rulingRevision,
      listName: c.listName,
      subject: c.subject,
      sentByName: c.sentByName,
      createdAt: c.createdAt.toISOString(),
      skipped: Array.isArray(c.skipped) ? c.skipped.length : 0,
      status: Object.fromEntries(STATUSES.map((s) => [s, counts.find((x) => x.circulationId === c.id && x.status === s)?.n ?? 0])) as Record<(typeof STATUSES)[number], number>,
    })),
  };
}

export async function getCirculation(actor: Actor, id: string) {
  if (!uuid.safeParse(id).success) throw new GavelError("not-found", "No such circulation in this chamber.");
  const [c] = await db.select().from(circulations).where(and(eq(circulations.id, id), eq(circulations.chamberId, actor.chamber.id)));
  if (!c) throw new GavelError("not-found", "No such circulation in this chamber.");
  const msgs = await db.select().from(outbox).where(eq(outbox.circulationId, c.id)).orderBy(asc(outbox.to));
  return {
    circulation: { id: c.id, kind: c.kind, rulingId: c.rulingId, rulingRevision: c.rulingRevision, listName: c.listName, subject: c.subject, sentByName: c.sentByName, createdAt: c.createdAt.toISOString(), skipped: c.skipped },
    messages: msgs.map((m) => ({ id: m.id, to: m.to, status: m.status, attempts: m.attempts, lastError: m.lastError, sentAt: m.sentAt?.toISOString() ?? null, nextAttemptAt: m.nextAttemptAt.toISOString() })),
  };
}

/** Requeue one failed or uncertain message of this chamber (a person's decision). */
export async function retryMessage(actor: Actor, messageId: string) {
  if (!uuid.safeParse(messageId).success) throw new GavelError("not-found", "No such message in this chamber.");
  const [m] = await db.select({ id: outbox.id, status: outbox.status }).from(outbox).where(and(eq(outbox.id, messageId), eq(outbox.chamberId, actor.chamber.id)));
  if (!m) throw new GavelError("not-found", "No such message in this chamber.");
  if (m.status !== "failed" && m.status !== "uncertain") throw new GavelError("conflict", `This message is ${m.status}; only failed or uncertain messages can be requeued.`, { details: { status: m.status } });
  await requeueMail([m.id]);
  return { id: m.id, status: "queued" };
}

/** What an unsubscribe link refers to (for the confirmation page). */
export async function describeUnsubscribe(token: string) {
  const p = verifyUnsubscribe(token);
  const [list] = p.listId ? await db.select({ name: distributionLists.name }).from(distributionLists).where(and(eq(distributionLists.id, p.listId), eq(distributionLists.chamberId, p.chamberId))) : [];
  const chamber = await chamberName(db, p.chamberId);
  const [already] = await db.select({ id: mailSuppressions.id }).from(mailSuppressions).where(and(eq(mailSuppressions.chamberId, p.chamberId), eq(mailSuppressions.email, p.email), p.listId ? or(eq(mailSuppressions.listId, p.listId), isNull(mailSuppressions.listId)) : isNull(mailSuppressions.listId)));
  return { email: p.email, chamber, listName: list?.name ?? (p.listId ? "a list that no longer exists" : "the chamber's clerks' mail"), unsubscribed: !!already };
}

/** Honour an unsubscribe link: later sendings to that list skip the address. Idempotent. */
export async function unsubscribe(token: string) {
  const p = verifyUnsubscribe(token);
  if (p.listId) {
    const [list] = await db.select({ id: distributionLists.id }).from(distributionLists).where(and(eq(distributionLists.id, p.listId), eq(distributionLists.chamberId, p.chamberId)));
    if (!list) return { email: p.email, unsubscribed: true };
  }
  const [o] = await db.select({ id: organization.id }).from(organization).where(eq(organization.id, p.chamberId));
  if (!o) return { email: p.email, unsubscribed: true };
  await db.insert(mailSuppressions).values({ chamberId: p.chamberId, listId: p.listId, email: p.email }).onConflictDoNothing();
  return { email: p.email, unsubscribed: true };
}
