/**
 * Preference estimates of a measure: created, saved as new versions (never overwritten),
 * duplicated and shared. An estimate is visible to its author, to the roles and the people it is
 * shared with, and to nobody else (not even a chief clerk: it may be a member's private reckoning).
 * Versions of the measure (the alternatives) come from the voting engine's amendmentTreeModel over
 * the amendments the estimate considers; CSV parsing and validation are the pure src/lib/estimates.
 */
import { and, asc, desc, eq, inArray, isNull } from "drizzle-orm";
import { z } from "zod";
import { safe, version, queryInt } from "../../schema-parts.ts";
import { db, type Tx } from "../db.ts";
import { member, user } from "../../db/schema/auth.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendments, measures } from "../../db/schema/measures.ts";
import { estimates, estimateVersions } from "../../db/schema/estimates.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { CHAMBER_ROLES, can } from "../../permissions.ts";
import type { Actor } from "../http.ts";
import { amendmentTreeModel } from "../../voting/amendment-versions.ts";
import { estimateContentSchema, type EstimateContent } from "../../estimates/estimate-content.ts";
import { parseBallotCsv } from "../../estimates/ballot-csv.ts";
import { parseIdealCsv } from "../../estimates/ideal-csv.ts";
import { ballotTemplate, idealTemplate, rosterBlocs } from "../../estimates/csv-template.ts";
import { versionInWords, versionShort, type TreeLabels } from "../../estimates/version-words.ts";
import { amendmentKey } from "./amendments.ts";
import { measureRow } from "./measures.ts";
import { caseFromRows, MEASURE_KEY } from "./trees.ts";
import { readStored } from "../stored-json.ts";
import { amendmentLabels, sectionInWords } from "../../amendments/amendment-words.ts";

export type EstimateRow = typeof estimates.$inferSelect;

const uuidLike = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const PENDING = new Set(["draft", "filed", "pending"]);

export const scopeSchema = z.array(safe(z.string().trim().min(1).max(40))).max(16);
const sharingFields = {
  sharedRoles: z.array(z.enum(CHAMBER_ROLES)).max(CHAMBER_ROLES.length).default([]),
  sharedUsers: z.array(safe(z.string().min(1).max(100))).max(200).default([]),
};
export const createEstimateSchema = z.object({
  measureId: safe(z.string().min(1).max(100)),
  title: safe(z.string().trim().min(1).max(200)),
  scope: scopeSchema,
  content: estimateContentSchema,
  note: safe(z.string().max(2000)).default(""),
  ...sharingFields,
});
export const saveVersionSchema = z.object({ basedOn: version(), scope: scopeSchema, content: estimateContentSchema, note: safe(z.string().max(2000)).default("") });
export const sharingSchema = z.object(sharingFields);
export const duplicateSchema = z.object({ title: safe(z.string().trim().min(1).max(200)).optional(), version: version().optional() });
export const importQuerySchema = z.object({
  measureId: safe(z.string().min(1).max(100)).optional(),
  estimateId: safe(z.string().min(1).max(100)).optional(),
  basedOn: queryInt().min(1).optional(),
  title: safe(z.string().trim().min(1).max(200)).optional(),
  kind: z.enum(["ballots", "spatial"]).default("ballots"),
  scope: safe(z.string().max(800)).default(""),
  dimensions: safe(z.string().max(800)).optional(),
  partial: z.enum(["abstain", "bottom"]).default("abstain"),
  preview: z.enum(["0", "1"]).default("0"),
});
export const rosterDraftSchema = z.object({
  measureId: safe(z.string().min(1).max(100)),
  title: safe(z.string().trim().min(1).max(200)),
  scope: scopeSchema,
  kind: z.enum(["ballots", "spatial"]).default("ballots"),
  per: z.enum(["bloc", "member"]).default("bloc"),
  partial: z.enum(["abstain", "bottom"]).default("abstain"),
  dimensions: z.array(safe(z.string().trim().min(1).max(80))).min(1).max(8).default(["economy", "environment"]),
});
export const templateQuerySchema = z.object({ measureId: safe(z.string().min(1).max(100)), scope: safe(z.string().max(800)).default(""), kind: z.enum(["ballots", "spatial"]).default("ballots"), dimensions: safe(z.string().max(800)).optional(), per: z.enum(["bloc", "member"]).default("bloc") });

