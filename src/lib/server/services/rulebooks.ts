/**
 * Rulebook versions of a chamber: list, read, save (a new version each time, with optimistic
 * concurrency), import, export, compare and adopt. Validation is the core's parseRulebook;
 * nothing here interprets rules.
 */
import { and, asc, desc, eq, lte, sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { dateOrDateTime, safe } from "../../schema-parts.ts";
import { db, type Tx } from "../db.ts";
import { user } from "../../db/schema/auth.ts";
import { rulebookAdoptions, rulebookVersions } from "../../db/schema/rulebooks.ts";
import { GavelError } from "../../errors.ts";
import { MAX_RULEBOOK_BYTES, parseRulebook, parseRulebookText } from "../../procedure/parse-rulebook.ts";
import type { Rulebook } from "../../procedure/rulebook-schema.ts";
import { diffRulebooks, type RulebookDiff } from "../rulebook-diff.ts";
import { changeLine, describeChanges, type PlainChange } from "../../procedure/rulebook-changes.ts";
import { rulebookTemplates, rulebookTemplate } from "../rulebook-templates.ts";
import { refuseBadText, type Actor } from "../http.ts";
import { chamberMemory, forgetChamber } from "../chamber-memory.ts";
import { fromZonedInput, isoDateIn } from "../../text/dates.ts";

export { MAX_RULEBOOK_BYTES };

export const versionIdSchema = z.uuid({ message: "must be a version id" });

export const saveVersionSchema = z.object({
  /** The version the edit started from; null only for a chamber's first rulebook. */
  basedOn: versionIdSchema.nullable(),
  note: safe(z.string().trim().max(1000)).default(""),
  /** Set when the edit started from a shipped template. */
  template: safe(z.string().regex(/^[a-z0-9-]{1,80}$/)).optional(),
  document: z.record(z.string(), z.unknown()),
});
export type SaveVersionInput = z.output<typeof saveVersionSchema>;

export const adoptSchema = z.object({
  /** The day (or moment) from which the version is in force; today when omitted. */
  effectiveFrom: dateOrDateTime().optional(),
  note: safe(z.string().trim().max(1000)).default(""),
});

export const compareQuerySchema = z.object({ from: versionIdSchema, to: versionIdSchema });

const versionColumns = {
  id: rulebookVersions.id,
  number: rulebookVersions.number,
  basedOn: rulebookVersions.basedOn,
  title: rulebookVersions.title,
  origin: rulebookVersions.origin,
  note: rulebookVersions.note,
  author: user.name,
  createdAt: rulebookVersions.createdAt,
};

export interface InForce {
  adoptionId: string;
  versionId: string;
  number: number;
  title: string;
  effectiveFrom: Date;
}

/** The adoption in force at `at` (the latest whose effective date has come), or null. */
export async function rulebookInForce(chamberId: string, at = new Date(), q: Tx | typeof db = db): Promise<InForce | null> {
  const [row] = await q
    .select({ adoptionId: rulebookAdoptions.id, versionId: rulebookAdoptions.versionId, number: rulebookVersions.number, title: rulebookVersions.title, effectiveFrom: rulebookAdoptions.effectiveFrom })
    .from(rulebookAdoptions)
    .innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id))
    .where(and(eq(rulebookAdoptions.chamberId, chamberId), lte(rulebookAdoptions.effectiveFrom, at)))
    .orderBy(desc(rulebookAdoptions.effectiveFrom), desc(rulebookAdoptions.adoptedAt))
    .limit(1);
  return row ?? null;
}

// Every adoption of a chamber, newest in force first: the legal-moves question and the tree read
// need the version in force on every call, and adoptions change rarely (see chamber-memory.ts).
const adoptionsOf = chamberMemory((chamberId) =>
  db
    .select({ adoptionId: rulebookAdoptions.id, versionId: rulebookAdoptions.versionId, number: rulebookVersions.number, title: rulebookVersions.title, effectiveFrom: rulebookAdoptions.effectiveFrom })
    .from(rulebookAdoptions)
    .innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id))
    .where(eq(rulebookAdoptions.chamberId, chamberId))
    .orderBy(desc(rulebookAdoptions.effectiveFrom), desc(rulebookAdoptions.adoptedAt)),
);

/** rulebookInForce(chamberId, now), answered from the remembered adoptions. */
async function inForceNow(chamberId: string): Promise<InForce | null> {
  const now = Date.now();
  return (await adoptionsOf(chamberId)).find((a) => a.effectiveFrom.getTime() <= now) ?? null;
}

