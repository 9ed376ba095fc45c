/**
 * The facts and operators of the rule vocabulary, described once in the clerk's words. The rule
 * sentences (rule-sentence.ts) and the guided condition builder both read this module, so a new
 * fact (or a new field of a fact) is described here and nowhere else. The JSON keeps the fact,
 * path and operator names; only what a clerk reads comes from here.
 *
 * Facts are listed in rule-vocabulary.ts (SCOPE_FACTS) and computed in legal-moves.ts and
 * validate-tree.ts; docs/rulebook-format.md gives each field. A unit test checks that every fact of
 * every scope is described and that every condition in every shipped template reads as a sentence.
 * Pure: no I/O.
 */
import { SCOPE_FACTS, type RuleScope } from "./rule-vocabulary.ts";
import { VOTE_THRESHOLDS } from "./voting-section.ts";

/** How a field's values are chosen and read. */
export type FieldKind = "boolean" | "number" | "text" | "motion" | "motion-list" | "class" | "list" | "time" | "enum";

export interface FieldDescription {
  /** A noun phrase: "the immediately pending question's rank". */
  label: string;
  kind: FieldKind;
  /** boolean: the clause when it holds, and when it does not ("another member has the floor" / "no other member has the floor"). */
  yes?: string;
  no?: string;
  /** list: the clause when it is empty, and when it is not. */
  empty?: string;
  nonEmpty?: string;
  /** enum: the values a clerk may choose, with their words. */
  values?: Record<string, string>;
  /** Words for a null value ("not recorded"). */
  unknown?: string;
  /** rank fields: the question ranked, so "X does not rank above Y" reads without "the rank of". */
  ranked?: string;
  /** Phrases for particular comparisons ("equal:0" → "nothing is pending"). */
  special?: Record<string, string>;
}

export interface FactDescription {
  fact: string;
  scopes: RuleScope[];
  /** The group heading in the builder: "The motion being made". */
  group: string;
  /** Fields read with a path ("$.rank"); "" is the fact itself (no path). */
  fields: Record<string, FieldDescription>;
}

const CLASS_WORDS: Record<string, string> = { privileged: "privileged", subsidiary: "subsidiary", incidental: "incidental", main: "main", restorative: "bringing a question back" };
const RECONSIDERABLE_WORDS: Record<string, string> = { both: "either result", affirmative: "an affirmative vote only", negative: "a negative vote only", neither: "no vote" };
const SEVERITY_WORDS: Record<string, string> = { error: "an error", warning: "a warning", info: "a note" };
const STATUS_WORDS: Record<string, string> = { open: "open", filed: "filed", pending: "pending", adopted: "adopted", struck: "struck out", rejected: "rejected", withdrawn: "withdrawn", fell: "fallen", "ruled-out": "ruled out of order" };
const CONSTRAINT_WORDS: Record<string, string> = {
  "secondary-before-primary": "an amendment to an amendment is voted first",
  "perfecting-before-substitute": "perfecting amendments are voted before a substitute",
  "furthest-first": "the amendment furthest from the text is voted first",
  "textual-order": "amendments are taken in the order of the text",
  "passage-last": "the measure is put last",
  "primary-contiguous": "one primary amendment is pending at a time",
  "perfecting-after-rejected-substitute": "a perfecting amendment may be voted after a rejected substitute",
};
export const CLASS_LABELS = CLASS_WORDS;
export const SEVERITY_LABELS = SEVERITY_WORDS;
export const RECONSIDERABLE_LABELS = RECONSIDERABLE_WORDS;

/** Words for a vote threshold id; ids added to the vocabulary later read as their words ("two-thirds-of-present" → "two-thirds of present"). */
export function thresholdWords(id: unknown): string {
  if (id !== null && typeof id === "object" && (id as { kind?: unknown }).kind === "number") return `at least ${String((id as { value?: unknown }).value)} votes in favour`;
  if (typeof id !== "string") return String(id);
  const known: Record<string, string> = {
    majority: "a majority",
    "two-thirds": "two-thirds",
    "majority-of-members": "a majority of the members",
    none: "no vote (the chair decides)",
    "two-thirds-of-members": "two-thirds of the members",
    "three-fifths-of-members": "three-fifths of the members",
    "two-thirds-of-present": "two-thirds of the members present",
  };
  return known[id] ?? id.replace(/-/g, " ");
}

