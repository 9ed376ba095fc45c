import type { ReactNode } from "react";
import { AMENDMENT_FORMS } from "../../lib/amendments/case-schema.ts";
import { lineRangeFromText } from "../../lib/amendments/line-range-text.ts";
import { FORM_LABELS } from "../../lib/measures/measure-schemas.ts";
import SponsorsField from "./SponsorsField.tsx";
import { tags } from "./tags.ts";

export interface AmendmentDefaults {
  form: (typeof AMENDMENT_FORMS)[number];
  target: string;
  lines: string;
  title: string;
  committee: string;
  text: string;
  subjects: string;
  sponsors: string[];
}

interface Props {
  /** Prefix of every field's id: "fa" when filing, "ae" when editing. */
  prefix: string;
  sections: Array<{ id: string; heading: string; lines: number }>;
  /** The amendments this one may amend. */
  amendments: Array<{ key: string; title: string }>;
  legislators: Array<{ id: string; name: string; bloc: string }>;
  defaults: AmendmentDefaults;
  errors: Record<string, string>;
  /** Stands where the typed text would (an upload instead). */
  text?: ReactNode;
}

/** The fields of an amendment, the same whether it is being filed or edited. */
export default function AmendmentFields({ prefix, sections, amendments, legislators, defaults, errors, text }: Props) {
  const id = (k: string) => `${prefix}-${k}`;
  const err = (k: string) => errors[k] && <p className="gw-error" id={`${id(k)}-err`}>{errors[k]}</p>;
  const describedBy = (k: string) => (errors[k] ? `${id(k)}-err` : undefined);
  return (
    <>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor={id("form")} className="gw-label">Form</label>
          <select id={id("form")} name="form" className="gw-input" defaultValue={defaults.form}>
            {AMENDMENT_FORMS.map((f) => <option key={f} value={f}>{FORM_LABELS[f]}</option>)}
          </select>
          {err("form")}
        </div>
        <div>
          <label htmlFor={id("target")} className="gw-label">Amends</label>
          <select id={id("target")} name="target" className="gw-input" defaultValue={defaults.target} aria-describedby={describedBy("target")}>
            <option value="measure">The whole measure</option>
            <optgroup label="Sections">{sections.map((s) => <option key={s.id} value={s.id}>§ {s.id} {s.heading} ({s.lines} lines)</option>)}</optgroup>
            {amendments.length > 0 && <optgroup label="Amendments">{amendments.map((a) => <option key={a.key} value={a.key}>{a.key} {a.title}</option>)}</optgroup>}
          </select>
          {err("target")}
        </div>
        <div>
          <label htmlFor={id("lines")} className="gw-label">Lines (sections only)</label>
          <input id={id("lines")} name="lines" className="gw-input" defaultValue={defaults.lines} placeholder="e.g. 2-3" aria-describedby={describedBy("lines")} />
          {err("lines")}
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={id("title")} className="gw-label">Short title</label>
          <input id={id("title")} name="title" className="gw-input" maxLength={500} defaultValue={defaults.title} />
        </div>
        <div>
          <label htmlFor={id("committee")} className="gw-label">Committee of jurisdiction (if not the measure's)</label>
          <input id={id("committee")} name="committee" className="gw-input" maxLength={200} defaultValue={defaults.committee} />
          {err("committee")}
        </div>
      </div>
      {text ?? (
        <div>
          <label htmlFor={id("text")} className="gw-label">Text of the amendment</label>
          <textarea id={id("text")} name="text" rows={4} className="gw-input" defaultValue={defaults.text} />
          {err("text")}
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={id("subjects")} className="gw-label">Subject tags</label>
          <input id={id("subjects")} name="subjects" className="gw-input" defaultValue={defaults.subjects} placeholder="lighting, safety" />
          <p className="gw-hint">Comma-separated. Germaneness is judged on these.</p>
          {err("subjects")}
        </div>
        <SponsorsField id={id("sponsors")} size={5} legislators={legislators} defaultValue={defaults.sponsors} error={errors.sponsors} />
      </div>
    </>
  );
}

/** What the fields hold, as the API takes them; null when the lines are neither a line nor a range. */
export function readAmendmentFields(fd: FormData) {
  const lines = lineRangeFromText(String(fd.get("lines") ?? ""));
  if (lines === "invalid") return null;
  return {
    form: fd.get("form"),
    target: fd.get("target"),
    lines,
    title: String(fd.get("title") ?? "").trim() || null,
    text: String(fd.get("text") ?? ""),
    subjects: tags(String(fd.get("subjects") ?? "")),
    sponsors: fd.getAll("sponsors").map(String),
    committee: String(fd.get("committee") ?? "").trim() || null,
  };
}

export const LINES_HINT = "write a line or a range such as 3-7";
