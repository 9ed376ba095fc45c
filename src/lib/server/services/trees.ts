/**
 * A measure's amendment tree as stored: rows → the core's case shape → validateTree under the
 * chamber's adopted rulebook → findings linked to the amendment rows, with the clerks'
 * overrides (each resting on a ruling). No rule is interpreted here; the core decides.
 */
import { and, asc, eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "../db.ts";
import { amendments, treeOverrides } from "../../db/schema/measures.ts";
import { rulings } from "../../db/schema/rulings.ts";
import { validateTree, type Finding } from "../../amendments/validate-tree.ts";
import { amendmentLabels } from "../../amendments/amendment-words.ts";
import type { AmendmentInput, MeasureInput } from "../../amendments/case-schema.ts";
import { GavelError } from "../../errors.ts";
import type { Actor } from "../http.ts";
import { measureMemory } from "../chamber-memory.ts";
import { Memo, memoKey } from "../memo.ts";
import { assertFresh, recordAudit } from "../measure-audit.ts";
import { adoptedRulebookOf } from "../measure-rulebook.ts";
import type { overrideCreateSchema, FindingView, TreeNodeView, TreeView } from "../../measures/measure-schemas.ts";
import { amendmentKey, amendmentRow, type AmendmentRow } from "./amendments.ts";
import { nextAdoptionInForce } from "./rulebooks.ts";
import { assertMeasureId, assertNotArchived, legislatorNames, measureRow, type MeasureRow } from "./measures.ts";

/** The measure's id inside the tree (sections and amendments have their own). */
export const MEASURE_KEY = "measure";

function targetKey(a: AmendmentRow, keys: ReadonlyMap<string, string>): string {
  if (a.targetKind === "measure") return MEASURE_KEY;
  if (a.targetKind === "section") return a.targetSection!;
  // An amendment whose target row is gone keeps a key that names nothing: the core reports target-missing.
  return keys.get(a.targetAmendmentId ?? "") ?? `gone-${(a.targetAmendmentId ?? "x").slice(0, 8)}`;
}

/**
 * The core's case for a measure and its amendment rows, each amendment under its key in `keys`
 * (row id → key): the tree uses the labels people read (amendmentLabels: "A3", "Draft"), an
 * estimate the lasting keys its stored scope names (amendmentKey: a draft's does not change when
 * another draft is saved or filed).
 */
export function caseFromRows(m: MeasureRow, rows: AmendmentRow[], keys: ReadonlyMap<string, string>): { measure: MeasureInput; amendments: AmendmentInput[]; asOf?: string } {
  return {
    measure: { id: MEASURE_KEY, number: m.number, title: m.title, subjects: m.subjects, committee: m.committee ?? undefined, sections: m.sections.map((s) => ({ id: s.id, heading: s.heading, subjects: s.subjects, lines: s.lines, status: s.status })) },
    amendments: rows.map((r) => ({
      id: keys.get(r.id)!,
      target: targetKey(r, keys),
      form: r.form as AmendmentInput["form"],
      ...(r.lineFrom !== null ? { lines: [r.lineFrom, r.lineTo!] as [number, number] } : {}),
      sponsors: r.sponsors,
      ...(r.filedAt ? { filedAt: r.filedAt.toISOString() } : {}),
      subjects: r.subjects,
      ...(r.title ? { title: r.title } : {}),
      ...(r.committee ? { committee: r.committee } : {}),
      status: r.status,
    })),
    ...(m.sittingAt ? { asOf: m.sittingAt.toISOString() } : {}),
  };
}

const treeMemo = new Memo<Awaited<ReturnType<typeof validateTree>>>(200);

async function loadTree(chamberId: string, measureId: string) {
  assertMeasureId(measureId);
  // Independent reads, asked together (each is scoped to the chamber, so none leaks before the measure is found).
  const [m, rows, overrides, rb] = await Promise.all([
    measureRow(chamberId, measureId),
    db.select().from(amendments).where(and(eq(amendments.measureId, measureId), eq(amendments.chamberId, chamberId))).orderBy(asc(amendments.createdAt)),
    db.select().from(treeOverrides).where(and(eq(treeOverrides.measureId, measureId), eq(treeOverrides.chamberId, chamberId))),
    adoptedRulebookOf(chamberId),
  ]);
  rows.sort((x, y) => (x.number ?? Infinity) - (y.number ?? Infinity));
  // Validated under the keys people read ("A3", "Draft"), so findings, related amendments and the drawing name them so.
  const keys = amendmentLabels(rows);
  const c = caseFromRows(m, rows, keys);
  const input = { ...c, overrides: overrides.filter((o) => keys.has(o.amendmentId)).map((o) => ({ code: o.code, amendment: keys.get(o.amendmentId)!, ruling: o.rulingRef })) };
  // The findings depend only on the rulebook version (immutable) and the case: read it once per change.
  const key = memoKey(rb.versionId ?? rb.source, input);
  const run = () => validateTree({ rulebook: rb.rulebook, ...input });
  const result = key === null ? await run() : await treeMemo.get(key, run);
  return { m, rows, keys, overrides, rb, result };
}

/**
 * The tree view, remembered per measure between requests (chamber-memory.ts: forgotten when the
 * measure, its amendments or overrides, the chamber's roster or adoptions change), and not used
 * once an adoption recorded for a later date has come into force.
 */
const rememberedTree = measureMemory(
  (chamberId, measureId) => buildTreeView(chamberId, measureId),
  (v) => Date.now() < v.validUntil,
);

export async function treeOf(actor: Actor, measureId: string): Promise<TreeView> {
  return (await rememberedTree(actor.chamber.id, measureId)).view;
}

/** The view, and until when it holds without a write (the next adoption already recorded for a later date). */
async function buildTreeView(chamberId: string, measureId: string): Promise<{ view: TreeView; validUntil: number }> {
  const [{ m, rows, keys, overrides, rb, result }, next] = await Promise.all([loadTree(chamberId, measureId), nextAdoptionInForce(chamberId)]);
  const idOf = new Map(rows.map((r) => [keys.get(r.id)!, r.id]));
  const names = await legislatorNames(chamberId);
  const findings: FindingView[] = result.findings.map((f: Finding) => {
    const rowId = idOf.get(f.amendment) ?? null;
    const o = overrides.find((x) => x.amendmentId === rowId && x.code === f.code);
    return { ...f, amendmentId: rowId, overrideId: o?.id ?? null, overrideRulingId: o?.rulingId ?? null, overrideNote: o?.note ?? null };
  });
  const nodes: TreeNodeView[] = [
    { key: MEASURE_KEY, kind: "measure", id: m.id, label: m.number, title: m.title, parent: null, degree: 0, form: null, status: m.status, subjects: m.subjects, sponsors: m.sponsors.map((s) => names.get(s) ?? s), filedAt: null, text: null, lines: null, version: m.version },
    ...m.sections.map((s): TreeNodeView => ({ key: s.id, kind: "section", id: null, label: s.id, title: s.heading ?? null, parent: MEASURE_KEY, degree: 0, form: null, status: s.status, subjects: s.subjects, sponsors: [], filedAt: null, text: s.text ?? null, lines: null, version: null })),
    ...rows.map((r): TreeNodeView => {
      const key = keys.get(r.id)!;
      const n = result.tree.nodes[key];
      const parent = n && !n.targetMissing ? n.target : null;
      return { key, kind: "amendment", id: r.id, label: key, title: r.title, parent, degree: n?.degree ?? null, role: n?.role ?? null, slot: n?.slot ?? null, underSubstitute: n?.underSubstitute ?? null, form: r.form, status: r.status, subjects: r.subjects, sponsors: r.sponsors.map((s) => names.get(s) ?? s), filedAt: r.filedAt?.toISOString() ?? null, text: r.text, lines: r.lineFrom === null ? null : [r.lineFrom, r.lineTo!], version: r.version };
    }),
  ];
  const counts = { error: 0, warning: 0, info: 0, overridden: 0 };
  for (const f of findings) {
    if (f.overridden) counts.overridden++;
    else counts[f.severity]++;
  }
  const view: TreeView = {
    measure: { id: m.id, number: m.number, title: m.title, version: m.version, sittingAt: m.sittingAt?.toISOString() ?? null, archived: m.archivedAt !== null },
    rulebook: { id: rb.rulebook.id, title: rb.rulebook.title, source: rb.source, maxDegree: rb.rulebook.amendments.maxDegree, minSponsors: rb.rulebook.amendments.minSponsors },
    nodes,
    findings,
    counts,
  };
  return { view, validUntil: next?.getTime() ?? Infinity };
}

/**
 * Record a clerk's override of one current finding, resting on a ruling. Refused when the
 * amendment changed since the clerk looked (409), when the finding is not (or no longer)
 * there (422), or when it is already overridden (409).
 */
export async function recordOverride(actor: Actor, measureId: string, input: z.output<typeof overrideCreateSchema>) {
  const a = await amendmentRow(actor.chamber.id, input.amendmentId);
  if (a.measureId !== measureId) throw new GavelError("not-found", "No such amendment on this measure.", { issues: [{ path: "amendmentId", message: "not an amendment of this measure" }] });
  const { result, keys } = await loadTree(actor.chamber.id, measureId);
  const key = keys.get(a.id)!;
  if (!result.findings.some((f) => f.amendment === key && f.code === input.code))
    throw new GavelError("unprocessable", `Amendment ${key} has no current "${input.code}" finding to override.`, { issues: [{ path: "code", message: "no such finding on this amendment" }] });
  if (input.rulingId) {
    const [r] = await db.select({ id: rulings.id }).from(rulings).where(and(eq(rulings.id, input.rulingId), eq(rulings.chamberId, actor.chamber.id)));
    if (!r) throw new GavelError("unprocessable", "rulingId: no such ruling in this chamber", { issues: [{ path: "rulingId", message: "no such ruling" }] });
  }
  const row = await db.transaction(async (tx) => {
    assertNotArchived(await measureRow(actor.chamber.id, measureId, tx));
    const locked = await amendmentRow(actor.chamber.id, a.id, tx, true);
    await assertFresh(tx, { entity: "amendment", entityId: a.id, label: `Amendment ${key}` }, input.version, locked.version);
    const [dup] = await tx.select({ id: treeOverrides.id }).from(treeOverrides).where(and(eq(treeOverrides.amendmentId, a.id), eq(treeOverrides.code, input.code)));
    if (dup) throw new GavelError("conflict", `The ${input.code} finding on ${key} is already overridden.`, { issues: [{ path: "code", message: "already overridden" }] });
    const [o] = await tx.insert(treeOverrides).values({ chamberId: actor.chamber.id, measureId, amendmentId: a.id, code: input.code, rulingRef: input.rulingRef, rulingId: input.rulingId, note: input.note, createdBy: actor.user.id }).returning();
    await recordAudit(tx, actor, { measureId, entity: "override", entityId: o.id, action: `overrode ${input.code} on ${key}`, version: 1, before: null, after: { amendment: key, code: o.code, rulingRef: o.rulingRef, rulingId: o.rulingId, note: o.note } });
    return o;
  });
  return { id: row.id, amendmentId: a.id, amendment: key, code: row.code, rulingRef: row.rulingRef, rulingId: row.rulingId, note: row.note, createdAt: row.createdAt.toISOString() };
}

export async function revokeOverride(actor: Actor, measureId: string, overrideId: string) {
  await measureRow(actor.chamber.id, measureId);
  if (!/^[0-9a-f-]{36}$/i.test(overrideId)) throw new GavelError("not-found", "No such override.");
  await db.transaction(async (tx) => {
    const [o] = await tx.select().from(treeOverrides).where(and(eq(treeOverrides.id, overrideId), eq(treeOverrides.measureId, measureId), eq(treeOverrides.chamberId, actor.chamber.id))).for("update");
    if (!o) throw new GavelError("not-found", "No such override on this measure.");
    assertNotArchived(await measureRow(actor.chamber.id, measureId, tx));
    const a = await amendmentRow(actor.chamber.id, o.amendmentId, tx);
    // The amendment named in the audit as the tree names it ("A3", "Draft"), as recordOverride does:
    // the labels need only the measure's amendments in the order they were saved, not a tree check.
    const keys = amendmentLabels(await tx.select({ id: amendments.id, number: amendments.number }).from(amendments).where(and(eq(amendments.measureId, measureId), eq(amendments.chamberId, actor.chamber.id))).orderBy(asc(amendments.createdAt)));
    await tx.delete(treeOverrides).where(eq(treeOverrides.id, o.id));
    await recordAudit(tx, actor, { measureId, entity: "override", entityId: o.id, action: `revoked override of ${o.code} on ${keys.get(a.id) ?? amendmentKey(a)}`, version: 0, before: { amendment: keys.get(a.id) ?? amendmentKey(a), code: o.code, rulingRef: o.rulingRef, rulingId: o.rulingId, note: o.note }, after: null });
  });
  return { revoked: overrideId };
}
