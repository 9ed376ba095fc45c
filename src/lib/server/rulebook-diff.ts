/**
 * A readable comparison of two rulebook documents, section by section: motions and rules
 * matched by id (added, removed, or changed with the fields that differ), the amendment and
 * voting sections and the metadata field by field. Used by the compare page and by the 409
 * answer to a stale save ("what changed since the version you started from").
 * Pure; works on the JSON documents as stored, so key order never counts as a change.
 */

import { canonicalJson } from "../text/canonical-json.ts";

export const DIFF_SECTIONS = ["metadata", "chamber", "source", "motions", "precedence", "amendments", "voting", "rules"] as const;
export type DiffSection = (typeof DIFF_SECTIONS)[number];

export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface ItemChange {
  kind: "added" | "removed" | "changed";
  id: string;
  name?: string;
  fields: FieldChange[];
}

export interface SectionDiff {
  section: DiffSection;
  changes: ItemChange[];
}

export interface RulebookDiff {
  identical: boolean;
  sections: SectionDiff[];
  /** One line per changed section, e.g. "motions: changed amend (vote); added recess". */
  summary: string[];
}

type Doc = Record<string, unknown>;

const same = (a: unknown, b: unknown) => canonicalJson(a) === canonicalJson(b);
const asDoc = (v: unknown): Doc => (v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Doc) : {});

function fieldChanges(a: Doc, b: Doc, keys?: string[]): FieldChange[] {
  const all = keys ?? [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  return all.filter((k) => !same(a[k], b[k])).map((k) => ({ field: k, from: a[k] ?? null, to: b[k] ?? null }));
}

function byId(list: unknown): Map<string, Doc> {
  const out = new Map<string, Doc>();
  if (Array.isArray(list)) for (const item of list) {
    const d = asDoc(item);
    if (typeof d.id === "string") out.set(d.id, d);
  }
  return out;
}

function listDiff(a: unknown, b: unknown): ItemChange[] {
  const from = byId(a);
  const to = byId(b);
  const out: ItemChange[] = [];
  for (const [id, d] of from) {
    const n = to.get(id);
    const name = typeof (n ?? d).name === "string" ? String((n ?? d).name) : undefined;
    if (!n) out.push({ kind: "removed", id, name, fields: [] });
    else {
      const fields = fieldChanges(d, n);
      if (fields.length) out.push({ kind: "changed", id, name, fields });
    }
  }
  for (const [id, d] of to) if (!from.has(id)) out.push({ kind: "added", id, name: typeof d.name === "string" ? d.name : undefined, fields: [] });
  // Same ids, different order: the catalogue order is what the legal-moves list follows.
  const fromOrder = [...from.keys()].filter((k) => to.has(k));
  const toOrder = [...to.keys()].filter((k) => from.has(k));
  if (!same(fromOrder, toOrder)) out.push({ kind: "changed", id: "(order)", fields: [{ field: "order", from: fromOrder, to: toOrder }] });
  return out;
}

function sectionDiff(a: unknown, b: unknown, id: string): ItemChange[] {
  const fields = fieldChanges(asDoc(a), asDoc(b));
  return fields.length ? [{ kind: "changed", id, fields }] : [];
}

export function diffRulebooks(before: unknown, after: unknown): RulebookDiff {
  const a = asDoc(before);
  const b = asDoc(after);
  const sections: SectionDiff[] = [
    { section: "metadata", changes: (() => { const f = fieldChanges(a, b, ["id", "title", "version", "format", "formatVersion"]); return f.length ? [{ kind: "changed" as const, id: "metadata", fields: f }] : []; })() },
    { section: "chamber", changes: sectionDiff(a.chamber, b.chamber, "chamber") },
    { section: "source", changes: sectionDiff(a.source, b.source, "source") },
    { section: "motions", changes: listDiff(a.motions, b.motions) },
    { section: "precedence", changes: same(a.precedence ?? [], b.precedence ?? []) ? [] : [{ kind: "changed", id: "precedence", fields: [{ field: "chains", from: a.precedence ?? [], to: b.precedence ?? [] }] }] },
    { section: "amendments", changes: sectionDiff(a.amendments, b.amendments, "amendments") },
    { section: "voting", changes: sectionDiff(a.voting, b.voting, "voting") },
    { section: "rules", changes: listDiff(a.rules, b.rules) },
  ].filter((s) => s.changes.length > 0) as SectionDiff[];
  const summary = sections.map((s) => {
    const parts = (["changed", "added", "removed"] as const)
      .map((kind) => {
        const items = s.changes.filter((c) => c.kind === kind);
        if (!items.length) return "";
        return `${kind} ${items.map((c) => (kind === "changed" && c.fields.length && (s.section === "motions" || s.section === "rules") ? `${c.id} (${c.fields.map((f) => f.field).join(", ")})` : kind === "changed" && s.section !== "motions" && s.section !== "rules" ? c.fields.map((f) => f.field).join(", ") : c.id)).join("; ")}`;
      })
      .filter(Boolean);
    return `${s.section}: ${parts.join("; ")}`;
  });
  return { identical: sections.length === 0, sections, summary };
}
