/**
 * Links between a rulebook and the chamber's own text: which items of the rulebook (motions, rules,
 * thresholds, the amendment and voting sections) say which clause they encode (`clause` fields,
 * docs/rulebook-format.md "Links to the chamber's text"), and the coverage a clerk reviews — the
 * clauses no item cites, the items that cite no clause, and links to clauses the text does not have.
 *
 * A clause counts as cited when it, a clause it is part of, or a clause that is part of it is linked:
 * a link to "Rule XVI, clause 4" covers 4(a) and 4(b), and a link to 4(a) covers clause 4 and Rule XVI
 * as headings. Pure: no I/O.
 */
import type { Rulebook } from "../procedure/rulebook-schema.ts";
import type { Clause } from "./split-clauses.ts";

export type LinkKind = "motion" | "rule" | "threshold" | "section";

/** One item of a rulebook that can be linked to a clause. */
export interface LinkableItem {
  /** Where the `clause` field is, as a path into the rulebook ("motions.3.clause"). */
  path: string;
  kind: LinkKind;
  /** The item in the clerk's words: the motion's name, the rule's message, "Threshold for adopting amendments". */
  label: string;
  citation: string | null;
  clause: string | null;
}

const THRESHOLD_WORDS: Record<string, string> = {
  majority: "a majority",
  "two-thirds": "two-thirds",
  "majority-of-members": "a majority of the members",
  none: "no vote",
  "two-thirds-of-members": "two-thirds of the members",
  "three-fifths-of-members": "three-fifths of the members",
  "two-thirds-of-present": "two-thirds of those present",
};
const thresholdWords = (t: unknown) => (typeof t === "string" ? (THRESHOLD_WORDS[t] ?? t) : t && typeof t === "object" && "value" in t ? `${String((t as { value: unknown }).value)} votes` : "the main motion's threshold");

const PLACEHOLDER_WORDS: Record<string, string> = {
  motion: "the motion",
  immediatelyPending: "the immediately pending question",
  amendTarget: "the question amended",
  lastVote: "the vote",
  amendment: "the amendment",
  target: "the text amended",
};

/** A rule's message for a list: its "{fact.field}" placeholders read as words ("{motion.name}" → "the motion"). */
export function messageInWords(message: string): string {
  return message.replace(/\{([A-Za-z_][A-Za-z0-9_]*)(?:\.[A-Za-z0-9_.]+)?\}/g, (_w, fact: string) => PLACEHOLDER_WORDS[fact] ?? "…").replace(/"(the [a-z ]+)"/g, "$1").replace(/^t/, "T");
}

/** Every item of `rulebook` that may carry a clause link, in rulebook order. */
export function linkableItems(rulebook: Rulebook): LinkableItem[] {
  const out: LinkableItem[] = [];
  rulebook.motions.forEach((m, i) => {
    out.push({ path: `motions.${i}.clause`, kind: "motion", label: m.name, citation: m.citation, clause: m.clause ?? null });
    if (m.voteClause !== undefined) out.push({ path: `motions.${i}.voteClause`, kind: "threshold", label: `${m.name}: adopted by ${thresholdWords(m.vote)}`, citation: m.citation, clause: m.voteClause });
    (m.voteAlternatives ?? []).forEach((a, k) => out.push({ path: `motions.${i}.voteAlternatives.${k}.clause`, kind: "threshold", label: `${m.name}: ${thresholdWords(a.vote)} ${a.kind === "or" ? "also suffices" : "instead"} when ${a.if}`, citation: a.citation, clause: a.clause ?? null }));
  });
  rulebook.rules.forEach((r, i) => out.push({ path: `rules.${i}.clause`, kind: "rule", label: messageInWords(r.message), citation: r.citation, clause: r.clause ?? null }));
  out.push({ path: "amendments.clause", kind: "section", label: "Amendments: forms, degrees and germaneness", citation: rulebook.amendments.citation, clause: rulebook.amendments.clause ?? null });
  if (rulebook.amendments.filingDeadline) {
    const d = rulebook.amendments.filingDeadline;
    out.push({ path: "amendments.filingDeadline.clause", kind: "threshold", label: `Filing deadline: ${d.hoursBefore} hours before the sitting`, citation: d.citation, clause: d.clause ?? null });
  }
  const v = rulebook.voting;
  out.push({ path: "voting.clause", kind: "section", label: "Voting: the order of questions and ties", citation: v.citation, clause: v.clause ?? null });
  out.push({ path: "voting.amendmentThresholdClause", kind: "threshold", label: `Amendments are adopted by ${thresholdWords(v.amendmentThreshold)}`, citation: v.citation, clause: v.amendmentThresholdClause ?? null });
  if (v.passageThreshold !== undefined || v.passageThresholdClause !== undefined) out.push({ path: "voting.passageThresholdClause", kind: "threshold", label: `Final passage by ${thresholdWords(v.passageThreshold)}`, citation: v.citation, clause: v.passageThresholdClause ?? null });
  out.push({ path: "voting.quorum.clause", kind: "threshold", label: "Quorum", citation: v.quorum.citation ?? null, clause: v.quorum.clause ?? null });
  return out;
}

