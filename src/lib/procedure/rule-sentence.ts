/**
 * A rule read as a sentence, generated from its conditions with the words of fact-descriptions.ts:
 * "Amend is out of order when the question an amendment would apply to cannot be amended". The
 * citation is returned beside it. Conditions a description does not cover are named in
 * `undescribed` (and read with their JSON names), so a test can insist that none is left.
 * Pure: no I/O.
 */
import { CLASS_LABELS, describeField, describeOperator, SEVERITY_LABELS, thresholdWords, type FieldDescription } from "./fact-descriptions.ts";

type Node = Record<string, unknown>;
const isObj = (v: unknown): v is Node => v !== null && typeof v === "object" && !Array.isArray(v);

/** What a sentence needs to know of the rulebook: motion names by id. */
export interface SentenceContext {
  motionNames: ReadonlyMap<string, string>;
}

export function sentenceContext(doc: { motions?: readonly { id: string; name: string }[] }): SentenceContext {
  return { motionNames: new Map((doc.motions ?? []).map((m) => [m.id, m.name])) };
}

export interface Sentence {
  text: string;
  /** "fact.path" of conditions read with their JSON names, because nothing describes them. */
  undescribed: string[];
}

interface RuleLike {
  scope: string;
  conditions: unknown;
  citation?: string;
  severity?: string;
}

const joinWords = (items: string[], word: "and" | "or"): string => (items.length <= 1 ? (items[0] ?? "") : `${items.slice(0, -1).join(", ")} ${word} ${items[items.length - 1]}`);

class Reader {
  undescribed: string[] = [];
  constructor(private ctx: SentenceContext) {}

  motionName(id: unknown): string {
    return typeof id === "string" ? (this.ctx.motionNames.get(id) ?? id) : String(id);
  }

  valueWords(field: FieldDescription | null, value: unknown): string {
    if (value === null || value === undefined) return field?.unknown ?? "not known";
    if (Array.isArray(value)) return joinWords(value.map((v) => this.valueWords(field, v)), "or");
    if (isObj(value) && "fact" in value) return this.refWords(value);
    if (field?.kind === "motion" || field?.kind === "motion-list") return this.motionName(value);
    if (field?.kind === "class") return CLASS_LABELS[String(value)] ?? String(value);
    if (field?.values && typeof value === "string") return field.values[value] ?? value;
    if (field?.label.startsWith("the vote") && typeof value === "string") return thresholdWords(value);
    if (typeof value === "boolean") return value ? "yes" : "no";
    if (typeof value === "string") return value.replace(/-/g, " ");
    if (isObj(value)) {
      this.undescribed.push(`value ${JSON.stringify(value).slice(0, 60)}`);
      return "a value";
    }
    return String(value);
  }

  refWords(ref: Node): string {
    const d = describeField(ref.fact, ref.path);
    if (!d) {
      this.undescribed.push(`${String(ref.fact)}${typeof ref.path === "string" ? ref.path.slice(1) : ""}`);
      return `${String(ref.fact)}${typeof ref.path === "string" ? ref.path.slice(1) : ""}`;
    }
    return d.label;
  }

  leaf(n: Node): string {
    const field = describeField(n.fact, n.path);
    const op = typeof n.operator === "string" ? n.operator : "";
    const opWords = describeOperator(op);
    const name = `${String(n.fact)}${typeof n.path === "string" ? n.path.slice(1) : ""}`;
    if (!field) this.undescribed.push(name);
    if (!opWords) this.undescribed.push(`operator ${op}`);
    const label = field?.label ?? name;
    const v = n.value;
    if (field?.special && typeof v !== "object" && field.special[`${op}:${String(v)}`]) return field.special[`${op}:${String(v)}`];
    if (field?.kind === "boolean" && typeof v === "boolean" && (op === "equal" || op === "notEqual") && field.yes && field.no) {
      const holds = (op === "equal") === v;
      // notEqual also holds when the fact is not known.
      return op === "equal" ? (holds ? field.yes : field.no) : `${holds ? field.yes : field.no} (or it is not known)`;
    }
    if (field?.ranked && (op === "ranksBelow" || op === "ranksNotAbove") && isObj(v) && "fact" in v) {
      const other = describeField(v.fact, v.path);
      if (other?.ranked) return `${field.ranked} ${opWords} ${other.ranked}`;
    }
    if (op === "isEmpty" && typeof v === "boolean") {
      if (field?.empty && field.nonEmpty) return v ? field.empty : field.nonEmpty;
      return `${label} ${v ? "is empty" : "is not empty"}`;
    }
    if (field?.kind === "motion" && (op === "equal" || op === "notEqual") && typeof v === "string" && label === "the motion") {
      return op === "equal" ? `the motion is ${this.motionName(v)}` : `the motion is not ${this.motionName(v)}`;
    }
    if (field?.kind === "list" && field.values && typeof v === "string" && field.values[v] && (op === "contains" || op === "doesNotContain")) {
      return `${label} ${op === "contains" ? "include" : "do not include"} that ${field.values[v]}`;
    }
    if (v === null && (op === "equal" || op === "notEqual")) return op === "equal" ? `${label} is ${field?.unknown ?? "not known"}` : `${label} is known`;
    return `${label} ${opWords ?? op} ${this.valueWords(field, v)}`;
  }

