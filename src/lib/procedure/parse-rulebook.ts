/**
 * Load a rulebook: the zod shape (rulebookSchema), then the semantic checks a schema cannot
 * express — unique motion and rule ids, every fact, path and operator in a rule known to the
 * engine, motion ids named in rules present in the catalogue, and precedence chains free of
 * cycles. Every problem is reported with its exact path ("rules.4.conditions.all.1.operator").
 *
 * Error codes: invalid-input for shape and reference problems, unprocessable for a rank
 * cycle (the file is well-formed but the precedence it states cannot exist), too-large for
 * text over MAX_RULEBOOK_BYTES.
 */
import { DirectedGraph } from "graphology";
import { stronglyConnectedComponents } from "graphology-components";
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import { FACT_PATH_PATTERN, isKnownOperator, SCOPE_FACTS, type RuleScope } from "./rule-vocabulary.ts";
import { rulebookSchema, type Rulebook } from "./rulebook-schema.ts";

/** Rulebooks are a few hundred kilobytes at most; anything larger is refused before parsing. */
export const MAX_RULEBOOK_BYTES = 2 * 1024 * 1024;
const MAX_CONDITION_DEPTH = 16;
const MAX_CONDITION_NODES = 400;
const MAX_ISSUES = 100;

/** Parse rulebook JSON text (an upload or file body). */
export function parseRulebookText(text: string): Rulebook {
  return parseRulebookTextWithNotes(text).rulebook;
}

/** One change made while reading a rulebook written for an earlier revision of the format. */
export interface MigrationNote {
  path: string;
  from: unknown;
  to: unknown;
  message: string;
}

/** Parse rulebook JSON text and report what was migrated. */
export function parseRulebookTextWithNotes(text: string): { rulebook: Rulebook; migrations: MigrationNote[] } {
  const bytes = new TextEncoder().encode(text).length;
  if (bytes > MAX_RULEBOOK_BYTES) throw new GavelError("too-large", `the rulebook is ${bytes} bytes; the limit is ${MAX_RULEBOOK_BYTES}`, { issues: [{ path: "(root)", message: "too large" }] });
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    throw new GavelError("invalid-input", `the rulebook is not valid JSON: ${(e as Error).message}`, { issues: [{ path: "(root)", message: "not valid JSON" }] });
  }
  return parseRulebookWithNotes(value);
}

/**
 * The changes reading `input` makes to bring it to the current revision of format version 1.
 * Today: `reconsiderable` written as a boolean (before the affirmative/negative distinction of
 * Robert's Rules of Order Revised, 1915, §36) becomes "both" (true) or "neither" (false).
 */
export function migrationNotes(input: unknown): MigrationNote[] {
  const notes: MigrationNote[] = [];
  if (input === null || typeof input !== "object" || Array.isArray(input)) return notes;
  const motions = (input as { motions?: unknown }).motions;
  if (!Array.isArray(motions)) return notes;
  motions.forEach((m, i) => {
    const r = m !== null && typeof m === "object" ? (m as { reconsiderable?: unknown }).reconsiderable : undefined;
    if (typeof r === "boolean") {
      const to = r ? "both" : "neither";
      notes.push({ path: `motions.${i}.reconsiderable`, from: r, to, message: `reconsiderable ${r} read as "${to}"; state "affirmative" or "negative" where only one result of the vote may be reconsidered` });
    }
  });
  return notes;
}

/** Validate a rulebook object and resolve ranks from precedence chains. Pure; throws GavelError. */
export function parseRulebook(input: unknown): Rulebook {
  return parseRulebookWithNotes(input).rulebook;
}

