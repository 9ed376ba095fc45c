/**
 * Validate a measure's amendment tree before floor time: build the tree (buildTree), compute
 * facts for every open amendment (degree, slot, target, germaneness inputs, filing times,
 * conflicts), and run the rulebook's amendment-scope rules over them with json-rules-engine.
 * Each fired rule is a finding with its code, severity and citation
 * (docs/decisions/0004-rules-as-data.md). Structural faults (cycles, missing targets) are
 * always reported, by the rulebook's own rule when it has one for that code.
 *
 * Germaneness tests (the rulebook's `amendments.germaneness.test`): "subjects" compares the
 * amendment's subject tags with those of the whole measure, "section" with those of the
 * section it amends, "committee" its committee of jurisdiction with the measure's; a
 * higher-degree amendment is compared with the amendment it amends (an amendment to an
 * amendment must be germane to it, Robert's Rules of Order Revised, 1915, §33). Where a tag
 * or committee is missing the machine cannot decide, and the fact says so (`decidable: false`).
 */
import { z } from "zod";
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import { ruleRunner } from "../procedure/rule-engine.ts";
import type { FindingSeverity, Rulebook } from "../procedure/rulebook-schema.ts";
import { buildTree, SUBSTITUTE_FORMS, type AmendmentTree } from "./build-tree.ts";
import { amendmentSchema, idSchema, measureSchema, type Amendment, type Measure } from "./case-schema.ts";
import { conflictingPairs } from "./conflicts.ts";

export const overrideSchema = z.object({
  code: z.string().min(1).max(64),
  amendment: idSchema,
  /** The ruling that overrides the finding: an id or a short citation of the chair's ruling. */
  ruling: z.string().trim().min(1).max(500),
});

export const treeCaseSchema = z.object({
  measure: measureSchema,
  amendments: z.array(amendmentSchema).max(5000),
  asOf: z.iso.datetime({ offset: true }).optional(),
  overrides: z.array(overrideSchema).max(5000).default([]),
});

export type Override = z.output<typeof overrideSchema>;

export interface Finding {
  code: string;
  severity: FindingSeverity;
  amendment: string;
  rule: string;
  citation: string;
  /** The clause of the chamber's rules the rule encodes (its key in the chamber's text), when the rulebook links one. */
  clause?: string;
  message: string;
  related?: string[];
  overridden?: boolean;
  ruling?: string;
}

export interface TreeValidation {
  findings: Finding[];
  tree: AmendmentTree;
}

/** Statuses that take part in the analysis; the others are history. */
const OPEN_STATUSES: ReadonlySet<string> = new Set(["draft", "filed", "pending"]);

/** Checks on ids that the zod shapes cannot express; all issues reported at once. */
function checkIds(measure: Measure, amendments: Amendment[], overrides: Override[]): void {
  const issues: InputIssue[] = [];
  const seen = new Map<string, string>([[measure.id, "measure.id"]]);
  measure.sections.forEach((s, i) => {
    const path = `measure.sections.${i}.id`;
    if (seen.has(s.id)) issues.push({ path, message: `"${s.id}" is already used by ${seen.get(s.id)}` });
    else seen.set(s.id, path);
  });
  amendments.forEach((a, i) => {
    const path = `amendments.${i}.id`;
    if (seen.has(a.id)) issues.push({ path, message: `"${a.id}" is already used by ${seen.get(a.id)}` });
    else seen.set(a.id, path);
  });
  const amendmentIds = new Set(amendments.map((a) => a.id));
  overrides.forEach((o, i) => {
    if (!amendmentIds.has(o.amendment)) issues.push({ path: `overrides.${i}.amendment`, message: `no amendment "${o.amendment}"` });
  });
  if (issues.length) throw new GavelError("invalid-input", `case: ${issues[0].path}: ${issues[0].message}`, { issues: issues.slice(0, 100) });
}

const unique = (xs: string[]) => [...new Set(xs)];
const timeMs = (iso: string | undefined) => (iso === undefined ? null : Date.parse(iso));

/**
 * Validate the tree. `rulebook` must come from parseRulebook; the rest ({measure, amendments,
 * asOf?, overrides?}) is validated here and errors name their path ("amendments.3.target").
 */
