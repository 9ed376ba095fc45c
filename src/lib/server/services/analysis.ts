/**
 * Order analyses of an estimate: started off the request path (src/lib/server/analysis/runner.ts),
 * answered from the cache when the same (tree, rulebook voting section, estimate) was analysed
 * before, and read back as the page needs them: the summary with plain-language findings, the
 * orders (paginated, filtered by outcome, or as CSV), the walk-through of one order and the chair's
 * script. Every read checks that the actor may see the estimate the run belongs to.
 */
import { createHash } from "node:crypto";
import { and, asc, count, desc, eq, gt, sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { safe, version, queryInt } from "../../schema-parts.ts";
import { db } from "../db.ts";
import { analysisCache, analysisRuns } from "../../db/schema/estimates.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { GavelError } from "../../errors.ts";
import { writeCsv } from "../../text/csv-cells.ts";
import type { Actor } from "../http.ts";
import { toOrdersProfile } from "../../estimates/estimate-content.ts";
import { buildFindings } from "../../estimates/findings.ts";
import { draftMessage } from "../../estimates/draft.ts";
import { walkThrough } from "../../estimates/walk-through.ts";
import { chairScript, scriptDocument } from "../../estimates/chair-script.ts";
import { documentResponse } from "../documents/render.ts";
import { versionInWords, versionShort, type TreeLabels } from "../../estimates/version-words.ts";
import type { JobResult } from "../analysis/analysis-job.ts";
import { activeCount, activeCountFor, isActive, joinRun, launchRun, reserveSlot, stopGroup, STALE_MS } from "../analysis/runner.ts";
import { analysisLimits } from "../analysis/limits.ts";
import { can } from "../../permissions.ts";
import { adoptedRulebookOf } from "../measure-rulebook.ts";
import { canonicalJson } from "../../text/canonical-json.ts";
import { analysisResultJsonSchema, type analysisResultSchema, type SameShape } from "../../voting/orders-analysis-schema.ts";
import { loadRulebook } from "./rulebooks.ts";
import { estimateRow, storedContent, treeFor, versionRow } from "./estimates.ts";

/** Bump when the engine's output changes meaning with the same shape (a change of shape changes RESULT_SCHEMA_HASH by itself). */
export const ENGINE_VERSION = 2; // 2: passage threshold from the catalogue, membership thresholds, quorum, chair's vote (decision 0008)

export const startSchema = z.object({ estimateId: safe(z.string().min(1).max(100)), version: version().optional(), rulebookVersionId: safe(z.string().min(1).max(100)).nullable().optional() });
export const ordersQuerySchema = z.object({
  page: queryInt().min(1).default(1),
  pageSize: queryInt().min(1).max(200).default(20),
  outcome: safe(z.string().max(200)).optional(),
  mode: z.enum(["sincere", "sophisticated"]).default("sincere"),
  format: z.enum(["json", "csv"]).default("json"),
});
export const orderQuerySchema = z.object({
  order: safe(z.string().min(1).max(800)),
  format: z.enum(["json", "md", "pdf", "docx"]).default("json"),
  /** Printed on the script: the sitting and its date, as the clerk types them (blank lines when absent). */
  sitting: safe(z.string().trim().max(200)).optional(),
  date: safe(z.string().trim().max(100)).optional(),
});

interface CachedResult extends JobResult {
  input: Record<string, unknown>;
  labels: TreeLabels;
  passageThreshold: string;
  rulebook: { label: string; versionId: string | null };
  versions: Array<{ id: string; short: string; words: string }>;
}

export function contentHash(parts: unknown): string {
  return createHash("sha256").update(canonicalJson(parts)).digest("hex");
}

/** A hash of the stored result's shape: in every cache key, so a changed shape never reads a result stored in the old one. */
export const RESULT_SCHEMA_HASH = contentHash(analysisResultJsonSchema());
const resultMatchesSchema: SameShape<z.output<typeof analysisResultSchema>, JobResult> = true;
void resultMatchesSchema;

async function runRow(actor: Actor, id: string) {
  if (!/^[0-9a-f-]{36}$/i.test(id)) throw new GavelError("not-found", "No such analysis in this chamber.");
  const [run] = await db.select().from(analysisRuns).where(and(eq(analysisRuns.id, id), eq(analysisRuns.chamberId, actor.chamber.id)));
  if (!run) throw new GavelError("not-found", "No such analysis in this chamber.");
  const estimate = await estimateRow(actor, run.estimateId); // not-found when the actor may not see it
  return { run, estimate };
}

export async function startAnalysis(actor: Actor, input: z.output<typeof startSchema>) {
  const e = await estimateRow(actor, input.estimateId);
  const v = await versionRow(e, input.version);
  const rb = input.rulebookVersionId ? await loadRulebook(actor.chamber.id, input.rulebookVersionId).then((r) => ({ rulebook: r.rulebook, source: `version ${r.number}: ${r.title}`, versionId: r.versionId })) : await adoptedRulebookOf(actor.chamber.id);
  const tree = await treeFor(actor.chamber.id, e.measureId, v.scope);
  const content = storedContent(v);
  // A draft (rows not filled in, or placeholder positions) is never analysed as if it were an estimate.
  const missing = draftMessage(content);
  if (missing) throw new GavelError("unprocessable", missing, { issues: [{ path: "content", message: missing }], details: { draft: true } });
  // Thresholds "of the members" and the quorum count against the rulebook's membership, else the roster (decision 0008).
  const main = rb.rulebook.motions.find((m) => m.class === "main");
  const members = rb.rulebook.chamber.members;
  const roster = members === undefined ? (await db.select({ n: count() }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id)))[0]?.n ?? 0 : 0;
  const ordersInput = {
    rulebook: { voting: rb.rulebook.voting, ...(members !== undefined ? { chamber: { members } } : {}), ...(main ? { motions: [{ class: main.class, vote: main.vote }] } : {}) },
    ...(roster > 0 ? { membership: roster } : {}),
    measure: tree.case.measure,
    amendments: tree.case.amendments,
    profile: toOrdersProfile(content),
  };
  const hash = contentHash({ engine: ENGINE_VERSION, resultSchema: RESULT_SCHEMA_HASH, ...ordersInput });
  const base = { chamberId: actor.chamber.id, estimateId: e.id, estimateVersion: v.number, rulebookVersionId: rb.versionId, rulebookLabel: rb.source, hash, requestedBy: actor.user.id };
  const limits = analysisLimits();
  // One decision per (chamber, content) at a time: answered from the cache, joined to the identical
  // run already in flight, or started (within the pool and the chamber's share of it).
  let release: (() => void) | null = null;
  const decided = await db.transaction(async (tx) => {
    await tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${`analysis:${actor.chamber.id}:${hash}`}))`);
    const [hit] = await tx.select({ hash: analysisCache.hash }).from(analysisCache).where(and(eq(analysisCache.chamberId, actor.chamber.id), eq(analysisCache.hash, hash)));
    if (hit) {
      const [run] = await tx.insert(analysisRuns).values({ ...base, status: "done", cached: 1, progress: 1, phase: "done", finishedAt: new Date() }).returning();
      return { run, kind: "cached" as const };
    }
    const [leader] = await tx
      .select({ id: analysisRuns.id, phase: analysisRuns.phase, progress: analysisRuns.progress })
      .from(analysisRuns)
      .where(and(eq(analysisRuns.chamberId, actor.chamber.id), eq(analysisRuns.hash, hash), eq(analysisRuns.status, "running"), gt(analysisRuns.heartbeatAt, new Date(Date.now() - STALE_MS))))
      .orderBy(asc(analysisRuns.createdAt))
      .limit(1);
    if (leader) {
      const [run] = await tx.insert(analysisRuns).values({ ...base, status: "running", phase: leader.phase, progress: leader.progress }).returning();
      return { run, kind: "joined" as const, leaderId: leader.id };
    }
    if (activeCount() >= limits.workers) throw new GavelError("rate-limited", `All ${limits.workers} analysis workers of this server are busy; try again when one has finished.`, { details: { workers: limits.workers } });
    if (activeCountFor(actor.chamber.id) >= limits.chamberShare)
      throw new GavelError("rate-limited", `${actor.chamber.name} already has ${limits.chamberShare} ${limits.chamberShare === 1 ? "analysis" : "analyses"} running, its share of this server's ${limits.workers} workers; wait for it to finish or cancel it.`, { details: { chamberShare: limits.chamberShare, workers: limits.workers } });
    release = reserveSlot(actor.chamber.id); // checked and taken in one tick: no other request takes this slot
    const [run] = await tx.insert(analysisRuns).values({ ...base, status: "running" }).returning();
    return { run, kind: "started" as const };
  }).catch((e) => {
    (release as (() => void) | null)?.();
    throw e;
  });
  const run = decided.run;
  if (decided.kind === "cached") return { runId: run.id, status: run.status, cached: true };
  if (decided.kind === "joined") {
    joinRun(run.id, run);
    return { runId: run.id, status: run.status, cached: false, joined: true };
  }
  (release as (() => void) | null)?.(); // launchRun counts the worker from here on
  void launchRun({ id: run.id, chamberId: actor.chamber.id, hash }, ordersInput, {
    input: ordersInput,
    labels: tree.labels,
    passageThreshold: typeof rb.rulebook.voting.passageThreshold === "string" ? rb.rulebook.voting.passageThreshold : rb.rulebook.voting.passageThreshold ? `${rb.rulebook.voting.passageThreshold.value} votes` : (main?.vote ?? "majority"),
    rulebook: { label: rb.source, versionId: rb.versionId },
    versions: tree.versions.map(({ id, short, words }) => ({ id, short, words })),
  }, limits);
  return { runId: run.id, status: run.status, cached: false, joined: false };
}

