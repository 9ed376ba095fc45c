import { useState, type SubmitEvent } from "react";
import { z } from "zod";
import type { MeasureStatus } from "../../lib/measures/measure-schemas.ts";
import MeasureFields, { readMeasureFields } from "./MeasureFields.tsx";
import { apiCall, conflictText, issuesByField } from "./api.ts";
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
}

const saved = z.object({ id: z.string(), version: z.number() });
/** datetime-local wants local "YYYY-MM-DDTHH:mm". */
function localInput(iso: string | null): string {
  if (!iso) return "";
  const d = new Date(iso);
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

/**
 * Clerks edit a measure: its fields and its sections (text, heading, subject tags, status), sent
 * with the version they opened. A stale save comes back 409 and says who changed what since.
 */
export default function MeasureEditor({ measure, legislators }: Props) {
  const [sections, setSections] = useState<SectionDraft[]>(() => measure.sections.map((s) => ({ key: s.id, id: s.id, heading: s.heading ?? "", text: s.text ?? "", subjects: s.subjects.join(", "), status: s.status })));
  const [errors, setErrors] = useState<Record<string, string>>({});
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
    setErrors({});
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
      const byField = issuesByField(err);
      setErrors(byField);
      setStale("version" in byField);
      setFailure(conflictText(err, "Could not save the measure. Nothing was changed."));
    } finally {
      setBusy(false);
    }
  }

  const err = (k: string) => errors[k] && <p className="gw-error" id={`me-${k}-err`}>{errors[k]}</p>;
  return (
    <form className="gw-card space-y-4" onSubmit={onSubmit} aria-labelledby="me-h" data-testid="measure-editor">
      <h2 id="me-h" className="text-step-2">Edit {measure.number}</h2>
      <MeasureFields
        prefix="me"
        legislators={legislators}
        defaults={{ number: measure.number, title: measure.title, committee: measure.committee ?? "", status: measure.status, sittingAt: localInput(measure.sittingAt), subjects: measure.subjects.join(", "), sponsors: measure.sponsors }}
        errors={errors}
      />

      <fieldset className="space-y-3">
        <legend className="gw-label">Sections</legend>
        {err("sections")}
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
              <div className="sm:col-span-2"><label htmlFor={`me-s${i}-heading`} className="gw-label">Heading</label><input id={`me-s${i}-heading`} className="gw-input" value={s.heading} onChange={(e) => patch(i, { heading: e.target.value })} maxLength={500} /></div>
              <div>
                <label htmlFor={`me-s${i}-status`} className="gw-label">Text status</label>
                <select id={`me-s${i}-status`} className="gw-input" value={s.status} onChange={(e) => patch(i, { status: e.target.value as SectionDraft["status"] })}>
                  <option value="open">open</option><option value="adopted">adopted</option><option value="struck">struck</option>
                </select>
              </div>
            </div>
            <label htmlFor={`me-s${i}-text`} className="gw-label mt-2">Text of § {s.id ?? "new section"}</label>
            <textarea id={`me-s${i}-text`} className="gw-input font-mono text-sm" rows={Math.min(10, Math.max(3, s.text.split("\n").length + 1))} value={s.text} onChange={(e) => patch(i, { text: e.target.value })} />
            <p className="gw-hint">One line per numbered line; amendments cite these line numbers.</p>
            <label htmlFor={`me-s${i}-subjects`} className="gw-label mt-2">Subject tags of § {s.id ?? "new section"}</label>
            <input id={`me-s${i}-subjects`} className="gw-input" value={s.subjects} onChange={(e) => patch(i, { subjects: e.target.value })} />
          </div>
        ))}
        <button type="button" className="gw-btn-quiet" onClick={() => { setSections((all) => [...all, { key: `new-${next}`, id: null, heading: "", text: "", subjects: "", status: "open" }]); setNext((n) => n + 1); }}>Add a section</button>
        <p className="gw-hint">A removed section takes its amendments' target with it: the tree will report them as target-missing.</p>
      </fieldset>

      {failure && (
        <div className="gw-card border-verdict-bar bg-verdict-bar-tint" role="alert" data-testid="measure-editor-error">
          <p className="text-sm text-verdict-bar">{failure}</p>
          {stale && <button type="button" className="gw-btn-quiet mt-2" onClick={() => window.location.reload()}>Reload the current version</button>}
        </div>
      )}
      <button type="submit" className="gw-btn" disabled={busy}>Save changes (from version {measure.version})</button>
    </form>
  );
}