/** The fields a pending question has (immediatelyPending, amendTarget, entries of pending). */
function questionFields(q: string, exists: [string, string]): Record<string, FieldDescription> {
  return {
    exists: { label: `whether there is ${q}`, kind: "boolean", yes: exists[0], no: exists[1] },
    motion: { label: q, kind: "motion" },
    name: { label: `the name of ${q}`, kind: "text" },
    class: { label: `the class of ${q}`, kind: "class", values: CLASS_WORDS },
    rank: { label: `the rank of ${q}`, kind: "number", unknown: "unranked", ranked: q },
    degree: { label: `the degree of ${q}`, kind: "number", unknown: "not an amendment" },
    debatable: { label: `whether ${q} is debatable`, kind: "boolean", yes: `${q} is debatable`, no: `${q} is not debatable` },
    amendable: { label: `whether ${q} can be amended`, kind: "boolean", yes: `${q} can be amended`, no: `${q} cannot be amended` },
    independentParts: { label: `whether ${q} has independent parts`, kind: "boolean", yes: `${q} is made of independent parts`, no: `${q} is not made of independent parts` },
    hasBlank: { label: `whether ${q} has a blank`, kind: "boolean", yes: `${q} has a blank to fill`, no: `${q} has no blank to fill` },
  };
}

const LIMIT_FIELDS: Record<string, FieldDescription> = {
  motion: { label: "the motion to amend", kind: "motion" },
  forms: { label: "the forms of amendment allowed", kind: "list" },
  maxDegree: { label: "the highest degree of amendment allowed", kind: "number", unknown: "no limit" },
  pendingPerSlot: { label: "the number of amendments allowed pending in one place", kind: "number", unknown: "no limit" },
  maxPending: { label: "the number of amendments allowed pending on a measure", kind: "number", unknown: "no limit" },
  substituteSlot: { label: "whether a substitute has its own place", kind: "boolean", yes: "a substitute has its own place", no: "a substitute has no place of its own" },
  substituteForAmendment: { label: "whether a substitute for an amendment counts as first degree", kind: "boolean", yes: "a substitute for an amendment counts as first degree", no: "a substitute for an amendment is one degree higher" },
  perfectingUnderSubstitute: { label: "the degree of an amendment made under a pending substitute", kind: "enum", values: { "first-degree": "first degree", "second-degree": "second degree" } },
  minSponsors: { label: "the number of sponsors required", kind: "number" },
  "germaneness.test": { label: "the germaneness test", kind: "enum", values: { subjects: "by subjects", section: "by section", committee: "by committee", none: "none" } },
  "filingDeadline.hoursBefore": { label: "the filing deadline (hours before the sitting)", kind: "number", unknown: "no deadline" },
};

const VOTE_WORDS: Record<string, string> = Object.fromEntries(VOTE_THRESHOLDS.map((t) => [t, thresholdWords(t)]));