export function visibleTo(e: Pick<EstimateRow, "authorId" | "sharedRoles" | "sharedUsers">, actor: Actor): boolean {
  return e.authorId === actor.user.id || e.sharedRoles.includes(actor.role) || e.sharedUsers.includes(actor.user.id);
}

/** The estimate if the actor may see it; otherwise not-found (its existence is private too). */
export async function estimateRow(actor: Actor, id: string, q: Tx | typeof db = db, lock = false): Promise<EstimateRow> {
  if (!uuidLike.test(id)) throw new GavelError("not-found", "No such estimate in this chamber.");
  const base = q.select().from(estimates).where(and(eq(estimates.id, id), eq(estimates.chamberId, actor.chamber.id)));
  const [row] = lock ? await base.for("update") : await base;
  if (!row || !visibleTo(row, actor)) throw new GavelError("not-found", "No such estimate in this chamber.");
  return row;
}

function requireAuthor(e: EstimateRow, actor: Actor): void {
  if (e.authorId !== actor.user.id) throw new GavelError("forbidden", "Only the estimate's author can change it; duplicate it to make your own.");
}

export function parseScope(text: string): string[] {
  return text.split(/[\s,]+/).map((s) => s.trim()).filter(Boolean);
}

/** The measure's tree restricted to `scope`, its versions and their plain-language labels. */
export async function treeFor(chamberId: string, measureId: string, scope: string[], q: Tx | typeof db = db) {
  const m = await measureRow(chamberId, measureId, q);
  const rows = await q.select().from(amendments).where(and(eq(amendments.measureId, m.id), eq(amendments.chamberId, chamberId))).orderBy(asc(amendments.createdAt));
  rows.sort((x, y) => (x.number ?? Infinity) - (y.number ?? Infinity));
  // Under the lasting keys (amendmentKey), which an estimate's stored scope names.
  const c = caseFromRows(m, rows, new Map(rows.map((r) => [r.id, amendmentKey(r)])));
  const pending = c.amendments.filter((a) => PENDING.has(a.status ?? "filed"));
  const keys = new Set(pending.map((a) => a.id));
  const unknown = scope.findIndex((k) => !keys.has(k));
  if (unknown >= 0) throw new GavelError("unprocessable", `scope.${unknown}: "${scope[unknown]}" is not a pending amendment of ${m.number}`, { issues: [{ path: `scope.${unknown}`, message: `not a pending amendment; pending: ${[...keys].join(", ") || "none"}` }] });
  if (new Set(scope).size !== scope.length) throw new GavelError("invalid-input", "scope: an amendment is listed twice", { issues: [{ path: "scope", message: "duplicate amendment" }] });
  const chosen = pending.filter((a) => scope.includes(a.id));
  const model = amendmentTreeModel({ measure: c.measure, amendments: chosen }, "scope");
  const byKey = new Map(rows.map((r) => [amendmentKey(r), r]));
  // What people read for each key: "A3"; a draft, whose lasting key is internal, "Draft" or "Draft-1".
  const readable = amendmentLabels(rows);
  const labelOf = (key: string) => readable.get(byKey.get(key)?.id ?? "") ?? key;
  const sectionHeading = new Map(m.sections.map((s) => [s.id, s.heading ?? s.id]));
  const labels: TreeLabels = {
    measureKey: MEASURE_KEY,
    measureLabel: m.number,
    amendments: Object.fromEntries(
      chosen.map((a) => {
        const r = byKey.get(a.id)!;
        const degree: 1 | 2 = a.target === MEASURE_KEY || sectionHeading.has(a.target) ? 1 : 2;
        const targetLabel = a.target === MEASURE_KEY ? `the whole of ${m.number}` : sectionHeading.has(a.target) ? `${sectionInWords(a.target)} (${sectionHeading.get(a.target)})` : `amendment ${labelOf(a.target)}`;
        return [a.id, { label: labelOf(a.id), title: r.title, form: r.form, target: a.target, targetLabel, lines: r.lineFrom === null ? null : [r.lineFrom, r.lineTo!] as [number, number], degree }];
      }),
    ),
  };
  return {
    measure: m,
    case: { measure: c.measure, amendments: chosen },
    pending: pending.map((a) => ({ key: a.id, label: labelOf(a.id), title: byKey.get(a.id)?.title ?? null, target: a.target, form: a.form, outOfOrder: outOfOrder(c.measure, pending, a.id) })),
    versions: model.versions.map((v) => ({ id: v.id, amendments: v.amendments, short: versionShort(v.id, labels), words: versionInWords(v.id, labels) })),
    labels,
  };
}