  node(n: unknown, top = false): string {
    if (!isObj(n)) {
      this.undescribed.push("condition");
      return "a condition";
    }
    if (Array.isArray(n.all)) return this.group(n.all, "and", top);
    if (Array.isArray(n.any)) {
      const parts = n.any.map((c) => this.node(c));
      return parts.length > 1 ? `either ${joinWords(parts, "or")}` : parts[0];
    }
    if ("not" in n) return `it is not the case that ${this.node(n.not)}`;
    return this.leaf(n);
  }

  /** An `all` list: plain clauses joined by "and", negated groups as "unless …". */
  group(list: unknown[], word: "and", top: boolean): string {
    const plain: string[] = [];
    const either: string[] = [];
    const unless: string[] = [];
    // "there is a question … and that question cannot be amended": the second clause says both.
    const redundant = (c: unknown) => isObj(c) && c.path === "$.exists" && c.operator === "equal" && c.value === true && list.some((o) => o !== c && isObj(o) && o.fact === c.fact && o.path !== "$.exists" && "operator" in o);
    for (const c of list) {
      if (redundant(c)) continue;
      if (top && isObj(c) && "not" in c && Object.keys(c).filter((k) => k !== "name" && k !== "priority").length === 1) unless.push(this.node(c.not));
      else if (isObj(c) && Array.isArray(c.any) && c.any.length > 1) either.push(this.node(c));
      else plain.push(this.node(c));
    }
    // "either A or B" goes last, so "and" never splits it; a second one is bracketed.
    either.forEach((e, i) => plain.push(i === 0 ? e : `(${e})`));
    const head = joinWords(plain, word);
    return unless.length ? `${head}${head ? ", " : ""}unless ${joinWords(unless, "or")}` : head;
  }
}

/** The subject of a motion-scope rule taken from its top-level conditions on the motion's id or class. */
function motionSubject(conditions: unknown, reader: Reader): { subject: string; rest: unknown[] } | null {
  if (!isObj(conditions) || !Array.isArray(conditions.all)) return null;
  const rest: unknown[] = [];
  let subject: string | null = null;
  let classNote: string | null = null;
  for (const c of conditions.all) {
    if (isObj(c) && c.fact === "motion" && c.path === "$.id" && subject === null && (c.operator === "equal" || c.operator === "in")) {
      const ids = Array.isArray(c.value) ? c.value : [c.value];
      if (ids.every((x) => typeof x === "string")) {
        subject = joinWords(ids.map((x) => reader.motionName(x)), "or");
        continue;
      }
    }
    if (isObj(c) && c.fact === "motion" && c.path === "$.class" && classNote === null && typeof c.value === "string" && (c.operator === "equal" || c.operator === "notEqual")) {
      const words = CLASS_LABELS[c.value] ?? c.value;
      classNote = c.operator === "equal" ? `${/^[aeiou]/.test(words) ? "An" : "A"} ${words} motion` : `Any motion other than ${/^[aeiou]/.test(words) ? "an" : "a"} ${words} motion`;
      continue;
    }
    rest.push(c);
  }
  if (subject === null && classNote === null) return null;
  if (subject !== null && classNote !== null) {
    // Both: the id names the motion; the class stays a condition.
    const cls = conditions.all.find((c) => isObj(c) && c.fact === "motion" && c.path === "$.class");
    rest.unshift(cls);
  }
  return { subject: subject ?? classNote!, rest };
}

/** The sentence for one rule (without its citation). */
export function ruleSentence(rule: RuleLike, ctx: SentenceContext): Sentence {
  const reader = new Reader(ctx);
  let text: string;
  if (rule.scope === "motion") {
    const s = motionSubject(rule.conditions, reader);
    if (s) {
      const when = s.rest.length ? reader.group(s.rest, "and", true) : "";
      text = when ? `${s.subject} is out of order when ${when.replace(/^unless/, "always, unless")}` : `${s.subject} is always out of order`;
    } else {
      text = `A motion is out of order when ${reader.node(rule.conditions, true)}`;
    }
  } else {
    const what = SEVERITY_LABELS[rule.severity ?? ""] ?? "a finding";
    text = `An amendment draws ${what} when ${reader.node(rule.conditions, true)}`;
  }
  return { text: `${text}.`, undescribed: [...new Set(reader.undescribed)] };
}

/** One condition (a leaf or a group) read as a clause, for the builder. */
export function conditionClause(node: unknown, ctx: SentenceContext): Sentence {
  const reader = new Reader(ctx);
  const text = reader.node(node);
  return { text, undescribed: [...new Set(reader.undescribed)] };
}