const DESCRIPTIONS: FactDescription[] = [
  {
    fact: "motion",
    scopes: ["motion"],
    group: "The motion being made",
    fields: {
      id: { label: "the motion", kind: "motion" },
      name: { label: "the motion's name", kind: "text" },
      class: { label: "the motion's class", kind: "class", values: CLASS_WORDS },
      rank: { label: "the motion's rank", kind: "number", unknown: "unranked", ranked: "the motion" },
      second: { label: "whether the motion needs a second", kind: "boolean", yes: "the motion needs a second", no: "the motion needs no second" },
      debatable: { label: "whether the motion is debatable", kind: "boolean", yes: "the motion is debatable", no: "the motion is not debatable" },
      amendable: { label: "whether the motion can be amended", kind: "boolean", yes: "the motion can be amended", no: "the motion cannot be amended" },
      vote: { label: "the vote the motion needs", kind: "enum", values: VOTE_WORDS },
      interrupt: { label: "whether the motion may interrupt a speaker", kind: "boolean", yes: "the motion may interrupt a speaker", no: "the motion may not interrupt a speaker" },
      reconsiderable: { label: "which vote on the motion may be reconsidered", kind: "enum", values: RECONSIDERABLE_WORDS },
      "window.days": { label: "the days allowed after the vote", kind: "number", unknown: "no limit" },
      "window.sittings": { label: "the sittings allowed after the vote", kind: "number", unknown: "no limit" },
      withoutQuorum: { label: "whether the motion may be made without a quorum", kind: "boolean", yes: "the motion may be made without a quorum", no: "the motion needs a quorum" },
    },
  },
  { fact: "immediatelyPending", scopes: ["motion"], group: "The immediately pending question", fields: questionFields("the immediately pending question", ["a question is pending", "nothing is pending"]) },
  {
    fact: "amendTarget",
    scopes: ["motion"],
    group: "The question an amendment would apply to",
    fields: { ...questionFields("the question an amendment would apply to", ["there is a question an amendment would apply to", "there is no question an amendment would apply to"]), skipped: { label: "the pending questions an amendment would pass over", kind: "motion-list", empty: "an amendment would pass over no pending question", nonEmpty: "an amendment would pass over a pending question" } },
  },
  { fact: "pending", scopes: ["motion"], group: "The questions pending", fields: { "": { label: "the questions pending", kind: "list", empty: "nothing is pending", nonEmpty: "a question is pending" } } },
  { fact: "pendingMotions", scopes: ["motion"], group: "The questions pending", fields: { "": { label: "the motions pending", kind: "motion-list", empty: "nothing is pending", nonEmpty: "a question is pending" } } },
  {
    fact: "pendingCount",
    scopes: ["motion"],
    group: "The questions pending",
    fields: { "": { label: "the number of questions pending", kind: "number", special: { "equal:0": "nothing is pending", "greaterThan:0": "a question is pending", "notEqual:0": "a question is pending" } } },
  },
  { fact: "amendDegree", scopes: ["motion"], group: "The question an amendment would apply to", fields: { "": { label: "the degree an amendment moved now would have", kind: "number" } } },
  {
    fact: "lastVote",
    scopes: ["motion"],
    group: "The vote to be reconsidered",
    fields: {
      exists: { label: "a vote taken", kind: "boolean", yes: "a vote has been taken", no: "no vote has been taken" },
      motion: { label: "the motion last voted on", kind: "motion" },
      name: { label: "the name of the motion last voted on", kind: "text" },
      class: { label: "the class of the motion last voted on", kind: "class", values: CLASS_WORDS },
      result: { label: "the result of the last vote", kind: "enum", values: { adopted: "adopted", rejected: "rejected" }, unknown: "not known" },
      day: { label: "the day of the last vote", kind: "number", unknown: "not known" },
      sitting: { label: "the sitting of the last vote", kind: "number", unknown: "not known" },
      daysSince: { label: "the days since the last vote", kind: "number", unknown: "not known" },
      sittingsSince: { label: "the sittings since the last vote", kind: "number", unknown: "not known" },
      reconsiderable: { label: "which vote on the motion last voted on may be reconsidered", kind: "enum", values: RECONSIDERABLE_WORDS },
      debatable: { label: "whether the motion last voted on is debatable", kind: "boolean", yes: "the motion last voted on is debatable", no: "the motion last voted on is not debatable" },
      resultReconsiderable: { label: "whether the result of the last vote may be reconsidered", kind: "boolean", yes: "the result of the last vote may be reconsidered", no: "the result of the last vote may not be reconsidered" },
      moverOnPrevailingSide: { label: "whether the mover voted with the prevailing side", kind: "boolean", yes: "the mover voted with the prevailing side", no: "the mover did not vote with the prevailing side" },
    },
  },
  {
    fact: "floor",
    scopes: ["motion"],
    group: "The floor",
    fields: {
      speakerHasFloor: { label: "whether a member has the floor", kind: "boolean", yes: "another member has the floor", no: "no other member has the floor" },
      debateBegun: { label: "whether debate has begun", kind: "boolean", yes: "debate has begun", no: "debate has not begun" },
      chairHasRuled: { label: "whether the chair has ruled", kind: "boolean", yes: "the chair has ruled", no: "the chair has not ruled" },
      voteTaken: { label: "whether a vote has been taken", kind: "boolean", yes: "a vote has been taken", no: "no vote has been taken" },
      tabled: { label: "the number of questions lying on the table", kind: "number", special: { "equal:0": "no question lies on the table", "greaterThan:0": "a question lies on the table" } },
      day: { label: "the day number", kind: "number", unknown: "not known" },
      sitting: { label: "the sitting number", kind: "number", unknown: "not known" },
      votes: { label: "the recent votes", kind: "list", empty: "no vote is recorded", nonEmpty: "a vote is recorded" },
      reconsiderVote: { label: "the vote chosen for reconsideration", kind: "number", unknown: "the latest" },
      noticeGiven: { label: "whether notice was given", kind: "boolean", yes: "previous notice was given", no: "no previous notice was given" },
      arisesFromPending: { label: "whether the motion arises out of the pending question", kind: "boolean", yes: "the motion arises out of the immediately pending question", no: "the motion does not arise out of the immediately pending question" },
      committeeOfTheWhole: { label: "whether the chamber sits in Committee of the Whole", kind: "boolean", yes: "the chamber sits in Committee of the Whole", no: "the chamber does not sit in Committee of the Whole" },
      quorumPresent: { label: "whether a quorum is present", kind: "boolean", yes: "a quorum is present", no: "no quorum is present" },
    },
  },
  { fact: "limits", scopes: ["motion", "amendment"], group: "The amendment rules", fields: LIMIT_FIELDS },
  {
    fact: "amendment",
    scopes: ["amendment"],
    group: "The amendment",
    fields: {
      id: { label: "the amendment", kind: "text" },
      target: { label: "what the amendment amends", kind: "text" },
      form: { label: "the amendment's form", kind: "enum", values: { insert: "insert", strike: "strike out", "strike-and-insert": "strike out and insert", substitute: "substitute", "in-nature-of-substitute": "in the nature of a substitute" } },
      status: { label: "the amendment's status", kind: "enum", values: STATUS_WORDS },
      degree: { label: "the amendment's stated degree", kind: "number", unknown: "not stated" },
      sponsors: { label: "the amendment's sponsors", kind: "list", empty: "the amendment has no sponsor", nonEmpty: "the amendment has a sponsor" },
      sponsorCount: { label: "the number of the amendment's sponsors", kind: "number" },
      subjects: { label: "the amendment's subjects", kind: "list", empty: "the amendment has no subject", nonEmpty: "the amendment has a subject" },
      committee: { label: "the amendment's committee", kind: "text", unknown: "none" },
      filedAt: { label: "the time the amendment was filed", kind: "time", unknown: "not recorded" },
      lines: { label: "the lines the amendment changes", kind: "list" },
      distance: { label: "the amendment's distance from the text", kind: "number", unknown: "not stated" },
    },
  },
  {
    fact: "target",
    scopes: ["amendment"],
    group: "What the amendment amends",
    fields: {
      id: { label: "what the amendment amends", kind: "text" },
      exists: { label: "whether what it amends exists", kind: "boolean", yes: "what the amendment amends exists", no: "what the amendment amends does not exist" },
      kind: { label: "what kind of text it amends", kind: "enum", values: { measure: "the measure", section: "a section", amendment: "an amendment" }, unknown: "nothing" },
      status: { label: "the status of what it amends", kind: "enum", values: STATUS_WORDS },
      subjects: { label: "the subjects of what it amends", kind: "list" },
    },
  },
  {
    fact: "measure",
    scopes: ["amendment"],
    group: "The measure",
    fields: {
      id: { label: "the measure", kind: "text" },
      subjects: { label: "the measure's subjects", kind: "list" },
      committee: { label: "the measure's committee", kind: "text", unknown: "none" },
      sectionCount: { label: "the number of the measure's sections", kind: "number" },
    },
  },
  {
    fact: "voting",
    scopes: ["amendment"],
    group: "The voting rules",
    fields: {
      procedure: { label: "the voting procedure", kind: "enum", values: { amendment: "the amendment procedure", successive: "the successive procedure" } },
      constraints: { label: "the rules on the order of votes", kind: "list", values: CONSTRAINT_WORDS },
      amendmentThreshold: { label: "the vote an amendment needs", kind: "enum", values: VOTE_WORDS },
      tieRule: { label: "the tie rule", kind: "text" },
    },
  },
  {
    fact: "tree",
    scopes: ["amendment"],
    group: "The amendment's place in the tree",
    fields: {
      degree: { label: "the amendment's degree", kind: "number" },
      slot: { label: "the amendment's place", kind: "text" },
      role: { label: "the amendment's role", kind: "enum", values: { perfecting: "perfecting", substitute: "substitute", "substitute-for-amendment": "substitute for an amendment", "perfecting-under-substitute": "perfecting under a substitute", "amendment-to-amendment": "amendment to an amendment" } },
      underSubstitute: { label: "the substitute the amendment is made under", kind: "text", unknown: "none" },
      slotPosition: { label: "the amendment's position among those pending in its place", kind: "number", unknown: "not pending" },
      pendingPosition: { label: "the amendment's position among those pending on the measure", kind: "number", unknown: "not pending" },
      inCycle: { label: "whether the amendment is in a cycle", kind: "boolean", yes: "the amendment is part of a cycle of amendments to each other", no: "the amendment is not part of a cycle" },
      selfTarget: { label: "whether the amendment amends itself", kind: "boolean", yes: "the amendment amends itself", no: "the amendment does not amend itself" },
      dependsOnCycle: { label: "whether the amendment depends on a cycle", kind: "boolean", yes: "the amendment amends a cycle of amendments", no: "the amendment does not amend a cycle" },
      children: { label: "the amendments to it", kind: "list", empty: "nothing amends the amendment", nonEmpty: "the amendment is itself amended" },
    },
  },
  {
    fact: "filing",
    scopes: ["amendment"],
    group: "Filing",
    fields: {
      filedAtMs: { label: "the time the amendment was filed", kind: "time", unknown: "not recorded" },
      deadlineMs: { label: "the filing deadline", kind: "time", unknown: "not set" },
      asOfMs: { label: "the time of the sitting", kind: "time", unknown: "not set" },
    },
  },
  {
    fact: "germaneness",
    scopes: ["amendment"],
    group: "Germaneness",
    fields: {
      test: { label: "the germaneness test", kind: "enum", values: { subjects: "by subjects", section: "by section", committee: "by committee", none: "none" } },
      decidable: { label: "whether germaneness can be decided from the data", kind: "boolean", yes: "germaneness can be decided from the subjects given", no: "germaneness cannot be decided from the subjects given (the chair rules)" },
      amendmentSubjects: { label: "the amendment's subjects", kind: "list" },
      targetSubjects: { label: "the subjects of the text amended", kind: "list" },
      amendmentCommittee: { label: "the amendment's committee", kind: "text", unknown: "none" },
      measureCommittee: { label: "the measure's committee", kind: "text", unknown: "none" },
    },
  },
  { fact: "conflictsWith", scopes: ["amendment"], group: "Other amendments", fields: { "": { label: "the open amendments changing the same text", kind: "list", empty: "no other open amendment changes the same text", nonEmpty: "another open amendment changes the same text" } } },
  { fact: "perfectingSiblings", scopes: ["amendment"], group: "Other amendments", fields: { "": { label: "the open perfecting amendments to the text it replaces", kind: "list", empty: "no perfecting amendment to the text it replaces is open", nonEmpty: "a perfecting amendment to the text it replaces is open" } } },
  { fact: "cycleMembers", scopes: ["amendment"], group: "Other amendments", fields: { "": { label: "the amendments in its cycle", kind: "list", empty: "the amendment is in no cycle", nonEmpty: "the amendment is in a cycle" } } },
];