/**
 * Why an amendment cannot be part of an estimate, or null: the voting engine models it together with
 * the amendments it depends on (its chain of targets), and refuses what is out of order — an
 * amendment of the third degree, the same check the tree validation reports (amendment-versions.ts,
 * Robert's Rules of Order Revised 1915, §33).
 */
function outOfOrder(measure: ReturnType<typeof caseFromRows>["measure"], pending: ReturnType<typeof caseFromRows>["amendments"], key: string): string | null {
  const byId = new Map(pending.map((a) => [a.id, a]));
  const chain: typeof pending = [];
  for (let k: string | undefined = key; k !== undefined && byId.has(k) && !chain.some((x) => x.id === k); k = byId.get(k)?.target) chain.unshift(byId.get(k)!);
  try {
    amendmentTreeModel({ measure, amendments: chain }, "scope");
    return null;
  } catch (e) {
    if (!(e instanceof GavelError)) throw e;
    const why = e.issues[0]?.message ?? e.message;
    return why.includes("third-degree") ? "an amendment of the third degree is out of order" : why;
  }
}

/** Check the content against the versions of its scope (rankings name versions; effects name amendments). */
function checkContent(content: EstimateContent, versionIds: string[], scope: string[]): void {
  if (content.kind === "ballots") {
    const known = new Set(versionIds);
    content.rows.forEach((r, i) => {
      const seen = new Set<string>();
      r.ranking.flat().forEach((v, j) => {
        if (!known.has(v)) throw new GavelError("unprocessable", `content.rows.${i}.ranking: unknown version ${v}`, { issues: [{ path: `content.rows.${i}.ranking.${j}`, message: `unknown version ${v}; the versions are ${versionIds.join(", ")}` }] });
        if (seen.has(v)) throw new GavelError("invalid-input", `content.rows.${i}.ranking: ${v} is ranked twice`, { issues: [{ path: `content.rows.${i}.ranking.${j}`, message: `${v} is ranked twice` }] });
        seen.add(v);
      });
    });
  } else {
    const d = content.dimensions.length;
    const dim = (v: number[], p: string) => {
      if (v.length !== d) throw new GavelError("invalid-input", `${p}: needs ${d} coordinates`, { issues: [{ path: p, message: `needs ${d} coordinates, one per dimension` }] });
    };
    const names = content.dimensions.map((n) => n.trim().toLowerCase());
    const twice = names.findIndex((n, i) => names.indexOf(n) !== i);
    if (twice >= 0) throw new GavelError("invalid-input", `content.dimensions.${twice}: "${content.dimensions[twice]}" is named twice`, { issues: [{ path: `content.dimensions.${twice}`, message: "dimension names must be distinct" }] });
    if (content.ranges && content.ranges.length !== d) throw new GavelError("invalid-input", `content.ranges: needs ${d} ranges`, { issues: [{ path: "content.ranges", message: `needs ${d} ranges, one per dimension` }] });
    dim(content.statusQuo, "content.statusQuo");
    dim(content.measure, "content.measure");
    content.members.forEach((m, i) => dim(m.ideal, `content.members.${i}.ideal`));
    for (const [k, e] of Object.entries(content.effects)) {
      if (!scope.includes(k)) throw new GavelError("unprocessable", `content.effects.${k}: not an amendment this estimate considers`, { issues: [{ path: `content.effects.${k}`, message: "not in the estimate's scope" }] });
      if (e.position) dim(e.position, `content.effects.${k}.position`);
      if (e.shift) dim(e.shift, `content.effects.${k}.shift`);
    }
  }
}

