import { useState, type FormEvent } from "react";
import { z } from "zod";
import { MEASURE_STATUSES } from "../../lib/server/measure-schemas.ts";
import { ApiError, apiCall, issuesByField } from "./api.ts";

const created = z.object({ id: z.string(), number: z.string() });

/** Clerks introduce a measure: its text typed in (split into sections at headings) or uploaded. */
export default function NewMeasureForm({ legislators = [] }: { legislators?: Array<{ id: string; name: string; bloc: string }> }) {
  const [mode, setMode] = useState<"text" | "upload">("text");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const sitting = String(fd.get("sittingAt") ?? "");
    const sittingAt = sitting ? new Date(sitting).toISOString() : null;
    setBusy(true);
    setErrors({});
    setFailure(null);
    try {
      let out;
      if (mode === "upload") {
        const form = new FormData();
        for (const k of ["number", "title", "committee", "subjects", "status"]) form.set(k, String(fd.get(k) ?? ""));
        form.set("sponsors", fd.getAll("sponsors").map(String).join(","));
        if (sittingAt) form.set("sittingAt", sittingAt);
        const file = fd.get("file");
        if (file instanceof File && file.size > 0) form.set("file", file);
        out = await apiCall(created, "/api/measures/upload", { method: "POST", form });
      } else {
        out = await apiCall(created, "/api/measures", {
          method: "POST",
          body: { number: fd.get("number"), title: fd.get("title"), committee: String(fd.get("committee") ?? "").trim() || null, status: fd.get("status"), subjects: String(fd.get("subjects") ?? "").split(",").map((s) => s.trim()).filter(Boolean), sponsors: fd.getAll("sponsors").map(String), sittingAt, text: String(fd.get("text") ?? "") },
        });
      }
      window.location.href = `/measures/${out.id}`;
    } catch (err) {
      setErrors(issuesByField(err));
      setFailure(err instanceof ApiError ? err.message : "Could not create the measure.");
    } finally {
      setBusy(false);
    }
  }
  const err = (k: string) => errors[k] && <p className="gw-error">{errors[k]}</p>;
  return (
    <form className="gw-card space-y-3" onSubmit={onSubmit} aria-labelledby="nm-h">
      <h2 id="nm-h" className="text-step-2">Introduce a measure</h2>
      <div className="grid gap-3 sm:grid-cols-3">
        <div><label htmlFor="nm-number" className="gw-label">Number</label><input id="nm-number" name="number" required className="gw-input" placeholder="HCA 14" />{err("number")}</div>
        <div className="sm:col-span-2"><label htmlFor="nm-title" className="gw-label">Title</label><input id="nm-title" name="title" required className="gw-input" />{err("title")}</div>
        <div><label htmlFor="nm-committee" className="gw-label">Committee of jurisdiction</label><input id="nm-committee" name="committee" className="gw-input" /></div>
        <div><label htmlFor="nm-subjects" className="gw-label">Subject tags</label><input id="nm-subjects" name="subjects" className="gw-input" placeholder="harbour, safety" /></div>
        <div><label htmlFor="nm-sitting" className="gw-label">On the floor at</label><input id="nm-sitting" name="sittingAt" type="datetime-local" className="gw-input" />{err("sittingAt")}</div>
        <div>
          <label htmlFor="nm-status" className="gw-label">Status</label>
          <select id="nm-status" name="status" className="gw-input" defaultValue="introduced">{MEASURE_STATUSES.map((s) => <option key={s} value={s}>{s}</option>)}</select>
        </div>
        {legislators.length > 0 && (
          <div className="sm:col-span-2">
            <label htmlFor="nm-sponsors" className="gw-label">Sponsors</label>
            <select id="nm-sponsors" name="sponsors" multiple size={4} className="gw-input">
              {legislators.map((l) => <option key={l.id} value={l.id}>{l.name} ({l.bloc})</option>)}
            </select>
            <p className="gw-hint">Ctrl/⌘-click to choose several.</p>
            {err("sponsors")}
          </div>
        )}
      </div>
      <fieldset className="flex gap-4 text-sm">
        <legend className="gw-label">Text</legend>
        <label><input type="radio" name="mode" checked={mode === "text"} onChange={() => setMode("text")} /> Type it in</label>
        <label><input type="radio" name="mode" checked={mode === "upload"} onChange={() => setMode("upload")} /> Upload (PDF, DOCX, .txt, .md)</label>
      </fieldset>
      {mode === "text" ? (
        <div>
          <label htmlFor="nm-text" className="gw-label">Text</label>
          <textarea id="nm-text" name="text" rows={6} className="gw-input font-mono text-sm" placeholder={"## Section 1 — Purpose\nSubjects: harbour, safety\nText of the section…"} />
          <p className="gw-hint">Start each section with a heading ("## Section 2 — …" or "Section 2."); a line "Subjects: a, b" tags it.</p>
        </div>
      ) : (
        <div><label htmlFor="nm-file" className="gw-label">Document (up to 5 MB)</label><input id="nm-file" name="file" type="file" accept=".pdf,.docx,.txt,.md" className="gw-input" />{err("file")}</div>
      )}
      {failure && <p className="gw-error" role="alert">{failure}</p>}
      <button type="submit" className="gw-btn" disabled={busy}>Introduce measure</button>
    </form>
  );
}
