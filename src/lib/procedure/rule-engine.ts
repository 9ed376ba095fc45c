/**
 * Runs a rulebook's rules of one scope over a set of facts with json-rules-engine and reports
 * which rules fired. Every verdict in Gavelwright (a motion out of order, a finding on an
 * amendment) is a fired rule; this module is the only place the engine is driven
 * (docs/decisions/0004-rules-as-data.md).
 */
import { Engine } from "json-rules-engine";
import { CUSTOM_OPERATORS, type RuleScope } from "./rule-vocabulary.ts";
import type { RuleDefinition, Rulebook } from "./rulebook-schema.ts";

export interface FiredRule {
  rule: RuleDefinition;
  /** The rule's message with "{fact.field}" placeholders filled from the facts. */
  message: string;
}

export interface RuleRunner {
  run(facts: Record<string, unknown>): Promise<FiredRule[]>;
}

/** Fill "{fact.a.b}" placeholders; unknown placeholders stay as written. */
export function fillMessage(template: string, facts: Record<string, unknown>): string {
  return template.replace(/\{([A-Za-z_][A-Za-z0-9_]*(?:\.[A-Za-z0-9_]+)*)\}/g, (whole, ref: string) => {
    let v: unknown = facts;
    for (const step of ref.split(".")) {
      if (v === null || typeof v !== "object") return whole;
      v = (v as Record<string, unknown>)[step];
    }
    if (v === undefined || v === null || typeof v === "object") return whole;
    return String(v);
  });
}

const PATH_STEP = /\.([A-Za-z_][A-Za-z0-9_]*)|\[(\d{1,4})\]/g;

/**
 * Resolve a condition's `path` ("$" then ".name" / "[index]" steps, the only form parseRulebook
 * accepts) by walking the fact. Same answers as the engine's default JSONPath resolver for these
 * paths, without evaluating JSONPath on every condition of every request (the hot spot under load).
 */
export function resolveFactPath(value: unknown, path: string): unknown {
  let v = value;
  for (const m of path.slice(1).matchAll(PATH_STEP)) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<string, unknown>)[m[1] ?? m[2]];
  }
  return v;
}

/** Build a runner for the rules of `scope`, in rulebook order. */
export function ruleRunner(rulebook: Pick<Rulebook, "rules">, scope: RuleScope): RuleRunner {
  const rules = rulebook.rules.filter((r) => r.scope === scope);
  const engine = new Engine([], { allowUndefinedFacts: false, pathResolver: resolveFactPath });
  for (const [name, fn] of Object.entries(CUSTOM_OPERATORS)) engine.addOperator(name, fn);
  rules.forEach((r, i) => {
    engine.addRule({
      name: r.id,
      priority: r.priority ?? 1,
      // json-rules-engine's types describe conditions loosely; parseRulebook has checked every node.
      conditions: r.conditions as never,
      event: { type: "fired", params: { index: i } },
    });
  });
  return {
    async run(facts) {
      if (rules.length === 0) return [];
      const { events } = await engine.run(facts);
      const fired = events.map((e) => (e.params as { index: number }).index).sort((a, b) => a - b);
      return fired.map((i) => ({ rule: rules[i], message: fillMessage(rules[i].message, facts) }));
    },
  };
}
