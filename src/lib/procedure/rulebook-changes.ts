/**
 * The differences between two rulebook versions as a clerk reads them: motions added and removed,
 * motions re-ranked ("Lay on the table now ranks above Previous question"), characteristics changed
 * old → new, rules added, removed or changed as sentences (rule-sentence.ts), thresholds and
 * deadlines old → new ("Filing deadline: 48 hours → 24 hours"), each with its citation. The raw
 * field-by-field diff stays in src/lib/server/rulebook-diff.ts.
 *
 * Works on documents as stored: each is read with parseRulebook (ranks resolved from chains); a
 * document that no longer parses is compared as written. Pure: no I/O.
 */
import { CLASS_LABELS, RECONSIDERABLE_LABELS, thresholdWords } from "./fact-descriptions.ts";
import { parseRulebook } from "./parse-rulebook.ts";
import { precedenceView } from "./precedence-order.ts";
import { ruleSentence, sentenceContext } from "./rule-sentence.ts";

export type ChangeSection = "rulebook" | "motions" | "precedence" | "rules" | "amendments" | "voting";

export interface PlainChange {
  section: ChangeSection;
  kind: "added" | "removed" | "changed" | "re-ranked";
  /** What changed, in words: "Filing deadline", "Limit debate — vote required", "Rule". */
  what: string;
  /** Old and new, in words (absent for additions and removals). */
  from?: string;
  to?: string;
  /** For additions and removals: the motion's name or the rule's sentence. */
  text?: string;
  citation?: string;
}

type Doc = Record<string, unknown>;
type Motion = { id: string; name: string; citation?: string; rank: number | null } & Record<string, unknown>;
type Rule = { id: string; scope: string; conditions: unknown; citation?: string; message?: string; severity?: string } & Record<string, unknown>;

const asDoc = (v: unknown): Doc => (v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Doc) : {});

function read(v: unknown): Doc {
  try {
    return parseRulebook(v) as unknown as Doc;
  } catch {
    return asDoc(v);
  }
}

/** JSON text with sorted keys, so key order is never a change. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v !== null && typeof v === "object") {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o).filter((k) => o[k] !== undefined).sort().map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`).join(",")}}`;
  }
  return JSON.stringify(v ?? null);
}
const same = (a: unknown, b: unknown) => canonical(a) === canonical(b);

/** "passageThreshold" → "passage threshold". */
const humanize = (key: string) => key.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();

/** Any value in words, for fields without their own wording. */
export function valueWords(v: unknown): string {
  if (v === null || v === undefined) return "none";
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (typeof v === "number") return String(v);
  if (typeof v === "string") return v.replace(/-/g, " ");
  if (Array.isArray(v)) return v.length ? v.map(valueWords).join(", ") : "none";
  const o = v as Record<string, unknown>;
  return Object.keys(o)
    .filter((k) => k !== "citation" && o[k] !== undefined)
    .map((k) => `${humanize(k)} ${valueWords(o[k])}`)
    .join(", ");
}

const MOTION_FIELDS: Record<string, { label: string; words?: (v: unknown) => string }> = {
  name: { label: "name" },
  class: { label: "class", words: (v) => CLASS_LABELS[String(v)] ?? valueWords(v) },
  second: { label: "needs a second" },
  debatable: { label: "debatable" },
  debatableFollowsTarget: { label: "debatable when the question it applies to is" },
  amendable: { label: "can be amended" },
  vote: { label: "vote required", words: (v) => thresholdWords(String(v)) },
  interrupt: { label: "may interrupt a speaker" },
  reconsiderable: { label: "which vote may be reconsidered", words: (v) => RECONSIDERABLE_LABELS[typeof v === "boolean" ? (v ? "both" : "neither") : String(v)] ?? valueWords(v) },
  window: { label: "time allowed after the vote", words: (v) => windowWords(v) },
  voteAlternatives: { label: "other thresholds", words: (v) => (Array.isArray(v) && v.length ? v.map((a) => `${thresholdWords(String(asDoc(a).vote))} ${asDoc(a).kind === "instead" ? "instead" : "also"} if ${String(asDoc(a).if)}`).join("; ") : "none") },
  variants: { label: "characteristics that depend on the floor", words: (v) => (Array.isArray(v) && v.length ? `${v.length} case${v.length === 1 ? "" : "s"}: ${v.map((x) => (asDoc(x).note as string) ?? valueWords(asDoc(x).set)).join("; ")}` : "none") },
  citation: { label: "citation" },
  note: { label: "note" },
};