export interface Coverage {
  /** Clauses no item cites (directly, or through a clause above or below it). */
  uncitedClauses: Clause[];
  /** Motions and rules that cite no clause (thresholds and sections are listed only when linked elsewhere). */
  itemsWithoutClause: LinkableItem[];
  /** Items linked to a clause key the text does not have. */
  brokenLinks: LinkableItem[];
  /** Items linked to a clause that exists. */
  linked: Array<LinkableItem & { clauseLabel: string }>;
  counts: { clauses: number; citedClauses: number; items: number; linkedItems: number };
}

export function clauseCoverage(rulebook: Rulebook, clauses: readonly Clause[]): Coverage {
  const byKey = new Map(clauses.map((c) => [c.key, c]));
  const items = linkableItems(rulebook);
  const linkedKeys = new Set(items.map((i) => i.clause).filter((k): k is string => k !== null && byKey.has(k)));
  const cited = new Set<string>();
  for (const key of linkedKeys) {
    // The clause and everything above it…
    for (let k: string | null = key; k !== null; k = byKey.get(k)?.parent ?? null) cited.add(k);
  }
  // …and everything below a linked clause.
  for (const c of clauses) {
    for (let p: string | null = c.parent; p !== null; p = byKey.get(p)?.parent ?? null) {
      if (linkedKeys.has(p)) {
        cited.add(c.key);
        break;
      }
    }
  }
  const brokenLinks = items.filter((i) => i.clause !== null && !byKey.has(i.clause));
  const linked = items.filter((i) => i.clause !== null && byKey.has(i.clause)).map((i) => ({ ...i, clauseLabel: byKey.get(i.clause!)!.label }));
  return {
    uncitedClauses: clauses.filter((c) => !cited.has(c.key)),
    itemsWithoutClause: items.filter((i) => i.clause === null && (i.kind === "motion" || i.kind === "rule")),
    brokenLinks,
    linked,
    counts: { clauses: clauses.length, citedClauses: cited.size, items: items.length, linkedItems: linked.length },
  };
}

/**
 * Set (or clear, with null) the clause link at `path` in a rulebook document as written (the JSON a
 * version stores), returning a new document. `path` must be one of linkableItems' paths for the parsed
 * document; the caller checks that. Pure.
 */
export function setClauseLink(document: Record<string, unknown>, path: string, clause: string | null): Record<string, unknown> {
  const copy = structuredClone(document);
  const steps = path.split(".");
  const field = steps.pop()!;
  let node: unknown = copy;
  for (const s of steps) {
    const parent = node as Record<string, unknown>;
    // A section written out by its defaults (voting.quorum) is created to hold the link.
    if (parent[s] === undefined || parent[s] === null) parent[s] = s === "quorum" ? { kind: "majority-of-members" } : {};
    node = parent[s];
  }
  const target = node as Record<string, unknown>;
  if (clause === null) delete target[field];
  else target[field] = clause;
  return copy;
}
