/**
 * The chamber's own rules, clause by clause: upload (the measures' upload path: PDF, DOCX, plain text,
 * Markdown, checked by content), split into clauses, kept one row per upload; the coverage of the text
 * by a rulebook version's clause links; and saving links as a new rulebook version (through saveVersion,
 * so stale edits are refused as for any other save).
 */
import { and, desc, eq, sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { db } from "../db.ts";
import { user } from "../../db/schema/auth.ts";
import { chamberTexts } from "../../db/schema/chamber-text.ts";
import { GavelError, parseWith, type InputIssue } from "../../errors.ts";
import { clauseCoverage, linkableItems, setClauseLink } from "../../chamber-text/coverage.ts";
import { splitClauses, type Clause } from "../../chamber-text/split-clauses.ts";
import { clauseRefSchema } from "../../procedure/voting-section.ts";
import { parseRulebook } from "../../procedure/parse-rulebook.ts";
import { checkDocument, readMultipart } from "../uploads.ts";
import type { Actor } from "../http.ts";
import { getVersion, saveVersion, versionIdSchema } from "./rulebooks.ts";

const uploadFieldsSchema = z.object({
  title: z.string().trim().max(300).optional(),
  note: z.string().trim().max(1000).default(""),
});

const textColumns = {
  id: chamberTexts.id,
  number: chamberTexts.number,
  title: chamberTexts.title,
  filename: chamberTexts.filename,
  kind: chamberTexts.kind,
  size: chamberTexts.size,
  note: chamberTexts.note,
  author: user.name,
  createdAt: chamberTexts.createdAt,
};

/** Upload the chamber's rules as a new version of its text. Nothing is stored unless the file reads and splits. */
export async function uploadChamberText(actor: Actor, request: Request) {
  const { fields, file } = await readMultipart(request);
  if (!file) throw new GavelError("invalid-input", "Choose the document of the chamber's rules to upload.", { issues: [{ path: "file", message: "no file in the upload" }] });
  const meta = parseWith(uploadFieldsSchema, { title: fields.title || undefined, note: fields.note ?? "" }, "upload");
  const doc = await checkDocument(file);
  const { clauses, preamble } = splitClauses(doc.text);
  if (clauses.length === 0) throw new GavelError("invalid-input", `${doc.filename}: no numbered clauses were found (rules, standing orders, "§", "1.", "(a)"…). Check that the document is the chamber's rules and that its text can be selected.`, { issues: [{ path: "file", message: "no numbered clauses found" }] });
  const title = meta.title || preamble.split("\n")[0]?.trim().slice(0, 300) || doc.filename;
  return db.transaction(async (tx) => {
    await tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${"chamber-text:" + actor.chamber.id}))`);
    const [latest] = await tx.select({ number: chamberTexts.number }).from(chamberTexts).where(eq(chamberTexts.chamberId, actor.chamber.id)).orderBy(desc(chamberTexts.number)).limit(1);
    const [row] = await tx
      .insert(chamberTexts)
      .values({ chamberId: actor.chamber.id, number: (latest?.number ?? 0) + 1, title, filename: doc.filename, kind: doc.kind, size: doc.size, sha256: doc.sha256, text: doc.text, clauses, preamble, note: meta.note, authorId: actor.user.id })
      .returning({ id: chamberTexts.id, number: chamberTexts.number, title: chamberTexts.title, createdAt: chamberTexts.createdAt });
    return { ...row!, clauses: clauses.length };
  });
}

/** Every upload of the chamber's text, newest first (without the text). */
export async function listChamberTexts(actor: Actor) {
  return db.select(textColumns).from(chamberTexts).leftJoin(user, eq(chamberTexts.authorId, user.id)).where(eq(chamberTexts.chamberId, actor.chamber.id)).orderBy(desc(chamberTexts.number));
}

/** One upload with its clauses; the latest when `id` is null. Null when the chamber has none. */
export async function getChamberText(actor: Actor, id: string | null) {
  if (id !== null && !versionIdSchema.safeParse(id).success) throw new GavelError("not-found", "No such text of the chamber's rules.");
  const where = id === null ? eq(chamberTexts.chamberId, actor.chamber.id) : and(eq(chamberTexts.chamberId, actor.chamber.id), eq(chamberTexts.id, id));
  const [row] = await db
    .select({ ...textColumns, clauses: chamberTexts.clauses, preamble: chamberTexts.preamble })
    .from(chamberTexts)
    .leftJoin(user, eq(chamberTexts.authorId, user.id))
    .where(where)
    .orderBy(desc(chamberTexts.number))
    .limit(1);
  if (!row && id !== null) throw new GavelError("not-found", "No such text of the chamber's rules.");
  return row ? { ...row, clauses: row.clauses as Clause[] } : null;
}

/** The coverage of the chamber's text (the latest upload, or `textId`) by a rulebook version's links. */
export async function versionCoverage(actor: Actor, versionId: string, textId: string | null) {
  const version = await getVersion(actor, versionId);
  const rulebook = parseRulebook(version.document);
  const text = await getChamberText(actor, textId);
  const items = linkableItems(rulebook);
  if (!text) return { version: { id: version.id, number: version.number }, text: null, items, coverage: null };
  const { id, number, title, filename, createdAt } = text;
  return { version: { id: version.id, number: version.number }, text: { id, number, title, filename, createdAt, clauses: text.clauses }, items, coverage: clauseCoverage(rulebook, text.clauses) };
}

export const linksSchema = z.object({
  links: z
    .array(z.object({ path: z.string().min(1).max(200), clause: clauseRefSchema.nullable() }))
    .min(1)
    .max(500),
  note: z.string().trim().max(1000).default(""),
  /** The upload of the chamber's text the clauses come from; the latest when omitted. */
  textId: versionIdSchema.optional(),
});

/**
 * Link items of a rulebook version to clauses, saving the result as a new version based on it. Every
 * path must be a linkable item of that version and every clause a clause of the text; otherwise nothing
 * is saved and each bad link is named (`links.2.clause`).
 */
export async function saveClauseLinks(actor: Actor, versionId: string, input: z.output<typeof linksSchema>) {
  const version = await getVersion(actor, versionId);
  const rulebook = parseRulebook(version.document);
  const text = await getChamberText(actor, input.textId ?? null);
  if (!text) throw new GavelError("invalid-input", "Upload the chamber's rules before linking to their clauses.", { issues: [{ path: "textId", message: "the chamber has no text of its rules yet" }] });
  const paths = new Set(linkableItems(rulebook).map((i) => i.path));
  const keys = new Set(text.clauses.map((c) => c.key));
  const issues: InputIssue[] = [];
  input.links.forEach((l, i) => {
    if (!paths.has(l.path)) issues.push({ path: `links.${i}.path`, message: `"${l.path}" is not an item of version ${version.number} that can be linked` });
    if (l.clause !== null && !keys.has(l.clause)) issues.push({ path: `links.${i}.clause`, message: `no clause "${l.clause}" in the chamber's text (upload ${text.number})` });
  });
  if (issues.length) throw new GavelError("invalid-input", `links: ${issues[0]!.path}: ${issues[0]!.message}`, { issues });
  let document = version.document as Record<string, unknown>;
  for (const l of input.links) document = setClauseLink(document, l.path, l.clause);
  const note = input.note || `Linked ${input.links.length === 1 ? "an item" : `${input.links.length} items`} to the chamber's rules`;
  return saveVersion(actor, { basedOn: version.id, note, document });
}