const BY_FACT = new Map(DESCRIPTIONS.map((d) => [d.fact, d]));

/** Every described fact, in the order the builder offers them. */
export function factDescriptions(scope?: RuleScope): readonly FactDescription[] {
  return scope ? DESCRIPTIONS.filter((d) => d.scopes.includes(scope)) : DESCRIPTIONS;
}

/** "$.window.days" → "window.days"; "$" or absent → "". Index steps are not field names (null). */
export function fieldKey(path: unknown): string | null {
  if (path === undefined || path === null || path === "$") return "";
  if (typeof path !== "string" || !path.startsWith("$.")) return null;
  const key = path.slice(2);
  return /^[A-Za-z_][A-Za-z0-9_]*(\.[A-Za-z_][A-Za-z0-9_]*)*$/.test(key) ? key : null;
}

/** The description of a fact's field, or null when it is not described (the test fails on any). */
export function describeField(fact: unknown, path: unknown): FieldDescription | null {
  if (typeof fact !== "string") return null;
  const d = BY_FACT.get(fact);
  const key = fieldKey(path);
  if (!d || key === null) return null;
  return d.fields[key] ?? null;
}

/** The facts of a scope that have no description (a unit test keeps this empty). */
export function undescribedFacts(scope: RuleScope): string[] {
  return SCOPE_FACTS[scope].filter((f) => !BY_FACT.get(f)?.scopes.includes(scope));
}