async function checkSharing(actor: Actor, users: string[], q: Tx | typeof db): Promise<void> {
  if (!users.length) return;
  const rows = await q.select({ userId: member.userId }).from(member).where(and(eq(member.organizationId, actor.chamber.id), inArray(member.userId, users)));
  const found = new Set(rows.map((r) => r.userId));
  const bad = users.findIndex((u) => !found.has(u));
  if (bad >= 0) throw new GavelError("unprocessable", `sharedUsers.${bad}: not a member of this chamber`, { issues: [{ path: `sharedUsers.${bad}`, message: "not a person of this chamber" }] });
}

export async function listEstimates(actor: Actor, measureId?: string) {
  const rows = await db
    .select({ e: estimates, measureNumber: measures.number, measureTitle: measures.title, author: user.name })
    .from(estimates)
    .innerJoin(measures, eq(estimates.measureId, measures.id))
    .leftJoin(user, eq(estimates.authorId, user.id))
    .where(and(eq(estimates.chamberId, actor.chamber.id), ...(measureId ? [eq(estimates.measureId, measureId)] : [])))
    .orderBy(desc(estimates.updatedAt));
  return {
    estimates: rows.filter((r) => visibleTo(r.e, actor)).map((r) => ({ ...summary(r.e, actor), measure: { id: r.e.measureId, number: r.measureNumber, title: r.measureTitle }, author: r.author ?? "(former user)" })),
    canCreate: can(actor.role, "estimate:create"),
  };
}

function summary(e: EstimateRow, actor: Actor) {
  return { id: e.id, title: e.title, kind: e.kind, latestVersion: e.latestVersion, sharedRoles: e.sharedRoles, sharedUsers: e.sharedUsers, mine: e.authorId === actor.user.id, private: e.sharedRoles.length === 0 && e.sharedUsers.length === 0, duplicatedFrom: e.duplicatedFrom, updatedAt: e.updatedAt.toISOString() };
}

/** An estimate version's rows: a person's input, parsed on read (a damaged version throws, it never analyses as empty). */
export function storedContent(v: { number: number; content: unknown }): EstimateContent {
  return readStored(estimateContentSchema, v.content, `content of estimate version ${v.number}`);
}

export async function versionRow(e: EstimateRow, number?: number, q: Tx | typeof db = db) {
  const [v] = await q.select().from(estimateVersions).where(and(eq(estimateVersions.estimateId, e.id), eq(estimateVersions.number, number ?? e.latestVersion)));
  if (!v) throw new GavelError("not-found", `This estimate has no version ${number}.`);
  return v;
}

