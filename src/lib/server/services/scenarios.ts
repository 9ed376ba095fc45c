/**
 * The chamber's bench of scenarios: list, add, remove, import (replace the bench, all or nothing) and
 * export (the documented "gavelwright.scenarios" JSON); run against a rulebook version and against the
 * version in force, to say which scenarios changed verdict. The runner is the core's
 * (src/lib/procedure/scenarios.ts); nothing here interprets rules.
 */
import { and, asc, eq, sql as dsql } from "drizzle-orm";
import { z } from "zod";
import { db } from "../db.ts";
import { rulebookScenarios } from "../../db/schema/chamber-text.ts";
import { GavelError, parseWith } from "../../errors.ts";
import { idSchema } from "../../amendments/case-schema.ts";
import { parseRulebook } from "../../procedure/parse-rulebook.ts";
import type { Rulebook } from "../../procedure/rulebook-schema.ts";
import { parseScenarios, runScenarios, scenarioSchema, SCENARIOS_FORMAT, SCENARIOS_FORMAT_VERSION, verdictChanges, type BenchRun, type Scenario, type ScenariosFile, type VerdictChange } from "../../procedure/scenarios.ts";
import type { Actor } from "../http.ts";
import { getVersion, loadRulebook, rulebookInForce } from "./rulebooks.ts";

const lockBench = (tx: Parameters<Parameters<typeof db.transaction>[0]>[0], chamberId: string) => tx.execute(dsql`SELECT pg_advisory_xact_lock(hashtext(${"scenarios:" + chamberId}))`);

/** The chamber's scenarios, in bench order. */
export async function listScenarios(chamberId: string): Promise<Scenario[]> {
  const rows = await db.select({ document: rulebookScenarios.document }).from(rulebookScenarios).where(eq(rulebookScenarios.chamberId, chamberId)).orderBy(asc(rulebookScenarios.position));
  return rows.map((r) => r.document as Scenario);
}

/** The bench as a scenarios file (export). */
export async function exportScenarios(actor: Actor): Promise<ScenariosFile> {
  const scenarios = await listScenarios(actor.chamber.id);
  const inForce = await rulebookInForce(actor.chamber.id);
  let rulebook: string | undefined;
  if (inForce) rulebook = (await loadRulebook(actor.chamber.id, inForce.versionId)).rulebook.id;
  return { format: SCENARIOS_FORMAT, formatVersion: SCENARIOS_FORMAT_VERSION, ...(rulebook ? { rulebook } : {}), scenarios };
}

/** Add one scenario (validated; its id must be new in the chamber). */
export async function addScenario(actor: Actor, input: unknown) {
  const scenario = parseScenarios({ format: SCENARIOS_FORMAT, formatVersion: SCENARIOS_FORMAT_VERSION, scenarios: [parseWith(scenarioSchema, input, "scenario")] }).scenarios[0]!;
  return db.transaction(async (tx) => {
    await lockBench(tx, actor.chamber.id);
    const [clash] = await tx.select({ id: rulebookScenarios.id }).from(rulebookScenarios).where(and(eq(rulebookScenarios.chamberId, actor.chamber.id), eq(rulebookScenarios.scenarioId, scenario.id)));
    if (clash) throw new GavelError("invalid-input", `A scenario with the id "${scenario.id}" is already on the bench.`, { issues: [{ path: "id", message: "already used by another scenario" }] });
    const [{ n }] = (await tx.select({ n: dsql<number>`coalesce(max(${rulebookScenarios.position}), 0)::int` }).from(rulebookScenarios).where(eq(rulebookScenarios.chamberId, actor.chamber.id))) as [{ n: number }];
    await tx.insert(rulebookScenarios).values({ chamberId: actor.chamber.id, scenarioId: scenario.id, position: n + 1, document: scenario, authorId: actor.user.id });
    return scenario;
  });
}

export async function removeScenario(actor: Actor, scenarioId: string) {
  if (!idSchema.safeParse(scenarioId).success) throw new GavelError("not-found", "No such scenario.");
  const gone = await db.delete(rulebookScenarios).where(and(eq(rulebookScenarios.chamberId, actor.chamber.id), eq(rulebookScenarios.scenarioId, scenarioId))).returning({ id: rulebookScenarios.id });
  if (!gone.length) throw new GavelError("not-found", "No such scenario.");
  return { removed: scenarioId };
}

export const importModeSchema = z.enum(["replace", "append"]).default("replace");

/** Import a scenarios file: replace the bench (or append to it). All or nothing: a bad file changes nothing. */
export async function importScenarios(actor: Actor, input: unknown, mode: z.output<typeof importModeSchema>) {
  const file = parseScenarios(input);
  return db.transaction(async (tx) => {
    await lockBench(tx, actor.chamber.id);
    let start = 0;
    if (mode === "replace") await tx.delete(rulebookScenarios).where(eq(rulebookScenarios.chamberId, actor.chamber.id));
    else {
      const existing = await tx.select({ scenarioId: rulebookScenarios.scenarioId, position: rulebookScenarios.position }).from(rulebookScenarios).where(eq(rulebookScenarios.chamberId, actor.chamber.id));
      const taken = new Set(existing.map((e) => e.scenarioId));
      const i = file.scenarios.findIndex((s) => taken.has(s.id));
      if (i >= 0) throw new GavelError("invalid-input", `scenarios.${i}.id: "${file.scenarios[i]!.id}" is already on the bench`, { issues: [{ path: `scenarios.${i}.id`, message: "already on the bench" }] });
      start = Math.max(0, ...existing.map((e) => e.position));
    }
    if (file.scenarios.length) await tx.insert(rulebookScenarios).values(file.scenarios.map((s, i) => ({ chamberId: actor.chamber.id, scenarioId: s.id, position: start + i + 1, document: s, authorId: actor.user.id })));
    return { imported: file.scenarios.length, mode };
  });
}

export interface BenchReport extends BenchRun {
  version: { id: string; number: number };
  /** The version in force, when it is another version; its run is what `changed` compares against. */
  inForce: { id: string; number: number; passed: number; failed: number } | null;
  /** Scenarios whose verdict differs from the version in force. */
  changed: VerdictChange[];
}

/** Run the bench against `rulebook` (version `version`) and against the version in force. */
export async function benchReport(chamberId: string, version: { id: string; number: number }, rulebook: Rulebook): Promise<BenchReport> {
  const scenarios = await listScenarios(chamberId);
  const run = await runScenarios(rulebook, scenarios);
  const inForce = await rulebookInForce(chamberId);
  if (!inForce || inForce.versionId === version.id) return { ...run, version, inForce: null, changed: [] };
  const before = await runScenarios((await loadRulebook(chamberId, inForce.versionId)).rulebook, scenarios);
  return { ...run, version, inForce: { id: inForce.versionId, number: inForce.number, passed: before.passed, failed: before.failed }, changed: verdictChanges(before, run) };
}

/** The bench run against a saved version (and the comparison with the version in force). */
export async function versionBench(actor: Actor, versionId: string): Promise<BenchReport> {
  const v = await getVersion(actor, versionId);
  return benchReport(actor.chamber.id, { id: v.id, number: v.number }, parseRulebook(v.document));
}

/** A saved version's row with the bench's verdict on it: the scenarios run on every save. */
export async function savedWithBench<T extends { id: string; number: number }>(actor: Actor, saved: T) {
  const v = await getVersion(actor, saved.id);
  const report = await benchReport(actor.chamber.id, { id: v.id, number: v.number }, parseRulebook(v.document));
  return { ...saved, scenarios: { passed: report.passed, failed: report.failed, changed: report.changed.length } };
}