function windowWords(v: unknown): string {
  const w = asDoc(v);
  const parts: string[] = [];
  if (typeof w.days === "number") parts.push(w.days === 0 ? "the same day" : `${w.days} day${w.days === 1 ? "" : "s"}`);
  if (typeof w.sittings === "number") parts.push(w.sittings === 0 ? "the same sitting" : `${w.sittings} sitting${w.sittings === 1 ? "" : "s"}`);
  return parts.length ? parts.join(" or ") : "no limit";
}

const hours = (v: unknown) => {
  const d = asDoc(v);
  return typeof d.hoursBefore === "number" ? `${d.hoursBefore} hour${d.hoursBefore === 1 ? "" : "s"}` : "none";
};
const limit = (v: unknown) => (v === null || v === undefined ? "no limit" : valueWords(v));

const AMENDMENT_FIELDS: Record<string, { label: string; words?: (v: unknown) => string; citation?: (a: Doc) => unknown }> = {
  filingDeadline: { label: "Filing deadline", words: hours, citation: (a) => asDoc(a.filingDeadline).citation },
  maxDegree: { label: "Highest degree of amendment" },
  pendingPerSlot: { label: "Amendments pending at once in one place", words: limit },
  maxPending: { label: "Amendments pending at once on a measure", words: limit },
  minSponsors: { label: "Sponsors required" },
  forms: { label: "Forms of amendment allowed" },
  germaneness: { label: "Germaneness test", words: (v) => ({ subjects: "by subjects", section: "by section", committee: "by committee", none: "none" })[String(asDoc(v).test)] ?? valueWords(v), citation: (a) => asDoc(a.germaneness).citation },
  substituteSlot: { label: "A substitute has its own place" },
  substituteForAmendment: { label: "A substitute for an amendment counts as first degree" },
  perfectingUnderSubstitute: { label: "An amendment made under a pending substitute is of the", words: (v) => valueWords(v) },
  motion: { label: "Motion to amend" },
  citation: { label: "Citation for the amendment rules" },
};

const VOTING_FIELDS: Record<string, { label: string; words?: (v: unknown) => string }> = {
  procedure: { label: "Voting procedure", words: (v) => (v === "successive" ? "successive procedure" : v === "amendment" ? "amendment procedure" : valueWords(v)) },
  constraints: { label: "Rules on the order of votes" },
  amendmentThreshold: { label: "Vote an amendment needs", words: (v) => (v ? thresholdWords(v) : "a majority") },
  passageThreshold: { label: "Vote for final passage", words: (v) => (v ? thresholdWords(v) : "the main motion's vote") },
  quorum: { label: "Quorum", words: (v) => { const q = asDoc(v); return q.kind === "number" ? `${valueWords(q.value)} members` : q.kind === "majority-of-members" ? "a majority of the members" : q.kind === "fraction" ? `${valueWords(q.numerator)}/${valueWords(q.denominator)} of the members` : q.kind === "none" ? "none" : valueWords(v); } },
  tieRule: { label: "Tie rule", words: (v) => ({ "motion-fails": "a tie defeats the motion", "chair-casting-vote": "the chair votes only to break a tie", "chair-votes": "the chair votes on every question", "chair-may-make-or-break-tie": "the chair may vote to make or break a tie" })[String(v)] ?? valueWords(v) },
  citation: { label: "Citation for the voting rules" },
};

function sectionChanges(section: ChangeSection, a: Doc, b: Doc, fields: Record<string, { label: string; words?: (v: unknown) => string; citation?: (d: Doc) => unknown }>, citation: unknown): PlainChange[] {
  const out: PlainChange[] = [];
  const keys = [...new Set([...Object.keys(fields), ...Object.keys(a), ...Object.keys(b)])];
  for (const k of keys) {
    if (same(a[k], b[k])) continue;
    const f = fields[k] ?? { label: humanize(k).replace(/^./, (c) => c.toUpperCase()) };
    const words = f.words ?? valueWords;
    const cite = f.citation?.(b) ?? f.citation?.(a) ?? citation;
    out.push({ section, kind: "changed", what: f.label, from: words(a[k]), to: words(b[k]), ...(typeof cite === "string" && k !== "citation" ? { citation: cite } : {}) });
  }
  return out;
}

