import { MEASURE_STATUSES, MEASURE_STATUS_LABELS, type MeasureStatus } from "../../lib/measures/measure-schemas.ts";
import { Field, TextField, type IssueLookup } from "../shared/fields.tsx";
import { fromInput } from "../shared/dates.ts";
import SponsorsField from "./SponsorsField.tsx";
import { tags } from "./tags.ts";

export interface MeasureDefaults {
  number: string;
  title: string;
  committee: string;
  status: MeasureStatus;
  /** datetime-local's "YYYY-MM-DDTHH:mm" on the chamber's clock, or "". */
  sittingAt: string;
  subjects: string;
  sponsors: string[];
}

interface Props {
  /** Prefix of every field's id: "nm" when introducing, "me" when editing. */
  prefix: string;
  legislators: Array<{ id: string; name: string; bloc: string }>;
  defaults: MeasureDefaults;
  at: IssueLookup;
}

/** A measure's own fields (not its text), the same whether it is being introduced or edited. */
export default function MeasureFields({ prefix, legislators, defaults, at }: Props) {
  const id = (k: string) => `${prefix}-${k}`;
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <TextField id={id("number")} path="number" name="number" label="Number" at={at} defaultValue={defaults.number} placeholder="HCA 14" />
      <TextField id={id("title")} path="title" name="title" label="Title" at={at} className="sm:col-span-2" defaultValue={defaults.title} maxLength={500} />
      <TextField id={id("committee")} path="committee" name="committee" label="Committee of jurisdiction" at={at} defaultValue={defaults.committee} maxLength={200} />
      <Field id={id("status")} path="status" label="Status" at={at} control={(attrs) => <select {...attrs} name="status" className="gw-input" defaultValue={defaults.status}>{MEASURE_STATUSES.map((s) => <option key={s} value={s}>{MEASURE_STATUS_LABELS[s]}</option>)}</select>} />
      <TextField id={id("sitting")} path="sittingAt" name="sittingAt" type="datetime-local" label="On the floor at" at={at} defaultValue={defaults.sittingAt} />
      <TextField id={id("subjects")} path="subjects" name="subjects" label="Subject tags" at={at} className="sm:col-span-2" defaultValue={defaults.subjects} placeholder="harbour, safety" hint="Comma-separated." />
      {legislators.length > 0 && <SponsorsField id={id("sponsors")} legislators={legislators} defaultValue={defaults.sponsors} at={at} />}
    </div>
  );
}

/** What the fields hold, as the API takes them. */
export function readMeasureFields(fd: FormData) {
  const sitting = String(fd.get("sittingAt") ?? "");
  return {
    number: String(fd.get("number") ?? ""),
    title: String(fd.get("title") ?? ""),
    committee: String(fd.get("committee") ?? "").trim() || null,
    status: fd.get("status"),
    subjects: tags(String(fd.get("subjects") ?? "")),
    sponsors: fd.getAll("sponsors").map(String),
    sittingAt: sitting ? fromInput(sitting) : null,
  };
}
