import type { ReactNode } from "react";
import { AMENDMENT_FORMS } from "../../lib/amendments/case-schema.ts";
import { lineRangeFromText } from "../../lib/amendments/line-range-text.ts";
import { FORM_LABELS } from "../../lib/measures/measure-schemas.ts";
import { Field, TextField, type IssueLookup } from "../shared/fields.tsx";
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
  at: IssueLookup;
  /** Stands where the typed text would (an upload instead). */
  text?: ReactNode;
}

/** The fields of an amendment, the same whether it is being filed or edited. */
export default function AmendmentFields({ prefix, sections, amendments, legislators, defaults, at, text }: Props) {
  const id = (k: string) => `${prefix}-${k}`;
  return (
    <>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id={id("form")} path="form" label="Form" at={at} control={(attrs) => (
          <select {...attrs} name="form" className="gw-input" defaultValue={defaults.form}>
            {AMENDMENT_FORMS.map((f) => <option key={f} value={f}>{FORM_LABELS[f]}</option>)}
          </select>
        )} />
        <Field id={id("target")} path="target" label="Amends" at={at} control={(attrs) => (
          <select {...attrs} name="target" className="gw-input" defaultValue={defaults.target}>
            <option value="measure">The whole measure</option>
            <optgroup label="Sections">{sections.map((s) => <option key={s.id} value={s.id}>§ {s.id} {s.heading} ({s.lines} lines)</option>)}</optgroup>
            {amendments.length > 0 && <optgroup label="Amendments">{amendments.map((a) => <option key={a.key} value={a.key}>{a.key} {a.title}</option>)}</optgroup>}
          </select>
        )} />
        <TextField id={id("lines")} path="lines" name="lines" label="Lines (sections only)" at={at} defaultValue={defaults.lines} placeholder="e.g. 2-3" />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id={id("title")} path="title" name="title" label="Short title" at={at} maxLength={500} defaultValue={defaults.title} />
        <TextField id={id("committee")} path="committee" name="committee" label="Committee of jurisdiction (if not the measure's)" at={at} maxLength={200} defaultValue={defaults.committee} />
      </div>
      {text ?? <TextField id={id("text")} path="text" name="text" label="Text of the amendment" at={at} multiline rows={4} defaultValue={defaults.text} />}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id={id("subjects")} path="subjects" name="subjects" label="Subject tags" at={at} defaultValue={defaults.subjects} placeholder="lighting, safety" hint="Comma-separated. Germaneness is judged on these." />
        <SponsorsField id={id("sponsors")} legislators={legislators} defaultValue={defaults.sponsors} at={at} />
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