export async function getEstimate(actor: Actor, id: string, version?: number) {
  const e = await estimateRow(actor, id);
  const v = await versionRow(e, version);
  const tree = await treeFor(actor.chamber.id, e.measureId, v.scope);
  const history = await db.select({ number: estimateVersions.number, note: estimateVersions.note, createdAt: estimateVersions.createdAt, author: user.name }).from(estimateVersions).leftJoin(user, eq(estimateVersions.authorId, user.id)).where(eq(estimateVersions.estimateId, e.id)).orderBy(desc(estimateVersions.number));
  const [author] = e.authorId ? await db.select({ name: user.name }).from(user).where(eq(user.id, e.authorId)) : [];
  return {
    estimate: { ...summary(e, actor), measureId: e.measureId, author: author?.name ?? "(former user)" },
    version: { number: v.number, scope: v.scope, content: storedContent(v), note: v.note, createdAt: v.createdAt.toISOString() },
    history: history.map((h) => ({ ...h, author: h.author ?? "(former user)", createdAt: h.createdAt.toISOString() })),
    measure: { id: tree.measure.id, number: tree.measure.number, title: tree.measure.title },
    pending: tree.pending,
    versions: tree.versions,
    canEdit: e.authorId === actor.user.id,
    canDuplicate: can(actor.role, "estimate:create"),
  };
}

async function insertEstimate(actor: Actor, tx: Tx, fields: { measureId: string; title: string; kind: "ballots" | "spatial"; sharedRoles: string[]; sharedUsers: string[]; duplicatedFrom?: string }, version: { scope: string[]; content: EstimateContent; note: string }) {
  const [e] = await tx.insert(estimates).values({ chamberId: actor.chamber.id, authorId: actor.user.id, latestVersion: 1, ...fields }).returning();
  await tx.insert(estimateVersions).values({ chamberId: actor.chamber.id, estimateId: e.id, number: 1, authorId: actor.user.id, ...version });
  return e;
}

export async function createEstimate(actor: Actor, input: z.output<typeof createEstimateSchema>) {
  const tree = await treeFor(actor.chamber.id, input.measureId, input.scope);
  checkContent(input.content, tree.versions.map((v) => v.id), input.scope);
  return db.transaction(async (tx) => {
    await checkSharing(actor, input.sharedUsers, tx);
    const e = await insertEstimate(actor, tx, { measureId: tree.measure.id, title: input.title, kind: input.content.kind, sharedRoles: input.sharedRoles, sharedUsers: input.sharedUsers }, { scope: input.scope, content: input.content, note: input.note });
    return { id: e.id, version: 1 };
  });
}

/** A new version; refused (409) when someone saved since `basedOn`. */
export async function saveEstimateVersion(actor: Actor, id: string, input: z.output<typeof saveVersionSchema>) {
  const pre = await estimateRow(actor, id);
  requireAuthor(pre, actor);
  if (input.content.kind !== pre.kind) throw new GavelError("unprocessable", `content.kind: this estimate holds ${pre.kind}; duplicate it into a new estimate to change its kind`, { issues: [{ path: "content.kind", message: `must be ${pre.kind}` }] });
  const tree = await treeFor(actor.chamber.id, pre.measureId, input.scope);
  checkContent(input.content, tree.versions.map((v) => v.id), input.scope);
  return db.transaction(async (tx) => {
    const e = await estimateRow(actor, id, tx, true);
    if (e.latestVersion !== input.basedOn) throw new GavelError("conflict", `This estimate was saved again (version ${e.latestVersion}) since you opened version ${input.basedOn}. Reload to see it; your changes were not saved.`, { details: { latestVersion: e.latestVersion, basedOn: input.basedOn } });
    const number = e.latestVersion + 1;
    await tx.insert(estimateVersions).values({ chamberId: actor.chamber.id, estimateId: e.id, number, scope: input.scope, content: input.content, note: input.note, authorId: actor.user.id });
    await tx.update(estimates).set({ latestVersion: number, updatedAt: new Date() }).where(eq(estimates.id, e.id));
    return { id: e.id, version: number };
  });
}