/** Who now ranks above or below whom: one line per motion that moved, naming the motions it passed. */
function rankChanges(a: Motion[], b: Motion[], docA: Doc, docB: Doc): PlainChange[] {
  const va = precedenceView({ motions: a, precedence: docA.precedence as (string | string[])[][] | undefined });
  const vb = precedenceView({ motions: b, precedence: docB.precedence as (string | string[])[][] | undefined });
  const pos = (v: typeof va) => new Map(v.tiers.flatMap((t, i) => t.map((id) => [id, i] as const)));
  const pa = pos(va);
  const pb = pos(vb);
  const nameB = new Map(b.map((m) => [m.id, m]));
  const out: PlainChange[] = [];
  const relation = (x: number, y: number) => (x < y ? "above" : x > y ? "below" : "equal with");
  const ids = [...pb.keys()].filter((id) => pa.has(id));
  const moved = new Map<string, Map<string, { was: string; now: string }>>();
  for (let i = 0; i < ids.length; i++) {
    for (let j = i + 1; j < ids.length; j++) {
      const [x, y] = [ids[i], ids[j]];
      const was = relation(pa.get(x)!, pa.get(y)!);
      const now = relation(pb.get(x)!, pb.get(y)!);
      if (was === now) continue;
      // Attribute the change to the motion that moved further (ties: the one that rose).
      const dx = Math.abs(pb.get(x)! - pa.get(x)!);
      const dy = Math.abs(pb.get(y)! - pa.get(y)!);
      const xMoved = dx > dy || (dx === dy && pb.get(x)! - pa.get(x)! < 0);
      const [mover, other] = xMoved ? [x, y] : [y, x];
      const w = xMoved ? was : relation(pa.get(y)!, pa.get(x)!);
      const n = xMoved ? now : relation(pb.get(y)!, pb.get(x)!);
      if (!moved.has(mover)) moved.set(mover, new Map());
      moved.get(mover)!.set(other, { was: w, now: n });
    }
  }
  for (const [id, others] of moved) {
    const groups = new Map<string, string[]>();
    for (const [o, r] of others) groups.set(`${r.now}|${r.was}`, [...(groups.get(`${r.now}|${r.was}`) ?? []), nameB.get(o)?.name ?? o]);
    for (const [key, names] of groups) {
      const [now, was] = key.split("|");
      const list = names.length <= 1 ? names[0] : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
      const m = nameB.get(id)!;
      out.push({ section: "precedence", kind: "re-ranked", what: m.name, from: `${was} ${list}`, to: `${now === "equal with" ? "of equal rank with" : `ranks ${now}`} ${list}`, ...(m.citation ? { citation: m.citation } : {}) });
    }
  }
  for (const m of b) {
    if (!a.some((x) => x.id === m.id)) continue;
    const r = pa.has(m.id);
    const s = pb.has(m.id);
    if (r && !s) out.push({ section: "precedence", kind: "re-ranked", what: m.name, from: `ranked ${pa.get(m.id)! + 1} of ${va.tiers.length}`, to: "unranked", ...(m.citation ? { citation: m.citation } : {}) });
    if (!r && s) out.push({ section: "precedence", kind: "re-ranked", what: m.name, from: "unranked", to: `ranked ${pb.get(m.id)! + 1} of ${vb.tiers.length}`, ...(m.citation ? { citation: m.citation } : {}) });
  }
  return out;
}