export async function validateTree(input: { rulebook: Rulebook } & Record<string, unknown>): Promise<TreeValidation> {
  const { rulebook } = input;
  const { measure, amendments, asOf, overrides } = parseWith(treeCaseSchema, { measure: input.measure, amendments: input.amendments, asOf: input.asOf, overrides: input.overrides }, "case");
  checkIds(measure, amendments, overrides);
  const limits = rulebook.amendments;
  const tree = buildTree(measure, amendments, { substituteSlot: limits.substituteSlot, substituteForAmendment: limits.substituteForAmendment, perfectingUnderSubstitute: limits.perfectingUnderSubstitute });
  const byId = new Map(amendments.map((a) => [a.id, a]));
  const sections = new Map(measure.sections.map((s) => [s.id, s]));
  const measureSubjects = unique([...measure.subjects, ...measure.sections.flatMap((s) => s.subjects)]);
  const open = amendments.filter((a) => OPEN_STATUSES.has(a.status) && !tree.nodes[a.id].inCycle);
  const openIds = new Set(open.map((a) => a.id));
  const index = new Map(amendments.map((a, i) => [a.id, i]));
  /** For a substitute: the open perfecting amendments to the text it would replace, read off the graph (its target's amendments; for the measure, its sections' too). */
  const perfectingSiblingsOf = (a: Amendment): string[] => {
    if (!SUBSTITUTE_FORMS.has(a.form) || !tree.graph.hasNode(a.target)) return [];
    const out: string[] = [];
    tree.graph.forEachOutNeighbor(a.target, (id) => {
      if (tree.nodes[id].kind === "amendment") out.push(id);
      else if (a.target === measure.id) tree.graph.forEachOutNeighbor(id, (x) => out.push(x));
    });
    return out.filter((id) => id !== a.id && openIds.has(id) && !SUBSTITUTE_FORMS.has(byId.get(id)!.form)).sort((x, y) => index.get(x)! - index.get(y)!);
  };

  // Pending order (buildTree): filing time, then input order (rows without a filing time go last).
  const slotPosition = new Map<string, number>();
  const pendingPosition = new Map<string, number>();
  const perSlot = new Map<string, number>();
  tree.pending
    .filter((id) => tree.nodes[id].degree !== null)
    .forEach((id, i) => {
      const slot = tree.nodes[id].slot!;
      perSlot.set(slot, (perSlot.get(slot) ?? 0) + 1);
      slotPosition.set(id, perSlot.get(slot)!);
      pendingPosition.set(id, i + 1);
    });

  const conflicts = new Map<string, string[]>();
  for (const [a, b] of conflictingPairs(open)) {
    conflicts.set(a.id, [...(conflicts.get(a.id) ?? []), b.id]);
    conflicts.set(b.id, [...(conflicts.get(b.id) ?? []), a.id]);
  }

  const asOfMs = timeMs(asOf);
  const deadlineMs = asOfMs !== null && limits.filingDeadline ? asOfMs - limits.filingDeadline.hoursBefore * 3_600_000 : null;
  const runner = ruleRunner(rulebook, "amendment");
  const findings: Finding[] = [];

  for (const a of amendments) {
    if (!OPEN_STATUSES.has(a.status)) continue;
    const node = tree.nodes[a.id];
    const targetAmendment = byId.get(a.target);
    const section = sections.get(a.target);
    const targetKind = a.target === measure.id ? "measure" : section ? "section" : targetAmendment ? "amendment" : null;
    const targetSubjects = germaneAgainst();
    function germaneAgainst(): string[] {
      if (targetAmendment) return targetAmendment.subjects;
      if (limits.germaneness.test === "section" && section) return section.subjects;
      return measureSubjects;
    }
    const test = limits.germaneness.test;
    const decidable =
      test === "none" || targetKind === null || node.inCycle || node.dependsOnCycle
        ? null
        : test === "committee"
          ? Boolean(a.committee && measure.committee)
          : a.subjects.length > 0 && targetSubjects.length > 0;
    const facts = {
      amendment: { id: a.id, target: a.target, form: a.form, status: a.status, degree: node.degree, sponsors: a.sponsors, sponsorCount: a.sponsors.length, subjects: a.subjects, committee: a.committee ?? null, filedAt: a.filedAt ?? null, lines: a.lines ?? null, distance: a.distance ?? null },
      target: {
        id: a.target,
        exists: targetKind !== null,
        kind: targetKind,
        status: section ? section.status : targetAmendment ? targetAmendment.status : targetKind ? "open" : null,
        subjects: targetKind ? targetSubjects : [],
      },
      measure: { id: measure.id, subjects: measure.subjects, committee: measure.committee ?? null, sectionCount: measure.sections.length },
      limits,
      voting: rulebook.voting,
      tree: {
        degree: node.degree,
        slot: node.slot,
        role: node.role,
        underSubstitute: node.underSubstitute,
        slotPosition: slotPosition.get(a.id) ?? null,
        pendingPosition: pendingPosition.get(a.id) ?? null,
        inCycle: node.inCycle,
        selfTarget: node.selfTarget,
        dependsOnCycle: node.dependsOnCycle,
        children: node.children.length,
      },
      filing: { filedAtMs: timeMs(a.filedAt), deadlineMs, asOfMs },
      germaneness: { test, decidable, amendmentSubjects: a.subjects, targetSubjects, amendmentCommittee: a.committee ?? null, measureCommittee: measure.committee ?? null },
      conflictsWith: conflicts.get(a.id) ?? [],
      perfectingSiblings: perfectingSiblingsOf(a),
      cycleMembers: tree.cycles.find((c) => c.includes(a.id)) ?? [],
    };
    const own: Finding[] = [];
    for (const f of await runner.run(facts)) {
      if (own.some((x) => x.code === f.rule.code)) continue;
      const related = f.rule.related ? (facts[f.rule.related] as string[]) : undefined;
      own.push({ code: f.rule.code!, severity: f.rule.severity!, amendment: a.id, rule: f.rule.id, citation: f.rule.citation, ...(f.rule.clause ? { clause: f.rule.clause } : {}), message: f.message, ...(related?.length ? { related } : {}) });
    }
    const structural = (code: string, message: string, related?: string[]) => {
      if (!own.some((x) => x.code === code)) own.push({ code, severity: "error", amendment: a.id, rule: "tree-structure", citation: "common practice, no source: an amendment amends existing text", message, ...(related ? { related } : {}) });
    };
    if (node.inCycle) structural("cycle", node.selfTarget ? `Amendment ${a.id} targets itself.` : `Amendment ${a.id} is part of a cycle of targets.`, tree.cycles.find((c) => c.includes(a.id)));
    if (node.targetMissing) structural("target-missing", `Amendment ${a.id} targets "${a.target}", which does not exist.`);
    if (node.dependsOnCycle && !node.inCycle) own.push({ code: "cycle", severity: "warning", amendment: a.id, rule: "tree-structure", citation: "common practice, no source: an amendment amends existing text", message: `Amendment ${a.id} amends an amendment caught in a cycle of targets.` });
    findings.push(...own);
  }
  for (const f of findings) {
    const o = overrides.find((x) => x.code === f.code && x.amendment === f.amendment);
    if (o) Object.assign(f, { overridden: true, ruling: o.ruling });
  }
  return { findings, tree };
}
