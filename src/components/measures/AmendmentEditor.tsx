import { useEffect, useRef, useState, type SubmitEvent } from "react";
import { z } from "zod";
import type { AMENDMENT_FORMS } from "../../lib/amendments/case-schema.ts";
import { statusLabel } from "../../lib/measures/measure-schemas.ts";
import AmendmentFields, { LINES_HINT, readAmendmentFields } from "./AmendmentFields.tsx";
import { apiCall } from "../shared/api.ts";
import { conflictText } from "./api.ts";
import { Alert } from "../shared/Alert.tsx";
import { issueLookup, noIssues, type IssueLookup } from "../shared/fields.tsx";

export interface EditableAmendment {
  id: string;
  key: string;
  /** What a person reads: the key ("A3") or, for a draft, "Draft 1". */
  label: string;
  status: string;
  form: (typeof AMENDMENT_FORMS)[number];
  target: string;
  lines: [number, number] | null;
  title: string | null;
  text: string;
  subjects: string[];
  sponsors: string[];
  committee: string | null;
  version: number;
}

interface Props {
  /** The amendments this person may edit (clerks: any; a member: their own draft or filed ones). */
  editable: EditableAmendment[];
  sections: Array<{ id: string; heading: string; lines: number }>;
  /** Filed amendments that may be targeted. */
  targets: Array<{ key: string; title: string }>;
  legislators: Array<{ id: string; name: string; bloc: string }>;
}

const saved = z.object({ id: z.string(), version: z.number() });

/**
 * Edit an amendment's text, target and lines, form, subjects and sponsors, sent with the version
 * it was opened at. Rows of the amendments table link here with #edit-<key>.
 */
export default function AmendmentEditor({ editable, sections, targets, legislators }: Props) {
  // Nothing open until an amendment is chosen (a row's Edit link, or the picker).
  const [key, setKey] = useState("");
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [failure, setFailure] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const [busy, setBusy] = useState(false);
  const root = useRef<HTMLFormElement>(null);

  useEffect(() => {
    const pick = () => {
      const m = /^#edit-(.+)$/.exec(decodeURIComponent(window.location.hash));
      if (m && editable.some((a) => a.key === m[1])) {
        setKey(m[1]);
        setFailure(null);
        setAt(() => noIssues);
        root.current?.scrollIntoView({ block: "start" });
        root.current?.querySelector<HTMLElement>("#ae-text")?.focus();
      }
    };
    pick();
    window.addEventListener("hashchange", pick);
    return () => window.removeEventListener("hashchange", pick);
  }, [editable]);

  const a = editable.find((x) => x.key === key);
  if (!a)
    return (
      <div className="gw-card flex flex-wrap items-end gap-3" id="edit-amendment" data-testid="amendment-editor">
        <div>
          <label htmlFor="ae-pick" className="gw-label">Edit an amendment</label>
          <select id="ae-pick" className="gw-input" value="" onChange={(e) => setKey(e.target.value)}>
            <option value="">Choose one…</option>
            {editable.map((x) => <option key={x.id} value={x.key}>{x.label}{x.title ? ` — ${x.title}` : ""} ({statusLabel("amendment", x.status).toLowerCase()})</option>)}
          </select>
        </div>
        <p className="gw-hint">Or use Edit on its row above. Text, target and lines, form, subjects and sponsors can be changed.</p>
      </div>
    );

  async function onSubmit(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    if (!a) return;
    const fd = new FormData(e.currentTarget);
    const fields = readAmendmentFields(fd);
    if (!fields) {
      setAt(() => issueLookup([{ path: "lines", message: LINES_HINT }]));
      return;
    }
    setBusy(true);
    setAt(() => noIssues);
    setFailure(null);
    setStale(false);
    try {
      await apiCall(saved, `/api/amendments/${a.id}`, {
        method: "PATCH",
        body: { version: a.version, ...fields },
      });
      window.location.hash = a.key;
      window.location.reload();
    } catch (err) {
      const found = issueLookup(err, { byField: true });
      setAt(() => found);
      setStale(found("version").length > 0);
      setFailure(conflictText(err, "Could not save the amendment. Nothing was changed."));
    } finally {
      setBusy(false);
    }
  }

  return (
    <form ref={root} key={a.id} id="edit-amendment" className="gw-card space-y-3" onSubmit={onSubmit} aria-labelledby="ae-h" data-testid="amendment-editor">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="ae-h" className="text-step-2">Edit {a.key === a.label ? `amendment ${a.key}` : a.label.toLowerCase()}</h2>
        {editable.length > 0 && (
          <div>
            <label htmlFor="ae-pick" className="gw-label">Amendment to edit</label>
            <select id="ae-pick" className="gw-input" value={key} onChange={(e) => { setKey(e.target.value); setFailure(null); setAt(() => noIssues); }}>
              {editable.map((x) => <option key={x.id} value={x.key}>{x.label}{x.title ? ` — ${x.title}` : ""} ({statusLabel("amendment", x.status).toLowerCase()})</option>)}
            </select>
          </div>
        )}
      </div>
      <AmendmentFields
        prefix="ae"
        sections={sections}
        amendments={targets.filter((t) => t.key !== a.key)}
        legislators={legislators}
        defaults={{ form: a.form, target: a.target, lines: a.lines ? (a.lines[0] === a.lines[1] ? String(a.lines[0]) : `${a.lines[0]}-${a.lines[1]}`) : "", title: a.title ?? "", committee: a.committee ?? "", text: a.text, subjects: a.subjects.join(", "), sponsors: a.sponsors }}
        at={at}
      />
      {failure && (
        <Alert look="box" testId="amendment-editor-error">
          <p className="text-sm text-verdict-bar">{failure}</p>
          {stale && <button type="button" className="gw-btn-quiet mt-2" onClick={() => window.location.reload()}>Reload the current version</button>}
        </Alert>
      )}
      <p className="gw-hint">Status ({statusLabel("amendment", a.status).toLowerCase()}) is changed in the table above. Saving is based on version {a.version}.</p>
      <button type="submit" className="gw-btn" disabled={busy}>Save {a.key === a.label ? `amendment ${a.key}` : a.label.toLowerCase()}</button>
    </form>
  );
}