export function describeChanges(before: unknown, after: unknown): PlainChange[] {
  const a = read(before);
  const b = read(after);
  const out: PlainChange[] = [];
  for (const [k, label] of [["title", "Title"], ["id", "Rulebook identifier"], ["version", "Edition"]] as const) {
    if (!same(a[k], b[k])) out.push({ section: "rulebook", kind: "changed", what: label, from: valueWords(a[k]), to: valueWords(b[k]) });
  }
  out.push(...sectionChanges("rulebook", asDoc(a.chamber), asDoc(b.chamber), { name: { label: "Chamber" }, members: { label: "Members" }, kind: { label: "Kind of chamber" } }, undefined));
  out.push(...sectionChanges("rulebook", asDoc(a.source), asDoc(b.source), { title: { label: "Source" }, edition: { label: "Edition of the source" } }, undefined));

  const ma = (Array.isArray(a.motions) ? a.motions : []) as Motion[];
  const mb = (Array.isArray(b.motions) ? b.motions : []) as Motion[];
  for (const m of mb) if (!ma.some((x) => x.id === m.id)) out.push({ section: "motions", kind: "added", what: "Motion added", text: m.name, ...(m.citation ? { citation: m.citation } : {}) });
  for (const m of ma) if (!mb.some((x) => x.id === m.id)) out.push({ section: "motions", kind: "removed", what: "Motion removed", text: m.name, ...(m.citation ? { citation: m.citation } : {}) });
  for (const m of mb) {
    const o = ma.find((x) => x.id === m.id);
    if (!o) continue;
    for (const [k, f] of Object.entries(MOTION_FIELDS)) {
      if (same(o[k] ?? null, m[k] ?? null)) continue;
      if (k === "debatableFollowsTarget" && !o[k] === !m[k]) continue;
      const words = f.words ?? valueWords;
      out.push({ section: "motions", kind: "changed", what: `${m.name} — ${f.label}`, from: words(o[k]), to: words(m[k]), ...(m.citation && k !== "citation" ? { citation: m.citation } : {}) });
    }
  }
  out.push(...rankChanges(ma, mb, a, b));

  const ctxA = sentenceContext({ motions: ma });
  const ctxB = sentenceContext({ motions: mb });
  const ra = (Array.isArray(a.rules) ? a.rules : []) as Rule[];
  const rb = (Array.isArray(b.rules) ? b.rules : []) as Rule[];
  for (const r of rb) if (!ra.some((x) => x.id === r.id)) out.push({ section: "rules", kind: "added", what: "Rule added", text: ruleSentence(r, ctxB).text, ...(r.citation ? { citation: r.citation } : {}) });
  for (const r of ra) if (!rb.some((x) => x.id === r.id)) out.push({ section: "rules", kind: "removed", what: "Rule removed", text: ruleSentence(r, ctxA).text, ...(r.citation ? { citation: r.citation } : {}) });
  for (const r of rb) {
    const o = ra.find((x) => x.id === r.id);
    if (!o || same(o, r)) continue;
    const before = ruleSentence(o, ctxA).text;
    const now = ruleSentence(r, ctxB).text;
    const cite = r.citation ? { citation: r.citation } : {};
    if (before !== now || !same(o.conditions, r.conditions) || o.scope !== r.scope || o.severity !== r.severity) out.push({ section: "rules", kind: "changed", what: "Rule changed", from: before, to: now === before ? `${now} (conditions rewritten, same reading)` : now, ...cite });
    if (o.message !== r.message) out.push({ section: "rules", kind: "changed", what: `Message of the rule “${now}”`, from: String(o.message ?? ""), to: String(r.message ?? ""), ...cite });
    if (o.citation !== r.citation) out.push({ section: "rules", kind: "changed", what: `Citation of the rule “${now}”`, from: String(o.citation ?? ""), to: String(r.citation ?? "") });
    for (const k of ["priority", "code", "related"]) if (!same(o[k], r[k])) out.push({ section: "rules", kind: "changed", what: `${humanize(k).replace(/^./, (c) => c.toUpperCase())} of the rule “${now}”`, from: valueWords(o[k]), to: valueWords(r[k]), ...cite });
  }

  const aa = asDoc(a.amendments);
  const ab = asDoc(b.amendments);
  out.push(...sectionChanges("amendments", aa, ab, AMENDMENT_FIELDS, ab.citation ?? aa.citation));
  const va = asDoc(a.voting);
  const vb = asDoc(b.voting);
  out.push(...sectionChanges("voting", va, vb, VOTING_FIELDS, vb.citation ?? va.citation));
  return out;
}

/** One line: "Filing deadline: 48 hours → 24 hours (SO 64)". */
export function changeLine(c: PlainChange): string {
  const body = c.from !== undefined || c.to !== undefined ? `${c.what}: ${c.from ?? "—"} → ${c.to ?? "—"}` : `${c.what}: ${c.text ?? ""}`;
  return c.citation ? `${body} (${c.citation})` : body;
}