async function cached(run: { chamberId: string; hash: string }): Promise<CachedResult> {
  const [row] = await db.select({ result: analysisCache.result }).from(analysisCache).where(and(eq(analysisCache.chamberId, run.chamberId), eq(analysisCache.hash, run.hash)));
  if (!row) throw new GavelError("conflict", "This analysis has no stored result (it did not finish). Run it again.");
  return row.result as CachedResult;
}

function runView(run: typeof analysisRuns.$inferSelect) {
  // Running on no server: not here, and its own server has stopped touching the heartbeat.
  const interrupted = run.status === "running" && !isActive(run) && Date.now() - run.heartbeatAt.getTime() > STALE_MS;
  return {
    id: run.id,
    estimateId: run.estimateId,
    estimateVersion: run.estimateVersion,
    rulebook: run.rulebookLabel,
    status: interrupted ? ("failed" as const) : run.status,
    cached: run.cached === 1,
    phase: run.phase,
    progress: run.progress,
    error: interrupted ? { code: "internal", message: "The analysis was interrupted (the server restarted). Run it again." } : run.error,
    createdAt: run.createdAt.toISOString(),
  };
}

export async function getRun(actor: Actor, id: string) {
  const { run, estimate } = await runRow(actor, id);
  const view = runView(run);
  if (view.status !== "done") return { run: view };
  const r = await cached(run);
  const findings = buildFindings(r.analysis, r.listing, r.labels, estimate.title);
  return {
    run: view,
    estimate: { id: estimate.id, title: estimate.title },
    versions: r.versions,
    analysis: r.analysis,
    listed: { count: r.listing.orders.length, complete: r.listing.complete },
    findings,
    labels: r.labels,
  };
}

