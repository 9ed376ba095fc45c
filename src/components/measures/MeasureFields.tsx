import { MEASURE_STATUSES, type MeasureStatus } from "../../lib/measures/measure-schemas.ts";
import SponsorsField from "./SponsorsField.tsx";
import { tags } from "./tags.ts";

export interface MeasureDefaults {
  number: string;
  title: string;
  committee: string;
  status: MeasureStatus;
  /** datetime-local's "YYYY-MM-DDTHH:mm", or "". */
  sittingAt: string;
  subjects: string;
  sponsors: string[];
}

interface Props {
  /** Prefix of every field's id: "nm" when introducing, "me" when editing. */
  prefix: string;
  legislators: Array<{ id: string; name: string; bloc: string }>;
  defaults: MeasureDefaults;
  errors: Record<string, string>;
}

/** A measure's own fields (not its text), the same whether it is being introduced or edited. */
export default function MeasureFields({ prefix, legislators, defaults, errors }: Props) {
  const id = (k: string) => `${prefix}-${k}`;
  const err = (k: string) => errors[k] && <p className="gw-error" id={`${id(k)}-err`}>{errors[k]}</p>;
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <div><label htmlFor={id("number")} className="gw-label">Number</label><input id={id("number")} name="number" required className="gw-input" defaultValue={defaults.number} placeholder="HCA 14" />{err("number")}</div>
      <div className="sm:col-span-2"><label htmlFor={id("title")} className="gw-label">Title</label><input id={id("title")} name="title" required className="gw-input" defaultValue={defaults.title} maxLength={500} />{err("title")}</div>
      <div><label htmlFor={id("committee")} className="gw-label">Committee of jurisdiction</label><input id={id("committee")} name="committee" className="gw-input" defaultValue={defaults.committee} maxLength={200} />{err("committee")}</div>
      <div>
        <label htmlFor={id("status")} className="gw-label">Status</label>
        <select id={id("status")} name="status" className="gw-input" defaultValue={defaults.status}>{MEASURE_STATUSES.map((s) => <option key={s} value={s}>{s}</option>)}</select>
      </div>
      <div><label htmlFor={id("sitting")} className="gw-label">On the floor at</label><input id={id("sitting")} name="sittingAt" type="datetime-local" className="gw-input" defaultValue={defaults.sittingAt} />{err("sittingAt")}</div>
      <div className="sm:col-span-2"><label htmlFor={id("subjects")} className="gw-label">Subject tags</label><input id={id("subjects")} name="subjects" className="gw-input" defaultValue={defaults.subjects} placeholder="harbour, safety" /><p className="gw-hint">Comma-separated.</p>{err("subjects")}</div>
      {legislators.length > 0 && <SponsorsField id={id("sponsors")} size={4} legislators={legislators} defaultValue={defaults.sponsors} error={errors.sponsors} />}
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
    sittingAt: sitting ? new Date(sitting).toISOString() : null,
  };
}
