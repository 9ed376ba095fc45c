import { useEffect, useRef, useState, type SubmitEvent } from "react";
import { filedSchema, keepFiled, takeFiled, type Filed } from "./filing.ts";
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


const SEVERITY_WORDS = { error: "Out of order", warning: "Warning", info: "Note" } as const;
const DEGREE_WORDS: Record<number, string> = { 1: "an amendment of the first degree", 2: "an amendment of the second degree (an amendment to an amendment)", 3: "an amendment of the third degree" };

/** A member's (or clerk's) amendment: typed in or uploaded; filed at once or saved as a draft. */
export default function FileAmendmentForm({ measureId, sections, amendments, legislators }: Props) {
  const [mode, setMode] = useState<"form" | "upload">("form");
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [message, setMessage] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [filed, setFiled] = useState<Filed | null>(null);
  /** The repeat question: what the server said, and the same filing to send again with `confirm`. */
  const [repeat, setRepeat] = useState<{ question: string; send: () => Promise<Filed> } | null>(null);
  const confirmation = useRef<HTMLDivElement>(null);
  const question = useRef<HTMLDivElement>(null);

  useEffect(() => {
    // Kept across the reload that shows the new row (this form's filing, or a draft's "File now").
    const kept = takeFiled(measureId);
    if (kept) setFiled(kept);
  }, [measureId]);
  useEffect(() => {
    if (filed) confirmation.current?.focus();
  }, [filed]);
  useEffect(() => {
    if (repeat) question.current?.focus();
  }, [repeat]);

  function done(out: Filed) {
    if (out.status === "draft") {
      setMessage("Saved as a draft. File it from the list of amendments when ready.");
      setTimeout(() => window.location.reload(), 1500);
      return;
    }
    // Shown (and focused) after the reload that lists the new row, not before it.
    keepFiled(measureId, out);
    window.location.reload();
  }

  async function attempt(send: () => Promise<Filed>, again: () => Promise<Filed>) {
    setBusy(true);
    setAt(() => noIssues);
    setMessage(null);
    setFailure(null);
    setFiled(null);
    setRepeat(null);
    try {
      done(await send());
    } catch (err) {
      if (err instanceof ApiError && err.code === "needs-confirmation") setRepeat({ question: err.message, send: again });
      else {
        setAt(() => issueLookup(err, { byField: true }));
        setFailure(err instanceof ApiError ? err.message : "Could not file the amendment.");
      }
    } finally {
      setBusy(false);
    }
  }

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const fd = new FormData(e.currentTarget);
    const draft = e.nativeEvent.submitter?.getAttribute("value") === "draft";
    const fields = readAmendmentFields(fd);
    if (!fields) {
      setAt(() => issueLookup([{ path: "lines", message: LINES_HINT }]));
      return;
    }
    const send = (confirm: boolean) => {
      if (mode === "upload") {
        const form = new FormData();
        for (const k of ["form", "target", "lines", "title", "subjects", "text", "committee"]) form.set(k, String(fd.get(k) ?? ""));
        form.set("sponsors", fields.sponsors.join(","));
        form.set("draft", String(draft));
        form.set("confirm", String(confirm));
        const file = fd.get("file");
        if (file instanceof File && file.size > 0) form.set("file", file);
        return apiCall(filedSchema, `/api/measures/${measureId}/amendments`, { method: "POST", form });
      }
      return apiCall(filedSchema, `/api/measures/${measureId}/amendments`, { method: "POST", body: { ...fields, draft, confirm } });
    };
    await attempt(() => send(false), () => send(true));
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
      {repeat && (
        <div ref={question} tabIndex={-1} role="group" aria-labelledby="fa-repeat" className="gw-advisory space-y-2" data-testid="filing-repeat">
          <p id="fa-repeat" className="font-semibold">{repeat.question}</p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="gw-btn" disabled={busy} onClick={() => void attempt(repeat.send, repeat.send)}>File it anyway</button>
            <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => setRepeat(null)}>Do not file</button>
          </div>
        </div>
      )}
      {filed && (
        <div ref={confirmation} tabIndex={-1} role="group" aria-label="Filing confirmation">
          <Alert tone="ok" look="box" testId="filing-confirmation">
            <span className="block font-semibold">Filed as {filed.name ?? `Amendment ${filed.key}`}. The receipt goes to its sponsors by e-mail.</span>
            {filed.check?.degree != null && <span className="mt-1 block">The tree check reads it as {DEGREE_WORDS[filed.check.degree] ?? `an amendment of degree ${filed.check.degree}`}.</span>}
            {filed.check && filed.check.findings.length === 0 && <span className="mt-1 block">The tree check found nothing to raise.</span>}
            {filed.check && filed.check.findings.length > 0 && (
              <ul className="mt-1 list-disc pl-5" data-testid="filing-findings">
                {filed.check.findings.map((f, i) => <li key={i}><strong>{SEVERITY_WORDS[f.severity]}:</strong> {f.message}</li>)}
              </ul>
            )}
            <span className="mt-1 block"><a className="underline" href={`/measures/${measureId}/tree#${filed.key}`}>See it in the tree</a>. The tree check advises; the presiding officer rules.</span>
          </Alert>
        </div>
      )}
      <div className="flex gap-2">
        <button type="submit" className="gw-btn" value="file" disabled={busy}>File amendment</button>
        <button type="submit" className="gw-btn-quiet" value="draft" disabled={busy}>Save as draft</button>
      </div>
    </form>
  );
}