export async function latestRun(actor: Actor, estimateId: string) {
  const e = await estimateRow(actor, estimateId);
  const [run] = await db.select().from(analysisRuns).where(and(eq(analysisRuns.chamberId, actor.chamber.id), eq(analysisRuns.estimateId, e.id))).orderBy(desc(analysisRuns.createdAt)).limit(1);
  return { run: run ? runView(run) : null };
}

/**
 * Cancel a run: the person who started it, or a clerk or the chief clerk (any run of the chamber,
 * even on an estimate they cannot read: the worker pool is the chamber's to manage). Only this run
 * is cancelled; the worker stops when no run of its group (identical runs joined to it) still waits.
 */
export async function cancelRun(actor: Actor, id: string) {
  if (!/^[0-9a-f-]{36}$/i.test(id)) throw new GavelError("not-found", "No such analysis in this chamber.");
  const [run] = await db.select().from(analysisRuns).where(and(eq(analysisRuns.id, id), eq(analysisRuns.chamberId, actor.chamber.id)));
  if (!run) throw new GavelError("not-found", "No such analysis in this chamber.");
  const anyRun = can(actor.role, "analysis:cancel-any");
  const visible = await estimateRow(actor, run.estimateId).then(
    () => true,
    (e) => {
      if (e instanceof GavelError && e.code === "not-found") return false;
      throw e;
    },
  );
  if (!visible && !anyRun) throw new GavelError("not-found", "No such analysis in this chamber.");
  if (!anyRun && run.requestedBy !== actor.user.id) throw new GavelError("forbidden", "Only the person who started an analysis, a clerk or the chief clerk can cancel it.");
  const [after] = await db.update(analysisRuns).set({ status: "cancelled", error: { code: "cancelled", message: "The analysis was cancelled." }, finishedAt: new Date() }).where(and(eq(analysisRuns.id, run.id), eq(analysisRuns.status, "running"))).returning();
  if (after) {
    const [waiting] = await db.select({ id: analysisRuns.id }).from(analysisRuns).where(and(eq(analysisRuns.chamberId, run.chamberId), eq(analysisRuns.hash, run.hash), eq(analysisRuns.status, "running"))).limit(1);
    // Nobody else waits on this worker: stop it here (on another server, its next heartbeat stops it).
    if (!waiting) await stopGroup(run.chamberId, run.hash);
  }
  const view = runView(after ?? run);
  return { run: visible ? view : { id: view.id, status: view.status, error: view.error } };
}