export async function duplicateEstimate(actor: Actor, id: string, input: z.output<typeof duplicateSchema>) {
  const e = await estimateRow(actor, id);
  const v = await versionRow(e, input.version);
  return db.transaction(async (tx) => {
    const copy = await insertEstimate(actor, tx, { measureId: e.measureId, title: input.title ?? `Copy of ${e.title}`, kind: e.kind, sharedRoles: [], sharedUsers: [], duplicatedFrom: e.id }, { scope: v.scope, content: storedContent(v), note: `Duplicated from “${e.title}”, version ${v.number}` });
    return { id: copy.id, version: 1 };
  });
}

export async function setSharing(actor: Actor, id: string, input: z.output<typeof sharingSchema>) {
  const e = await estimateRow(actor, id);
  requireAuthor(e, actor);
  await checkSharing(actor, input.sharedUsers, db);
  await db.update(estimates).set({ sharedRoles: input.sharedRoles, sharedUsers: input.sharedUsers, updatedAt: new Date() }).where(eq(estimates.id, e.id));
  return { id: e.id, sharedRoles: input.sharedRoles, sharedUsers: input.sharedUsers };
}

/** People of the chamber the author can share with, and the measures that can carry estimates. */
export async function estimateOptions(actor: Actor) {
  const people = await db.select({ id: user.id, name: user.name, role: member.role }).from(member).innerJoin(user, eq(member.userId, user.id)).where(eq(member.organizationId, actor.chamber.id)).orderBy(asc(user.name));
  const ms = await db.select({ id: measures.id, number: measures.number, title: measures.title }).from(measures).where(and(isNull(measures.archivedAt), eq(measures.chamberId, actor.chamber.id))).orderBy(asc(measures.number));
  return { people: people.filter((p) => p.id !== actor.user.id), measures: ms, roles: CHAMBER_ROLES, canCreate: can(actor.role, "estimate:create") };
}

export async function measureVersions(actor: Actor, measureId: string, scope: string[]) {
  const tree = await treeFor(actor.chamber.id, measureId, scope);
  return { measure: { id: tree.measure.id, number: tree.measure.number, title: tree.measure.title }, pending: tree.pending, versions: tree.versions };
}

async function roster(chamberId: string) {
  return db.select({ name: legislators.name, bloc: legislators.bloc }).from(legislators).where(eq(legislators.chamberId, chamberId)).orderBy(asc(legislators.bloc), asc(legislators.name));
}

export async function csvTemplate(actor: Actor, q: z.output<typeof templateQuerySchema>) {
  const scope = parseScope(q.scope);
  const tree = await treeFor(actor.chamber.id, q.measureId, scope);
  const people = await roster(actor.chamber.id);
  if (q.kind === "ballots") return { filename: `${tree.measure.number.replace(/\W+/g, "-")}-ballots-template.csv`, text: ballotTemplate(tree.versions.map((v) => v.id), people, q.per === "member") };
  const dims = parseDimensions(q.dimensions);
  return { filename: `${tree.measure.number.replace(/\W+/g, "-")}-ideal-points-template.csv`, text: idealTemplate(dims, people, q.per === "member") };
}

/**
 * A new estimate started from the roster: one row per bloc (weight = its size) or per member, with
 * no ranking (ballots) or placeholder positions (spatial). It is a draft: the analysis refuses it
 * until every row is filled in or marked unranked (src/lib/estimates/draft.ts).
 */
