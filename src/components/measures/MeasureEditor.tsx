import { useState, type SubmitEvent } from "react";
import { z } from "zod";
import { SECTION_STATUS_LABELS, type MeasureStatus } from "../../lib/measures/measure-schemas.ts";
import MeasureFields, { readMeasureFields } from "./MeasureFields.tsx";
import { apiCall } from "../shared/api.ts";
import { conflictText } from "./api.ts";
import { Alert } from "../shared/Alert.tsx";
import { toInput } from "../shared/dates.ts";
import { FieldMessages, issueLookup, noIssues, SelectField, TextField, type IssueLookup } from "../shared/fields.tsx";
import { tags } from "./tags.ts";

interface SectionDraft {
  /** Stable React key; the stored id (if any) is `id`. */
  key: string;
  id: string | null;
  heading: string;
  text: string;
  subjects: string;
  status: "open" | "adopted" | "struck";
}

interface Props {
  measure: {
    id: string;
    number: string;
    title: string;
    committee: string | null;
    status: MeasureStatus;
    subjects: string[];
    sponsors: string[];
    sittingAt: string | null;
    sections: Array<{ id: string; heading?: string; text?: string; subjects: string[]; status: "open" | "adopted" | "struck" }>;
    version: number;
  };
  legislators: Array<{ id: string; name: string; bloc: string }>;
  /** The chamber's time zone (the page renders this island on the server too). */
  timeZone: string;
}

const saved = z.object({ id: z.string(), version: z.number() });
const SECTION_STATUSES = ["open", "adopted", "struck"] as const;

/**
 * Clerks edit a measure: its fields and its sections (text, heading, subject tags, status), sent
 * with the version they opened. A stale save comes back 409 and says who changed what since.
 */
export default function MeasureEditor({ measure, legislators, timeZone }: Props) {
  const [sections, setSections] = useState<SectionDraft[]>(() => measure.sections.map((s) => ({ key: s.id, id: s.id, heading: s.heading ?? "", text: s.text ?? "", subjects: s.subjects.join(", "), status: s.status })));
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [failure, setFailure] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const [busy, setBusy] = useState(false);
  const [next, setNext] = useState(1);

  const patch = (i: number, part: Partial<SectionDraft>) => setSections((all) => all.map((s, j) => (j === i ? { ...s, ...part } : s)));
  const move = (i: number, by: number) =>
    setSections((all) => {
      const out = [...all];
      const [s] = out.splice(i, 1);
      out.splice(Math.max(0, Math.min(out.length, i + by)), 0, s);
      return out;
    });

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    setBusy(true);
    setAt(() => noIssues);
    setFailure(null);
    setStale(false);
    try {
      await apiCall(saved, `/api/measures/${measure.id}`, {
        method: "PATCH",
        body: {
          version: measure.version,
          ...readMeasureFields(fd),
          sections: sections.map((s) => ({ ...(s.id ? { id: s.id } : {}), ...(s.heading.trim() ? { heading: s.heading.trim() } : {}), text: s.text, subjects: tags(s.subjects), status: s.status })),
        },
      });
      window.location.reload();
    } catch (err) {
      const found = issueLookup(err, { byField: true });
      setAt(() => found);
      setStale(found("version").length > 0);
      setFailure(conflictText(err, "Could not save the measure. Nothing was changed."));
    } finally {
      setBusy(false);
    }
  }

  return (
    <form className="gw-card space-y-4" onSubmit={onSubmit} aria-labelledby="me-h" data-testid="measure-editor">
      <h2 id="me-h" className="text-step-2">Edit {measure.number}</h2>
      <MeasureFields
        prefix="me"
        legislators={legislators}
        defaults={{ number: measure.number, title: measure.title, committee: measure.committee ?? "", status: measure.status, sittingAt: toInput(measure.sittingAt, timeZone), subjects: measure.subjects.join(", "), sponsors: measure.sponsors }}
        at={at}
      />

      <fieldset className="space-y-3">
        <legend className="gw-label">Sections</legend>
        <FieldMessages id="me-sections" path="sections" at={at} />
        {sections.map((s, i) => (
          <div key={s.key} className="rounded border border-rule bg-vellum p-3" data-testid={`section-editor-${s.id ?? `new-${i}`}`}>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="font-semibold">§ {s.id ?? "new section"}</span>
              <span className="flex gap-1">
                <button type="button" className="gw-btn-quiet px-2 py-0.5" onClick={() => move(i, -1)} disabled={i === 0} aria-label={`Move section ${s.id ?? i + 1} up`}>↑</button>
                <button type="button" className="gw-btn-quiet px-2 py-0.5" onClick={() => move(i, 1)} disabled={i === sections.length - 1} aria-label={`Move section ${s.id ?? i + 1} down`}>↓</button>
                <button type="button" className="gw-btn-danger px-2 py-0.5" onClick={() => setSections((all) => all.filter((_, j) => j !== i))} aria-label={`Remove section ${s.id ?? i + 1}`}>Remove</button>
              </span>
            </div>
            <div className="mt-2 grid gap-2 sm:grid-cols-3">
              <TextField id={`me-s${i}-heading`} path={`sections.${i}.heading`} label="Heading" at={at} className="sm:col-span-2" value={s.heading} onChange={(v) => patch(i, { heading: v })} maxLength={500} />
              <SelectField id={`me-s${i}-status`} path={`sections.${i}.status`} label="Text status" at={at} value={s.status} options={SECTION_STATUSES} labels={SECTION_STATUS_LABELS} onChange={(v) => patch(i, { status: v })} />
            </div>
            <TextField id={`me-s${i}-text`} path={`sections.${i}.text`} label={`Text of § ${s.id ?? "new section"}`} at={at} className="mt-2" multiline rows={Math.min(10, Math.max(3, s.text.split("\n").length + 1))} value={s.text} onChange={(v) => patch(i, { text: v })} hint="One line per numbered line; amendments cite these line numbers." />
            <TextField id={`me-s${i}-subjects`} path={`sections.${i}.subjects`} label={`Subject tags of § ${s.id ?? "new section"}`} at={at} className="mt-2" value={s.subjects} onChange={(v) => patch(i, { subjects: v })} />
          </div>
        ))}
        <button type="button" className="gw-btn-quiet" onClick={() => { setSections((all) => [...all, { key: `new-${next}`, id: null, heading: "", text: "", subjects: "", status: "open" }]); setNext((n) => n + 1); }}>Add a section</button>
        <p className="gw-hint">A removed section takes its amendments' target with it: the tree will report them as target-missing.</p>
      </fieldset>

      {failure && (
        <Alert look="box" testId="measure-editor-error">
          <p className="text-sm text-verdict-bar">{failure}</p>
          {stale && <button type="button" className="gw-btn-quiet mt-2" onClick={() => window.location.reload()}>Reload the current version</button>}
        </Alert>
      )}
      <button type="submit" className="gw-btn" disabled={busy}>Save changes (from version {measure.version})</button>
    </form>
  );
}
