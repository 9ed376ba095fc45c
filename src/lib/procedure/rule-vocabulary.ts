/**
 * The vocabulary a rulebook's rules may use: the facts the engine supplies for each scope,
 * and the operators (json-rules-engine built-ins, its operator decorators, and our own).
 * A rulebook naming anything outside this vocabulary is rejected at load time, so a typo in
 * a clerk's rule never silently turns into "never fires".
 *
 * Operators follow json-rules-engine 7 semantics: `decorator:…:operator` chains such as
 * `not:contains` or `someFact:in` are allowed when every decorator is known.
 */
export const RULE_SCOPES = ["motion", "amendment"] as const;
export type RuleScope = (typeof RULE_SCOPES)[number];

/** Facts available to motion-scope rules (see docs/rulebook-format.md for each field). */
export const MOTION_FACTS = ["motion", "immediatelyPending", "pending", "pendingMotions", "pendingCount", "amendDegree", "amendTarget", "lastVote", "floor", "limits"] as const;

/** Facts available to amendment-scope rules. */
export const AMENDMENT_FACTS = ["amendment", "target", "measure", "limits", "voting", "tree", "filing", "germaneness", "conflictsWith", "perfectingSiblings", "cycleMembers"] as const;

export const SCOPE_FACTS: Record<RuleScope, readonly string[]> = { motion: MOTION_FACTS, amendment: AMENDMENT_FACTS };

export const BUILTIN_OPERATORS = ["equal", "notEqual", "in", "notIn", "contains", "doesNotContain", "lessThan", "lessThanInclusive", "greaterThan", "greaterThanInclusive"] as const;
export const OPERATOR_DECORATORS = ["someFact", "someValue", "everyFact", "everyValue", "swap", "not"] as const;

const isFiniteNumber = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/**
 * Our own operators. Each is total: a fact of the wrong type makes the condition false
 * rather than throwing, because a missing value must never make a motion out of order.
 */
export const CUSTOM_OPERATORS: Record<string, (factValue: unknown, value: unknown) => boolean> = {
  /** Two arrays share at least one element (subject-tag germaneness). */
  overlaps: (a, b) => Array.isArray(a) && Array.isArray(b) && a.some((x) => b.includes(x)),
  /** `value: true` holds when the fact is an empty array, an empty string, or null. */
  isEmpty: (a, b) => (a === null || a === undefined || (Array.isArray(a) && a.length === 0) || a === "") === (b === true),
  /** Both are finite numbers (times in ms) and the fact is later; null on either side is false. */
  laterThan: (a, b) => isFiniteNumber(a) && isFiniteNumber(b) && a > b,
  /** Both are finite numbers and the fact is strictly lower (rank comparisons; null ranks never compare). */
  ranksBelow: (a, b) => isFiniteNumber(a) && isFiniteNumber(b) && a < b,
  /** Both are finite numbers and the fact is lower or equal (a motion does not take precedence of its own rank). */
  ranksNotAbove: (a, b) => isFiniteNumber(a) && isFiniteNumber(b) && a <= b,
  /** Both are finite numbers and the fact is strictly higher. */
  exceeds: (a, b) => isFiniteNumber(a) && isFiniteNumber(b) && a > b,
};

const KNOWN_OPERATORS = new Set<string>([...BUILTIN_OPERATORS, ...Object.keys(CUSTOM_OPERATORS)]);
const KNOWN_DECORATORS = new Set<string>(OPERATOR_DECORATORS);

/** True when `name` is an operator, optionally prefixed by known decorators ("not:overlaps"). */
export function isKnownOperator(name: string): boolean {
  const parts = name.split(":");
  const op = parts.pop()!;
  return KNOWN_OPERATORS.has(op) && parts.every((d) => KNOWN_DECORATORS.has(d));
}

/**
 * Paths are restricted to plain member and index access ("$.rank", "$.subjects[0]"): jsonpath
 * filter and script expressions are never needed for procedure and would let a rulebook file
 * run arbitrary expressions.
 */
export const FACT_PATH_PATTERN = /^\$(\.[A-Za-z_][A-Za-z0-9_]*|\[\d{1,4}\])*$/;