/** The path written in JSON for a field key ("" → no path). */
export const pathOf = (key: string): string | undefined => (key === "" ? undefined : `$.${key}`);

export interface OperatorDescription {
  op: string;
  /** Verb phrase: "is", "is one of", "does not rank above". */
  words: string;
  /** The kinds of field it applies to in the builder. */
  kinds: FieldKind[];
  /** The value is a list (in, notIn). */
  listValue?: boolean;
}

/** Operators in the clerk's words; decorated ones ("not:overlaps") are read by describeOperator. */
export const OPERATORS: OperatorDescription[] = [
  { op: "equal", words: "is", kinds: ["boolean", "number", "text", "motion", "class", "enum", "time"] },
  { op: "notEqual", words: "is not", kinds: ["boolean", "number", "text", "motion", "class", "enum", "time"] },
  { op: "in", words: "is one of", kinds: ["motion", "class", "enum", "text"], listValue: true },
  { op: "notIn", words: "is none of", kinds: ["motion", "class", "enum", "text"], listValue: true },
  { op: "contains", words: "includes", kinds: ["list", "motion-list"] },
  { op: "doesNotContain", words: "does not include", kinds: ["list", "motion-list"] },
  { op: "lessThan", words: "is less than", kinds: ["number"] },
  { op: "lessThanInclusive", words: "is at most", kinds: ["number"] },
  { op: "greaterThan", words: "is more than", kinds: ["number"] },
  { op: "greaterThanInclusive", words: "is at least", kinds: ["number"] },
  { op: "ranksBelow", words: "ranks below", kinds: ["number"] },
  { op: "ranksNotAbove", words: "does not rank above", kinds: ["number"] },
  { op: "exceeds", words: "exceeds", kinds: ["number"] },
  { op: "laterThan", words: "is later than", kinds: ["time"] },
  { op: "overlaps", words: "shares an element with", kinds: ["list", "motion-list"] },
  { op: "not:overlaps", words: "shares nothing with", kinds: ["list", "motion-list"] },
  { op: "isEmpty", words: "is empty", kinds: ["list", "motion-list", "text"] },
];
const OP_BY_NAME = new Map(OPERATORS.map((o) => [o.op, o]));
const DECORATOR_WORDS: Record<string, string> = { someFact: "for some of its elements", everyFact: "for every one of its elements", someValue: "for some of the values", everyValue: "for every one of the values" };

