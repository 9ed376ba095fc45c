import { useState, type FormEvent } from "react";
import { lineRangeFromText } from "../../lib/amendments/line-range-text.ts";
import { z } from "zod";
import { AMENDMENT_FORMS } from "../../lib/amendments/case-schema.ts";
import { FORM_LABELS } from "../../lib/server/measure-schemas.ts";
import { ApiError, apiCall, issuesByField } from "./api.ts";

interface Props {
  measureId: string;
  sections: Array<{ id: string; heading: string; lines: number }>;
  amendments: Array<{ id: string; key: string; title: string }>;
  legislators: Array<{ id: string; name: string; bloc: string; own: boolean }>;
}

const filedSchema = z.object({ id: z.string(), key: z.string(), status: z.string() });

/** A member's (or clerk's) amendment: typed in or uploaded; filed at once or saved as a draft. */
export default function FileAmendmentForm({ measureId, sections, amendments, legislators }: Props) {
  const [mode, setMode] = useState<"form" | "upload">("form");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const draft = (e.nativeEvent as SubmitEvent).submitter?.getAttribute("value") === "draft";
    const sponsors = fd.getAll("sponsors").map(String);
    const lines = lineRangeFromText(String(fd.get("lines") ?? ""));
    if (lines === "invalid") {
      setErrors({ lines: "write a line or a range such as 3-7" });
      return;
    }
    setBusy(true);
    setErrors({});
    setMessage(null);
    setFailure(null);
    try {
      let out;
      if (mode === "upload") {
        const form = new FormData();
        for (const k of ["form", "target", "lines", "title", "subjects", "text", "committee"]) form.set(k, String(fd.get(k) ?? ""));
        form.set("sponsors", sponsors.join(","));
        form.set("draft", String(draft));
        const file = fd.get("file");
        if (file instanceof File && file.size > 0) form.set("file", file);
        out = await apiCall(filedSchema, `/api/measures/${measureId}/amendments`, { method: "POST", form });
      } else {
        out = await apiCall(filedSchema, `/api/measures/${measureId}/amendments`, {
          method: "POST",
          body: {
            form: fd.get("form"),
            target: fd.get("target"),
            lines,
            title: String(fd.get("title") ?? "").trim() || null,
            text: String(fd.get("text") ?? ""),
            subjects: String(fd.get("subjects") ?? "").split(",").map((s) => s.trim()).filter(Boolean),
            sponsors,
            committee: String(fd.get("committee") ?? "").trim() || null,
            draft,
          },
        });
      }
      setMessage(out.status === "draft" ? `Saved as a draft (${out.key}). File it when ready.` : `Filed as Amendment ${out.key}. A filing receipt is on its way to your e-mail.`);
      setTimeout(() => window.location.reload(), 1500);
    } catch (err) {
      setErrors(issuesByField(err));
      setFailure(err instanceof ApiError ? err.message : "Could not file the amendment.");
    } finally {
      setBusy(false);
    }
  }

  const err = (k: string) => errors[k] && <p className="gw-error" id={`fa-${k}-err`}>{errors[k]}</p>;
  return (
    <form className="gw-card space-y-3" onSubmit={onSubmit} aria-labelledby="fa-h" data-testid="file-amendment">
      <h2 id="fa-h" className="text-step-2">File an amendment</h2>
      <fieldset className="flex gap-4 text-sm">
        <legend className="gw-label">Text</legend>
        <label><input type="radio" name="mode" checked={mode === "form"} onChange={() => setMode("form")} /> Type it in</label>
        <label><input type="radio" name="mode" checked={mode === "upload"} onChange={() => setMode("upload")} /> Upload a document</label>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor="fa-form" className="gw-label">Form</label>
          <select id="fa-form" name="form" className="gw-input" defaultValue="strike-and-insert">
            {AMENDMENT_FORMS.map((f) => <option key={f} value={f}>{FORM_LABELS[f]}</option>)}
          </select>
          {err("form")}
        </div>
        <div>
          <label htmlFor="fa-target" className="gw-label">Amends</label>
          <select id="fa-target" name="target" className="gw-input" defaultValue={sections[0]?.id ?? "measure"} aria-describedby={errors.target ? "fa-target-err" : undefined}>
            <option value="measure">The whole measure</option>
            <optgroup label="Sections">{sections.map((s) => <option key={s.id} value={s.id}>§ {s.id} {s.heading} ({s.lines} lines)</option>)}</optgroup>
            {amendments.length > 0 && <optgroup label="Amendments">{amendments.map((a) => <option key={a.id} value={a.key}>{a.key} {a.title}</option>)}</optgroup>}
          </select>
          {err("target")}
        </div>
        <div>
          <label htmlFor="fa-lines" className="gw-label">Lines (sections only)</label>
          <input id="fa-lines" name="lines" className="gw-input" placeholder="e.g. 2-3" aria-describedby={errors.lines ? "fa-lines-err" : undefined} />
          {err("lines")}
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="fa-title" className="gw-label">Short title</label>
          <input id="fa-title" name="title" className="gw-input" maxLength={500} />
        </div>
        <div>
          <label htmlFor="fa-committee" className="gw-label">Committee of jurisdiction (if not the measure's)</label>
          <input id="fa-committee" name="committee" className="gw-input" maxLength={200} />
          {err("committee")}
        </div>
      </div>
      {mode === "form" ? (
        <div>
          <label htmlFor="fa-text" className="gw-label">Text of the amendment</label>
          <textarea id="fa-text" name="text" rows={4} className="gw-input" />
          {err("text")}
        </div>
      ) : (
        <div>
          <label htmlFor="fa-file" className="gw-label">Document (PDF, DOCX, .txt or .md, up to 5 MB)</label>
          <input id="fa-file" name="file" type="file" accept=".pdf,.docx,.txt,.md" className="gw-input" />
          {err("file")}
        </div>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="fa-subjects" className="gw-label">Subject tags</label>
          <input id="fa-subjects" name="subjects" className="gw-input" placeholder="lighting, safety" />
          <p className="gw-hint">Comma-separated. Germaneness is judged on these.</p>
        </div>
        <div>
          <label htmlFor="fa-sponsors" className="gw-label">Sponsors</label>
          <select id="fa-sponsors" name="sponsors" multiple size={5} className="gw-input" defaultValue={legislators.filter((l) => l.own).map((l) => l.id)}>
            {legislators.map((l) => <option key={l.id} value={l.id}>{l.name} ({l.bloc})</option>)}
          </select>
          <p className="gw-hint">Ctrl/⌘-click to choose several.</p>
          {err("sponsors")}
        </div>
      </div>
      {failure && <p className="gw-error" role="alert">{failure}</p>}
      {message && <p className="gw-card border-verdict-ok bg-verdict-ok-tint text-sm" role="status">{message}</p>}
      <div className="flex gap-2">
        <button type="submit" className="gw-btn" value="file" disabled={busy}>File amendment</button>
        <button type="submit" className="gw-btn-quiet" value="draft" disabled={busy}>Save as draft</button>
      </div>
    </form>
  );
}
