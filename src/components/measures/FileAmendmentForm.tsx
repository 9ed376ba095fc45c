import { useState, type SubmitEvent } from "react";
import { z } from "zod";
import AmendmentFields, { LINES_HINT, readAmendmentFields } from "./AmendmentFields.tsx";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { Field, issueLookup, noIssues, type IssueLookup } from "../shared/fields.tsx";

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
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [message, setMessage] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const draft = e.nativeEvent.submitter?.getAttribute("value") === "draft";
    const fields = readAmendmentFields(fd);
    if (!fields) {
      setAt(() => issueLookup([{ path: "lines", message: LINES_HINT }]));
      return;
    }
    setBusy(true);
    setAt(() => noIssues);
    setMessage(null);
    setFailure(null);
    try {
      let out;
      if (mode === "upload") {
        const form = new FormData();
        for (const k of ["form", "target", "lines", "title", "subjects", "text", "committee"]) form.set(k, String(fd.get(k) ?? ""));
        form.set("sponsors", fields.sponsors.join(","));
        form.set("draft", String(draft));
        const file = fd.get("file");
        if (file instanceof File && file.size > 0) form.set("file", file);
        out = await apiCall(filedSchema, `/api/measures/${measureId}/amendments`, { method: "POST", form });
      } else {
        out = await apiCall(filedSchema, `/api/measures/${measureId}/amendments`, {
          method: "POST",
          body: { ...fields, draft },
        });
      }
      setMessage(out.status === "draft" ? `Saved as a draft (${out.key}). File it when ready.` : `Filed as Amendment ${out.key}. A filing receipt is on its way to your e-mail.`);
      setTimeout(() => window.location.reload(), 1500);
    } catch (err) {
      setAt(() => issueLookup(err, { byField: true }));
      setFailure(err instanceof ApiError ? err.message : "Could not file the amendment.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form className="gw-card space-y-3" onSubmit={onSubmit} aria-labelledby="fa-h" data-testid="file-amendment">
      <h2 id="fa-h" className="text-step-2">File an amendment</h2>
      <fieldset className="flex gap-4 text-sm">
        <legend className="gw-label">Text</legend>
        <label><input type="radio" name="mode" checked={mode === "form"} onChange={() => setMode("form")} /> Type it in</label>
        <label><input type="radio" name="mode" checked={mode === "upload"} onChange={() => setMode("upload")} /> Upload a document</label>
      </fieldset>
      <AmendmentFields
        prefix="fa"
        sections={sections}
        amendments={amendments}
        legislators={legislators}
        defaults={{ form: "strike-and-insert", target: sections[0]?.id ?? "measure", lines: "", title: "", committee: "", text: "", subjects: "", sponsors: legislators.filter((l) => l.own).map((l) => l.id) }}
        at={at}
        text={
          mode === "upload" ? (
            <Field id="fa-file" path="file" label="Document (PDF, DOCX, .txt or .md, up to 5 MB)" at={at} control={(attrs) => <input {...attrs} name="file" type="file" accept=".pdf,.docx,.txt,.md" className="gw-input" />} />
          ) : undefined
        }
      />
      <Alert focus>{failure}</Alert>
      <Alert tone="ok" look="box" focus>{message}</Alert>
      <div className="flex gap-2">
        <button type="submit" className="gw-btn" value="file" disabled={busy}>File amendment</button>
        <button type="submit" className="gw-btn-quiet" value="draft" disabled={busy}>Save as draft</button>
      </div>
    </form>
  );
}