export async function listOrders(actor: Actor, id: string, q: z.output<typeof ordersQuerySchema>) {
  const { run } = await runRow(actor, id);
  if (runView(run).status !== "done") throw new GavelError("conflict", "The analysis has not finished.");
  const r = await cached(run);
  const known = new Set(r.analysis.alternatives.map((a) => a.id));
  if (q.outcome && !known.has(q.outcome)) throw new GavelError("invalid-input", `outcome: unknown version ${q.outcome}`, { issues: [{ path: "outcome", message: "not a version of this analysis" }] });
  const rows = q.outcome ? r.listing.orders.filter((o) => o[q.mode] === q.outcome) : r.listing.orders;
  if (q.format === "csv") {
    const text = writeCsv(["rank", "order", "sincere outcome", "sophisticated outcome", "sincere (in words)", "sophisticated (in words)"], rows.map((o) => [o.rank, o.questions.join(" "), o.sincere, o.sophisticated, versionInWords(o.sincere, r.labels), versionInWords(o.sophisticated, r.labels)]));
    return new Response(text, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="voting-orders-${run.id.slice(0, 8)}.csv"`, "cache-control": "no-store" } });
  }
  const start = (q.page - 1) * q.pageSize;
  return {
    total: rows.length,
    complete: r.listing.complete,
    page: q.page,
    pageSize: q.pageSize,
    orders: rows.slice(start, start + q.pageSize).map((o) => ({ ...o, sincereShort: versionShort(o.sincere, r.labels), sophisticatedShort: versionShort(o.sophisticated, r.labels) })),
  };
}

function orderOf(text: string): string[] {
  return text.split(/[\s,]+/).filter(Boolean);
}

export async function walkOrder(actor: Actor, id: string, order: string) {
  const { run } = await runRow(actor, id);
  if (runView(run).status !== "done") throw new GavelError("conflict", "The analysis has not finished.");
  const r = await cached(run);
  const walk = walkThrough(r.input, orderOf(order));
  return { walk, versions: r.versions };
}

export async function scriptFor(actor: Actor, id: string, order: string, format: "json" | "md" | "pdf" | "docx", occasion: { sitting?: string; date?: string } = {}) {
  const { run, estimate } = await runRow(actor, id);
  if (runView(run).status !== "done") throw new GavelError("conflict", "The analysis has not finished.");
  const r = await cached(run);
  const script = chairScript(walkThrough(r.input, orderOf(order)), r.labels, r.passageThreshold, estimate.title);
  if (format !== "json") return documentResponse(scriptDocument(script, { chamber: actor.chamber.name, ...occasion }), format, `chairs script ${r.labels.measureLabel}`);
  return { script, rulebook: r.rulebook.label };
}