/** parseRulebook, also returning the migration notes (what was read in an earlier form, and how). */
export function parseRulebookWithNotes(input: unknown): { rulebook: Rulebook; migrations: MigrationNote[] } {
  if (input === null || typeof input !== "object" || Array.isArray(input)) {
    throw new GavelError("invalid-input", "a rulebook must be a JSON object", { issues: [{ path: "(root)", message: "expected an object" }] });
  }
  const migrations = migrationNotes(input);
  let rulebook: Rulebook;
  try {
    rulebook = parseWith(rulebookSchema, input, "rulebook");
  } catch (e) {
    if (e instanceof GavelError && e.issues.length > MAX_ISSUES) throw new GavelError(e.code, e.message, { issues: e.issues.slice(0, MAX_ISSUES) });
    throw e;
  }
  const issues: InputIssue[] = [];
  const motionIds = new Set<string>();
  rulebook.motions.forEach((m, i) => {
    if (motionIds.has(m.id)) issues.push({ path: `motions.${i}.id`, message: `duplicate motion id "${m.id}"` });
    motionIds.add(m.id);
  });
  rulebook.motions.forEach((m, i) => {
    (m.variants ?? []).forEach((v, k) => checkCondition(v.when, `motions.${i}.variants.${k}.when`, "motion", motionIds, issues, { nodes: 0 }, 0, true));
    (m.voteAlternatives ?? []).forEach((a, k) => {
      if (a.when !== undefined) checkCondition(a.when, `motions.${i}.voteAlternatives.${k}.when`, "motion", motionIds, issues, { nodes: 0 }, 0, true);
    });
  });
  const ruleIds = new Set<string>();
  rulebook.rules.forEach((r, i) => {
    if (ruleIds.has(r.id)) issues.push({ path: `rules.${i}.id`, message: `duplicate rule id "${r.id}"` });
    ruleIds.add(r.id);
    if (r.scope === "amendment") {
      if (!r.code) issues.push({ path: `rules.${i}.code`, message: "an amendment-scope rule needs a finding code" });
      if (!r.severity) issues.push({ path: `rules.${i}.severity`, message: "an amendment-scope rule needs a severity" });
    } else if (r.code || r.severity || r.related) {
      issues.push({ path: `rules.${i}.${r.code ? "code" : r.severity ? "severity" : "related"}`, message: "only amendment-scope rules produce findings with a code, severity or related" });
    }
    checkCondition(r.conditions, `rules.${i}.conditions`, r.scope, motionIds, issues, { nodes: 0 }, 0, true);
  });
  if (!motionIds.has(rulebook.amendments.motion)) issues.push({ path: "amendments.motion", message: `no motion "${rulebook.amendments.motion}" in the catalogue` });
  (rulebook.voting.quorum.withoutQuorum ?? []).forEach((id, i) => {
    if (!motionIds.has(id)) issues.push({ path: `voting.quorum.withoutQuorum.${i}`, message: `no motion "${id}" in the catalogue` });
  });
  (rulebook.precedence ?? []).forEach((chain, i) =>
    chain.forEach((step, j) =>
      stepIds(step).forEach((id, t) => {
        const at = typeof step === "string" ? `precedence.${i}.${j}` : `precedence.${i}.${j}.${t}`;
        if (!motionIds.has(id)) issues.push({ path: at, message: `no motion "${id}" in the catalogue` });
        const k = rulebook.motions.findIndex((m) => m.id === id);
        if (k >= 0 && rulebook.motions[k].rank !== null) issues.push({ path: `motions.${k}.rank`, message: `"${id}" is ranked by precedence.${i}; give its rank as null` });
      }),
    ),
  );
  if (issues.length) throw new GavelError("invalid-input", `rulebook: ${issues[0].path}: ${issues[0].message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ""}`, { issues: issues.slice(0, MAX_ISSUES) });
  if (rulebook.precedence?.length) return { rulebook: { ...rulebook, motions: rankFromPrecedence(rulebook) }, migrations };
  return { rulebook, migrations };
}

/** The ids at one place of a chain: one id, or several of equal rank. */
const stepIds = (step: string | string[]): string[] => (typeof step === "string" ? [step] : step);

/** Ranks from chains: a motion's rank is the length of the longest chain below it, so every stated relation holds. */
function rankFromPrecedence(rulebook: Rulebook) {
  const g = new DirectedGraph();
  const where = new Map<string, string>();
  rulebook.precedence!.forEach((chain, i) =>
    chain.forEach((step, j) => {
      const ids = stepIds(step);
      ids.forEach((id) => {
        g.mergeNode(id);
        if (!where.has(id)) where.set(id, `precedence.${i}.${j}`);
      });
      if (new Set(ids).size < ids.length) throw new GavelError("unprocessable", `a motion is listed twice in one place of precedence.${i}`, { issues: [{ path: `precedence.${i}.${j}`, message: "a motion cannot tie with itself" }] });
      if (j > 0) {
        for (const above of stepIds(chain[j - 1]))
          for (const id of ids) {
            if (above === id) throw new GavelError("unprocessable", `rank cycle: "${id}" is listed above itself`, { issues: [{ path: `precedence.${i}.${j}`, message: "a motion cannot take precedence over itself" }] });
            g.mergeEdge(above, id);
          }
      }
    }),
  );
  const cyclic = stronglyConnectedComponents(g).filter((c) => c.length > 1);
  if (cyclic.length) {
    const issues = cyclic.map((c) => ({ path: where.get(c[0])!, message: `rank cycle among ${c.map((x) => `"${x}"`).join(", ")}` }));
    throw new GavelError("unprocessable", `rulebook: precedence has a rank cycle among ${cyclic[0].join(", ")}`, { issues });
  }
  const memo = new Map<string, number>();
  const height = (id: string): number => {
    const known = memo.get(id);
    if (known !== undefined) return known;
    let h = 0;
    g.forEachOutNeighbor(id, (n) => {
      h = Math.max(h, height(n) + 1);
    });
    memo.set(id, h);
    return h;
  };
  return rulebook.motions.map((m) => (g.hasNode(m.id) ? { ...m, rank: height(m.id) } : m));
}

interface Counter {
  nodes: number;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === "object" && !Array.isArray(v);
}