export async function createRosterDraft(actor: Actor, input: z.output<typeof rosterDraftSchema>) {
  const tree = await treeFor(actor.chamber.id, input.measureId, input.scope);
  const people = await roster(actor.chamber.id);
  const rows = input.per === "member" ? people.map((p) => ({ member: p.name, bloc: p.bloc, weight: 1 })) : rosterBlocs(people).map((b) => ({ member: b.bloc, bloc: b.bloc, weight: b.size }));
  if (rows.length === 0) throw new GavelError("unprocessable", "The chamber's roster is empty: add its members first, or upload a CSV file.", { issues: [{ path: "roster", message: "no members" }] });
  const dims = input.dimensions;
  const content: EstimateContent =
    input.kind === "ballots"
      ? { kind: "ballots", partial: input.partial, rows: rows.map((r) => ({ ...r, ranking: [] })) }
      : { kind: "spatial", draft: true, dimensions: dims, statusQuo: dims.map(() => 0), measure: dims.map(() => 1), effects: {}, members: rows.map((r, i) => ({ ...r, ideal: dims.map((_, d) => (d === 0 && input.per === "bloc" ? i : 0)) })) };
  const unit = input.per === "member" ? "member" : "bloc";
  const note = input.kind === "ballots" ? `Started from the roster (${rows.length} ${unit}${rows.length === 1 ? "" : "s"}); rankings not filled in yet` : `Started from the roster (${rows.length} ${unit}${rows.length === 1 ? "" : "s"}); positions are placeholders, not yet set`;
  return createEstimate(actor, { measureId: tree.measure.id, title: input.title, scope: input.scope, content: parseWith(estimateContentSchema, content, "estimate content", "content"), note, sharedRoles: [], sharedUsers: [] });
}

function parseDimensions(text: string | undefined): string[] {
  const dims = (text ?? "").split(",").map((s) => s.trim()).filter(Boolean);
  if (dims.length === 0 || dims.length > 8) throw new GavelError("invalid-input", "dimensions: name one to eight policy dimensions, separated by commas", { issues: [{ path: "dimensions", message: "one to eight names" }] });
  return dims;
}

/**
 * A CSV upload: parsed and checked completely before anything is stored. With preview=1 nothing
 * is stored at all; otherwise a new estimate (or a new version of `estimateId`) is created.
 * `text` is the file as the route read it (readCsvUpload in uploads.ts).
 */
export async function importCsv(actor: Actor, text: string, query: z.output<typeof importQuerySchema>) {
  let existing: EstimateRow | null = null;
  if (query.estimateId) {
    existing = await estimateRow(actor, query.estimateId);
    requireAuthor(existing, actor);
  }
  const measureId = existing?.measureId ?? query.measureId;
  if (!measureId) throw new GavelError("invalid-input", "measureId: name the measure the estimate is about", { issues: [{ path: "measureId", message: "required" }] });
  const scope = parseScope(query.scope);
  const tree = await treeFor(actor.chamber.id, measureId, scope);
  const kind = existing?.kind ?? query.kind;
  let content: EstimateContent;
  if (kind === "ballots") content = { kind: "ballots", partial: query.partial, rows: parseBallotCsv(text, tree.versions.map((v) => v.id)) };
  else {
    const dims = parseDimensions(query.dimensions);
    const members = parseIdealCsv(text, dims);
    const prev = existing ? storedContent(await versionRow(existing)) : null;
    const base = prev?.kind === "spatial" && prev.dimensions.length === dims.length ? prev : null;
    content = { kind: "spatial", dimensions: dims, ...(base?.ranges ? { ranges: base.ranges } : {}), members, statusQuo: base?.statusQuo ?? dims.map(() => 0), measure: base?.measure ?? dims.map(() => 1), effects: base ? Object.fromEntries(Object.entries(base.effects).filter(([k]) => scope.includes(k))) : {} };
  }
  content = parseWith(estimateContentSchema, content, "estimate content", "content");
  checkContent(content, tree.versions.map((v) => v.id), scope);
  if (query.preview === "1") return { preview: true, content, versions: tree.versions };
  if (existing) {
    const saved = await saveEstimateVersion(actor, existing.id, { basedOn: query.basedOn ?? existing.latestVersion, scope, content, note: "Uploaded from CSV" });
    return { preview: false, ...saved };
  }
  if (!query.title) throw new GavelError("invalid-input", "title: give the new estimate a title", { issues: [{ path: "title", message: "required" }] });
  const created = await createEstimate(actor, { measureId, title: query.title, scope, content, note: "Uploaded from CSV", sharedRoles: [], sharedUsers: [] });
  return { preview: false, ...created };
}