/** When the next adoption already recorded comes into force (a later effective date), or null. */
export async function nextAdoptionInForce(chamberId: string): Promise<Date | null> {
  const now = Date.now();
  const later = (await adoptionsOf(chamberId)).filter((a) => a.effectiveFrom.getTime() > now);
  return later.length ? new Date(Math.min(...later.map((a) => a.effectiveFrom.getTime()))) : null;
}

export async function listRulebooks(actor: Actor) {
  const versions = await db
    .select(versionColumns)
    .from(rulebookVersions)
    .leftJoin(user, eq(rulebookVersions.authorId, user.id))
    .where(eq(rulebookVersions.chamberId, actor.chamber.id))
    .orderBy(desc(rulebookVersions.number));
  const adoptions = await db
    .select({ id: rulebookAdoptions.id, versionId: rulebookAdoptions.versionId, number: rulebookVersions.number, effectiveFrom: rulebookAdoptions.effectiveFrom, note: rulebookAdoptions.note, adoptedBy: user.name, adoptedAt: rulebookAdoptions.adoptedAt })
    .from(rulebookAdoptions)
    .innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id))
    .leftJoin(user, eq(rulebookAdoptions.adoptedBy, user.id))
    .where(eq(rulebookAdoptions.chamberId, actor.chamber.id))
    .orderBy(desc(rulebookAdoptions.effectiveFrom), desc(rulebookAdoptions.adoptedAt));
  const templates = (await rulebookTemplates()).map((t) => ({ id: t.id, title: t.title, chamber: t.chamber, aliases: t.aliases, source: t.source, verify: t.verify }));
  return { versions, adoptions, inForce: await rulebookInForce(actor.chamber.id), latest: versions[0] ? { id: versions[0].id, number: versions[0].number } : null, templates };
}

async function versionRow(chamberId: string, id: string, q: Tx | typeof db = db) {
  if (!versionIdSchema.safeParse(id).success) throw new GavelError("not-found", "No such rulebook version in this chamber.");
  const [row] = await q
    .select({ ...versionColumns, document: rulebookVersions.document })
    .from(rulebookVersions)
    .leftJoin(user, eq(rulebookVersions.authorId, user.id))
    .where(and(eq(rulebookVersions.id, id), eq(rulebookVersions.chamberId, chamberId)));
  if (!row) throw new GavelError("not-found", "No such rulebook version in this chamber.");
  return row;
}

export async function getVersion(actor: Actor, id: string) {
  const row = await versionRow(actor.chamber.id, id);
  const [latest] = await db.select({ id: rulebookVersions.id, number: rulebookVersions.number }).from(rulebookVersions).where(eq(rulebookVersions.chamberId, actor.chamber.id)).orderBy(desc(rulebookVersions.number)).limit(1);
  const adoptions = await db.select({ effectiveFrom: rulebookAdoptions.effectiveFrom, adoptedAt: rulebookAdoptions.adoptedAt }).from(rulebookAdoptions).where(and(eq(rulebookAdoptions.versionId, row.id), eq(rulebookAdoptions.chamberId, actor.chamber.id))).orderBy(asc(rulebookAdoptions.adoptedAt));
  const inForce = await rulebookInForce(actor.chamber.id);
  return { ...row, latest: latest ?? null, adoptions, inForce: inForce?.versionId === row.id };
}

/** The parsed rulebook a chamber works by: a named version, or the one in force. */
export async function loadRulebook(chamberId: string, versionId?: string | null): Promise<{ versionId: string; number: number; title: string; rulebook: Rulebook }> {
  let id = versionId ?? null;
  if (!id) {
    const f = await inForceNow(chamberId);
    if (!f) throw new GavelError("not-found", "This chamber has not adopted a rulebook yet. A clerk can adopt one on the Rulebooks page.");
    id = f.versionId;
  }
  const cached = parsedVersions.get(id);
  if (cached && cached.chamberId === chamberId) return cached.value;
  const row = await versionRow(chamberId, id);
  const value = { versionId: row.id, number: row.number, title: row.title, rulebook: parseRulebook(row.document) };
  rememberParsed(id, chamberId, value);
  return value;
}