/** An operator in words; null when it is not known. "not:X" reads as the negation of X. */
export function describeOperator(name: unknown): string | null {
  if (typeof name !== "string") return null;
  const direct = OP_BY_NAME.get(name);
  if (direct) return direct.words;
  const parts = name.split(":");
  const base = OP_BY_NAME.get(parts.pop()!);
  if (!base) return null;
  let words = base.words;
  for (const d of parts.reverse()) {
    if (d === "not") words = negate(words);
    else if (d === "swap") words = `(reversed) ${words}`;
    else if (DECORATOR_WORDS[d]) words = `${words} ${DECORATOR_WORDS[d]}`;
    else return null;
  }
  return words;
}

function negate(words: string): string {
  if (words.startsWith("is not ")) return `is ${words.slice(7)}`;
  if (words.startsWith("is ")) return `is not ${words.slice(3)}`;
  if (words.startsWith("does not ")) return words.slice(9).replace(/^rank/, "ranks").replace(/^include/, "includes");
  const [verb, ...rest] = words.split(" ");
  return `does not ${verb.replace(/s$/, "")} ${rest.join(" ")}`.trim();
}

/** The operators the builder offers for a field kind. */
export function operatorsFor(kind: FieldKind): OperatorDescription[] {
  return OPERATORS.filter((o) => o.kinds.includes(kind));
}