function checkCondition(node: unknown, path: string, scope: RuleScope, motionIds: Set<string>, issues: InputIssue[], counter: Counter, depth: number, root = false): void {
  if (issues.length > MAX_ISSUES) return;
  if (++counter.nodes > MAX_CONDITION_NODES) {
    if (counter.nodes === MAX_CONDITION_NODES + 1) issues.push({ path, message: `a rule may have at most ${MAX_CONDITION_NODES} condition nodes` });
    return;
  }
  if (depth > MAX_CONDITION_DEPTH) {
    issues.push({ path, message: `conditions nest deeper than ${MAX_CONDITION_DEPTH} levels` });
    return;
  }
  if (!isPlainObject(node)) {
    issues.push({ path, message: "expected a condition object" });
    return;
  }
  const keys = Object.keys(node);
  const boolKeys = keys.filter((k) => k === "all" || k === "any" || k === "not");
  if ("condition" in node) {
    issues.push({ path: `${path}.condition`, message: "shared conditions are not supported; write the condition out" });
    return;
  }
  if (boolKeys.length > 1) {
    issues.push({ path, message: `a condition node has exactly one of all, any, not (found ${boolKeys.join(", ")})` });
    return;
  }
  if (boolKeys.length === 1) {
    const k = boolKeys[0];
    const extra = keys.filter((x) => x !== k && x !== "priority" && x !== "name");
    if (extra.length) issues.push({ path: `${path}.${extra[0]}`, message: `unexpected key "${extra[0]}" beside "${k}"` });
    if (k === "not") {
      checkCondition(node.not, `${path}.not`, scope, motionIds, issues, counter, depth + 1);
    } else {
      const list = node[k];
      if (!Array.isArray(list) || list.length === 0) {
        issues.push({ path: `${path}.${k}`, message: "expected a non-empty array of conditions" });
        return;
      }
      list.forEach((c, i) => checkCondition(c, `${path}.${k}.${i}`, scope, motionIds, issues, counter, depth + 1));
    }
    return;
  }
  if (root) {
    issues.push({ path, message: 'the root of "conditions" must be "all", "any" or "not"' });
    return;
  }
  checkLeaf(node, path, scope, motionIds, issues);
}

const LEAF_KEYS = new Set(["fact", "operator", "value", "path", "params", "priority", "name"]);

function checkFactRef(fact: unknown, factPath: unknown, path: string, scope: RuleScope, issues: InputIssue[]): boolean {
  let ok = true;
  if (typeof fact !== "string" || !SCOPE_FACTS[scope].includes(fact)) {
    issues.push({ path: `${path}.fact`, message: `unknown fact ${JSON.stringify(fact)} for ${scope}-scope rules; known: ${SCOPE_FACTS[scope].join(", ")}` });
    ok = false;
  }
  if (factPath !== undefined && (typeof factPath !== "string" || !FACT_PATH_PATTERN.test(factPath))) {
    issues.push({ path: `${path}.path`, message: 'a path is "$" followed by ".name" or "[index]" steps, e.g. "$.rank"' });
    ok = false;
  }
  return ok;
}

/** Facts whose `$.id` / `$.motion` hold a catalogue motion id, so values compared with them must be motion ids. */
const MOTION_ID_REFS = new Set(["motion:$.id", "immediatelyPending:$.motion", "pendingMotions:", "amendTarget:$.motion", "lastVote:$.motion"]);

function checkLeaf(node: Record<string, unknown>, path: string, scope: RuleScope, motionIds: Set<string>, issues: InputIssue[]): void {
  for (const k of Object.keys(node)) if (!LEAF_KEYS.has(k)) issues.push({ path: `${path}.${k}`, message: `unexpected key "${k}" in a condition` });
  const factOk = checkFactRef(node.fact, node.path, path, scope, issues);
  if (typeof node.operator !== "string" || !isKnownOperator(node.operator)) {
    issues.push({ path: `${path}.operator`, message: `unknown operator ${JSON.stringify(node.operator)}` });
  }
  if (!("value" in node)) issues.push({ path: `${path}.value`, message: "a condition needs a value" });
  if (node.params !== undefined && !isPlainObject(node.params)) issues.push({ path: `${path}.params`, message: "params must be an object" });
  const value = node.value;
  if (isPlainObject(value) && "fact" in value) {
    for (const k of Object.keys(value)) if (!["fact", "path", "params"].includes(k)) issues.push({ path: `${path}.value.${k}`, message: `unexpected key "${k}" in a fact reference` });
    checkFactRef(value.fact, value.path, `${path}.value`, scope, issues);
    return;
  }
  if (factOk && scope === "motion" && MOTION_ID_REFS.has(`${node.fact}:${node.path ?? ""}`)) {
    const named = Array.isArray(value) ? value : [value];
    named.forEach((v, i) => {
      if (typeof v === "string" && !motionIds.has(v)) issues.push({ path: Array.isArray(value) ? `${path}.value.${i}` : `${path}.value`, message: `no motion "${v}" in the catalogue` });
    });
  }
}
