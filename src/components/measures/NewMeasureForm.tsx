import { useState, type SubmitEvent } from "react";
import { z } from "zod";
import MeasureFields, { readMeasureFields } from "./MeasureFields.tsx";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { Field, issueLookup, noIssues, type IssueLookup } from "../shared/fields.tsx";

const created = z.object({ id: z.string(), number: z.string() });

/** Clerks introduce a measure: its text typed in (split into sections at headings) or uploaded. */
export default function NewMeasureForm({ legislators = [] }: { legislators?: Array<{ id: string; name: string; bloc: string }> }) {
  const [mode, setMode] = useState<"text" | "upload">("text");
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const fields = readMeasureFields(fd);
    setBusy(true);
    setAt(() => noIssues);
    setFailure(null);
    try {
      let out;
      if (mode === "upload") {
        const form = new FormData();
        for (const k of ["number", "title", "committee", "subjects", "status"]) form.set(k, String(fd.get(k) ?? ""));
        form.set("sponsors", fields.sponsors.join(","));
        if (fields.sittingAt) form.set("sittingAt", fields.sittingAt);
        const file = fd.get("file");
        if (file instanceof File && file.size > 0) form.set("file", file);
        out = await apiCall(created, "/api/measures/upload", { method: "POST", form });
      } else {
        out = await apiCall(created, "/api/measures", {
          method: "POST",
          body: { ...fields, text: String(fd.get("text") ?? "") },
        });
      }
      window.location.href = `/measures/${out.id}`;
    } catch (err) {
      setAt(() => issueLookup(err, { byField: true }));
      setFailure(err instanceof ApiError ? err.message : "Could not create the measure.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <form className="gw-card space-y-3" onSubmit={onSubmit} aria-labelledby="nm-h">
      <h2 id="nm-h" className="text-step-2">Introduce a measure</h2>
      <MeasureFields prefix="nm" legislators={legislators} defaults={{ number: "", title: "", committee: "", status: "introduced", sittingAt: "", subjects: "", sponsors: [] }} at={at} />
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
        <Field id="nm-file" path="file" label="Document (up to 5 MB)" at={at} control={(attrs) => <input {...attrs} name="file" type="file" accept=".pdf,.docx,.txt,.md" className="gw-input" />} />
      )}
      <Alert>{failure}</Alert>
      <button type="submit" className="gw-btn" disabled={busy}>Introduce measure</button>
    </form>
  );
}
