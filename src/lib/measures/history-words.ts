/**
 * The History of a measure in the clerk's words: field names as labels, values as a person reads
 * them (sponsors by name, statuses and forms in words, times in the chamber's format, no ids),
 * and the action without finding codes. Pure: the page passes the names and the date format.
 */
import { fieldWords } from "../text/field-words.ts";
import { formLabel, statusLabel } from "./measure-schemas.ts";

const LABELS: Record<string, string> = {
  number: "Number",
  title: "Title",
  committee: "Committee",
  status: "Status",
  subjects: "Subjects",
  sponsors: "Sponsors",
  sittingAt: "On the floor at",
  sections: "Sections",
  attachmentId: "Attached document",
  form: "Form",
  targetKind: "Amends",
  targetSection: "Section amended",
  targetAmendmentId: "Amendment amended",
  lines: "Lines",
  text: "Text",
  filedAt: "Filed",
  amendment: "Amendment",
  code: "Finding",
  rulingRef: "Ruling relied on",
  rulingId: "Linked ruling",
  note: "Note",
};

export interface HistoryContext {
  entity: string;
  /** Legislators' and amendments' names by id. */
  names: ReadonlyMap<string, string>;
  when: (iso: string) => string;
}

export function historyFieldLabel(field: string): string {
  return LABELS[field] ?? fieldWords(field);
}

/** A finding code as words ("not-germane" → "not germane"): the codes stay in the API and the CLI. */
export const findingWords = (code: string) => code.replace(/-/g, " ");

export function historyValue(field: string, value: unknown, ctx: HistoryContext): string {
  if (value === null || value === undefined || value === "" || (Array.isArray(value) && value.length === 0)) return "none";
  switch (field) {
    case "status":
      return statusLabel(ctx.entity === "measure" ? "measure" : "amendment", String(value));
    case "form":
      return formLabel(String(value));
    case "sponsors":
      return Array.isArray(value) ? value.map((id) => ctx.names.get(String(id)) ?? "a former member").join(", ") : "none";
    case "sittingAt":
    case "filedAt":
      return ctx.when(String(value));
    case "targetKind":
      return value === "measure" ? "the whole measure" : value === "section" ? "a section" : "an amendment";
    case "targetAmendmentId":
      return ctx.names.get(String(value)) ?? "an amendment";
    case "attachmentId":
      return "a document";
    case "rulingId":
      return "an issued ruling";
    case "code":
      return findingWords(String(value));
    case "lines":
      return Array.isArray(value) ? `${value[0]}–${value[1]}` : String(value);
    case "sections":
      return Array.isArray(value) ? value.map((s) => { const x = s as { id?: string; heading?: string }; return `§ ${x.id ?? "?"}${x.heading ? ` (${x.heading})` : ""}`; }).join(", ") : String(value);
    case "text": {
      const t = String(value);
      return t.length > 300 ? `${t.slice(0, 300)}…` : t;
    }
  }
  if (Array.isArray(value)) return value.map(String).join(", ");
  if (typeof value === "object") return "changed";
  return String(value);
}

/** What was done, in words: "Amendment · filed A3", "Override · overrode the finding “not germane” on A4". */
export function historyAction(entity: string, action: string): string {
  const what = entity === "measure" ? "Measure" : entity === "amendment" ? "Amendment" : entity === "override" ? "Override" : fieldWords(entity);
  const overrode = /^overrode (\S+) on (\S+)$/.exec(action);
  if (overrode) return `${what} · overrode the finding “${findingWords(overrode[1])}” on ${overrode[2]}`;
  const revoked = /^revoked override of (\S+) on (\S+)$/.exec(action);
  if (revoked) return `${what} · revoked the override of the finding “${findingWords(revoked[1])}” on ${revoked[2]}`;
  return `${what} · ${action}`;
}