// A saved version never changes, so its parsed form can be kept: parsing and checking a
// rulebook costs far more than answering a legal-moves question with it. Bounded, oldest out.
const PARSED_CACHE_SIZE = 64;
const parsedVersions = new Map<string, { chamberId: string; value: { versionId: string; number: number; title: string; rulebook: Rulebook } }>();
function rememberParsed(id: string, chamberId: string, value: { versionId: string; number: number; title: string; rulebook: Rulebook }) {
  parsedVersions.set(id, { chamberId, value });
  if (parsedVersions.size > PARSED_CACHE_SIZE) parsedVersions.delete(parsedVersions.keys().next().value!);
}

// Serialises saves per chamber, so two saves based on the same version cannot both win.
const lockChamber = (tx: Tx, chamberId: string) => tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${"rulebooks:" + chamberId}))`);

export interface StaleDetails {
  basedOn: { id: string; number: number } | null;
  latest: { id: string; number: number; author: string | null; createdAt: Date; note: string };
  savedSince: Array<{ id: string; number: number; author: string | null; note: string }>;
  changes: RulebookDiff;
  /** The same changes in plain words (added December 2026). */
  plainChanges: PlainChange[];
}

/** Save a new version. The document is validated first (nothing stored when invalid). */
export async function saveVersion(actor: Actor, input: SaveVersionInput, origin = input.template ? `template:${input.template}` : "edit") {
  const parsed = parseRulebook(input.document);
  if (input.template) await rulebookTemplate(input.template);
  return db.transaction(async (tx) => {
    await lockChamber(tx, actor.chamber.id);
    const history = await tx
      .select({ id: rulebookVersions.id, number: rulebookVersions.number, author: user.name, note: rulebookVersions.note, createdAt: rulebookVersions.createdAt, document: rulebookVersions.document })
      .from(rulebookVersions)
      .leftJoin(user, eq(rulebookVersions.authorId, user.id))
      .where(eq(rulebookVersions.chamberId, actor.chamber.id))
      .orderBy(desc(rulebookVersions.number));
    const latest = history[0];
    const base = input.basedOn ? history.find((h) => h.id === input.basedOn) : null;
    if (input.basedOn && !base) throw new GavelError("not-found", "The version this edit is based on does not exist in this chamber.", { issues: [{ path: "basedOn", message: "no such version" }] });
    if (latest && latest.id !== input.basedOn) {
      const since = history.filter((h) => h.number > (base?.number ?? 0));
      const details: StaleDetails = {
        basedOn: base ? { id: base.id, number: base.number } : null,
        latest: { id: latest.id, number: latest.number, author: latest.author, createdAt: latest.createdAt, note: latest.note },
        savedSince: since.map((h) => ({ id: h.id, number: h.number, author: h.author, note: h.note })),
        changes: diffRulebooks(base?.document ?? {}, latest.document),
        plainChanges: describeChanges(base?.document ?? {}, latest.document),
      };
      throw new GavelError(
        "conflict",
        `Version ${latest.number} was saved by ${latest.author ?? "someone"} after you started from ${base ? `version ${base.number}` : "a blank rulebook"}. Nothing was saved. Changed since: ${details.plainChanges.slice(0, 5).map(changeLine).join(" · ") || "nothing in substance"}${details.plainChanges.length > 5 ? ` (and ${details.plainChanges.length - 5} more)` : ""}.`,
        { issues: [{ path: "basedOn", message: `stale: the latest version is ${latest.number}` }], details: details as unknown as Record<string, unknown> },
      );
    }
    const [row] = await tx
      .insert(rulebookVersions)
      .values({ chamberId: actor.chamber.id, number: (latest?.number ?? 0) + 1, basedOn: input.basedOn, title: parsed.title, document: input.document, origin, note: input.note, authorId: actor.user.id })
      .returning({ id: rulebookVersions.id, number: rulebookVersions.number, title: rulebookVersions.title, createdAt: rulebookVersions.createdAt });
    return row;
  });
}

export const importFieldsSchema = z.object({
  basedOn: z.union([versionIdSchema, z.literal("").transform(() => null)]).nullable().default(null),
  note: safe(z.string().trim().max(1000)).default(""),
});

const JSON_TYPES = new Set(["application/json", "text/json", ""]);

/** Import an uploaded rulebook file (the form as the route read it: readRulebookUpload in uploads.ts); type-checked, parsed, then saved. */
export async function importVersion(actor: Actor, form: FormData) {
  const file = form.get("file");
  if (!(file instanceof File)) throw new GavelError("invalid-input", "Choose a rulebook file to upload.", { issues: [{ path: "file", message: "no file in the upload" }] });
  if (file.size > MAX_RULEBOOK_BYTES) throw new GavelError("too-large", `${file.name} is ${file.size} bytes; a rulebook file may be at most ${MAX_RULEBOOK_BYTES} bytes.`, { issues: [{ path: "file", message: "too large" }] });
  const mime = file.type.split(";")[0].trim().toLowerCase();
  if (!JSON_TYPES.has(mime) || (file.name && !/\.json$/i.test(file.name))) {
    throw new GavelError("invalid-input", `${file.name || "The file"} is not a JSON rulebook file (.json, application/json).`, { issues: [{ path: "file", message: `expected a .json file, got ${mime || "no type"}` }] });
  }
  const fields = importFieldsSchema.safeParse({ basedOn: form.get("basedOn") ?? null, note: form.get("note") ?? "" });
  if (!fields.success) throw new GavelError("invalid-input", "The upload's fields are not valid.", { issues: fields.error.issues.map((i) => ({ path: i.path.join(".") || "(root)", message: i.message })) });
  const text = await file.text();
  parseRulebookText(text);
  const document = JSON.parse(text) as Record<string, unknown>;
  refuseBadText(document, "rulebook file");
  return saveVersion(actor, { basedOn: fields.data.basedOn, note: fields.data.note || `Imported from ${file.name}`, document }, "import");
}

export async function exportVersion(actor: Actor, id: string) {
  const row = await versionRow(actor.chamber.id, id);
  const doc = row.document as Record<string, unknown>;
  const slug = String(doc.id ?? "rulebook").replace(/[^a-z0-9-]/gi, "-");
  return { filename: `${slug}-v${row.number}.json`, text: JSON.stringify(row.document, null, 2) + "\n" };
}

export async function compareVersions(actor: Actor, fromId: string, toId: string) {
  const [a, b] = await Promise.all([versionRow(actor.chamber.id, fromId), versionRow(actor.chamber.id, toId)]);
  const strip = ({ document: _d, ...meta }: typeof a) => meta;
  // `changes`: the same comparison in plain words (added December 2026; `diff` is unchanged).
  return { from: strip(a), to: strip(b), diff: diffRulebooks(a.document, b.document), changes: describeChanges(a.document, b.document) };
}

function effectiveDate(input: string | undefined, timeZone: string): Date {
  const now = new Date();
  if (!input) return now;
  // A bare date means the start of that day on the chamber's clock, so every screen (which shows dates in the chamber's
  // zone) reads the same day. Today means the moment of adoption: "with effect from today" then supersedes an adoption
  // made earlier today, whose effect ran from its own moment (the later adoption of the same day prevails).
  if (/^\d{4}-\d{2}-\d{2}$/.test(input)) {
    if (input === isoDateIn(now, { timeZone })) return now;
    return new Date(fromZonedInput(`${input}T00:00`, { timeZone }) ?? `${input}T00:00:00Z`);
  }
  return new Date(input);
}

/** Adopt a version with effect from a date; earlier adoptions are kept. */
export async function adoptVersion(actor: Actor, id: string, input: z.output<typeof adoptSchema>) {
  const row = await versionRow(actor.chamber.id, id);
  const effectiveFrom = effectiveDate(input.effectiveFrom, actor.chamber.timeZone);
  // The bench of scenarios against the version in force: a version that changes any verdict is adopted only with a note saying why.
  const { benchReport } = await import("./scenarios.ts");
  const bench = await benchReport(actor.chamber.id, { id: row.id, number: row.number }, parseRulebook(row.document));
  if (bench.changed.length && !input.note) {
    const names = bench.changed.map((c) => `"${c.title}"`).join(", ");
    throw new GavelError("invalid-input", `${bench.changed.length === 1 ? "One scenario changes" : `${bench.changed.length} scenarios change`} verdict against the version in force (${names}). Say in a note why the chamber adopts it.`, { issues: [{ path: "note", message: "required when scenarios change verdict" }], details: { changed: bench.changed } });
  }
  const [a] = await db.insert(rulebookAdoptions).values({ chamberId: actor.chamber.id, versionId: row.id, effectiveFrom, note: input.note, adoptedBy: actor.user.id }).returning();
  forgetChamber(actor.chamber.id);
  return { id: a.id, versionId: row.id, number: row.number, effectiveFrom: a.effectiveFrom, inForce: (await rulebookInForce(actor.chamber.id))?.versionId === row.id, scenariosChanged: bench.changed.map((c) => c.id) };
}

export async function templateDocument(id: string) {
  return rulebookTemplate(id);
}
