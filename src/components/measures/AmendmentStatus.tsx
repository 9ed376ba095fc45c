import { useState } from "react";
import { z } from "zod";
import { AMENDMENT_STATUS_LABELS, type AmendmentStatus as Status } from "../../lib/measures/measure-schemas.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";
import { filedSchema, keepFiled } from "./filing.ts";

interface Props {
  id: string;
  measureId: string;
  /** The amendment in words ("Amendment A3 to section 2 of HCA 12"), for the confirmation. */
  words: string;
  status: Status;
  version: number;
  /** Clerks set any status; the filer may withdraw or file a draft. */
  clerk: boolean;
  statuses: Status[];
}

/**
 * Change an amendment's status, sending the version it was read at; a stale change shows what changed.
 * Choosing a status changes nothing until "Change status" and the confirmation that names the amendment.
 */
export default function AmendmentStatus({ id, measureId, words, status, version, clerk, statuses }: Props) {
  const [current, setCurrent] = useState({ status, version });
  const [chosen, setChosen] = useState<Status>(status);
  const [asking, setAsking] = useState<Status | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  /** Filing a draft: the dialog is open; `repeat` is the server's question when the same text was filed within the hour. */
  const [filing, setFiling] = useState<{ repeat: string | null } | null>(null);
  const row = z.object({ status: z.enum(statuses as [Status, ...Status[]]), version: z.number() });

  async function fileDraft(confirm: boolean) {
    setBusy(true);
    setError(null);
    try {
      // The filing form above the list shows what the tree check says about it once the page reloads.
      keepFiled(measureId, await apiCall(filedSchema, `/api/amendments/${id}/file`, { method: "POST", body: { version: current.version, confirm } }));
      window.location.reload();
    } catch (e) {
      if (e instanceof ApiError && e.code === "needs-confirmation") setFiling({ repeat: e.message });
      else setError(e instanceof ApiError ? e.message : "Could not file the amendment.");
    } finally {
      setBusy(false);
    }
  }

  async function send(url: string, body: Record<string, unknown>) {
    setBusy(true);
    setError(null);
    try {
      const out = await apiCall(row, url, { method: "PATCH", body });
      setCurrent({ status: out.status, version: out.version });
      setAsking(null);
      window.location.reload();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Could not change the status.");
    } finally {
      setBusy(false);
    }
  }

  if (current.status === "draft")
    return (
      <span className="flex flex-col gap-1">
        <span>Draft</span>
        <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => setFiling({ repeat: null })}>File now…</button>
        <ConfirmDialog
          open={filing !== null}
          testId="file-draft-confirm"
          title={filing?.repeat ? "File the same amendment again?" : `File ${words.replace(/^A draft\b/, "the draft")}?`}
          confirm={filing?.repeat ? "File it anyway" : "File it"}
          danger={false}
          busy={busy}
          error={filing ? error : null}
          onConfirm={() => void fileDraft(Boolean(filing?.repeat))}
          onCancel={() => {
            setFiling(null);
            setError(null);
          }}
        >
          {filing?.repeat ? (
            <p>{filing.repeat}</p>
          ) : (
            <p>It takes the measure's next amendment number and the receipt goes to its sponsors by e-mail. A filed amendment stays on the record: it can be withdrawn, not made a draft again.</p>
          )}
        </ConfirmDialog>
        {!filing && <Alert look="inline">{error}</Alert>}
      </span>
    );
  const withdrawing = asking === "withdrawn";
  const dialog = (
    <ConfirmDialog
      open={asking !== null}
      testId="status-confirm"
      title={withdrawing ? `Withdraw ${words}?` : `Mark ${words} as ${asking ? AMENDMENT_STATUS_LABELS[asking].toLowerCase() : ""}?`}
      confirm={withdrawing ? "Withdraw it" : "Change the status"}
      busy={busy}
      error={asking ? error : null}
      onConfirm={() => asking && void send(`/api/amendments/${id}`, { version: current.version, status: asking })}
      onCancel={() => {
        setAsking(null);
        setError(null);
        setChosen(current.status);
      }}
    >
      {withdrawing ? (
        <p>
          A withdrawn amendment leaves the amendment tree and the questions before the chamber.{" "}
          {clerk ? "This cannot be undone without a further change of status, which the measure's history records too." : "This cannot be undone: only a clerk may change a withdrawn amendment's status."}
        </p>
      ) : (
        <p>The amendment is marked {asking ? AMENDMENT_STATUS_LABELS[asking].toLowerCase() : ""} at once. This cannot be undone without a further change of status; the measure's history records each change with your name.</p>
      )}
    </ConfirmDialog>
  );
  if (!clerk)
    return (
      <span className="flex flex-col gap-1">
        <span>{AMENDMENT_STATUS_LABELS[current.status]}</span>
        {current.status === "filed" && (
          <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => setAsking("withdrawn")}>
            Withdraw…
          </button>
        )}
        {dialog}
      </span>
    );
  const options = statuses.filter((s) => s !== "draft");
  return (
    <span className="flex flex-col gap-1">
      <span className="flex flex-wrap items-center gap-1">
        <label className="sr-only" htmlFor={`st-${id}`}>Status</label>
        <select id={`st-${id}`} className="gw-input mt-0 w-auto py-0.5 text-sm" value={chosen} disabled={busy} onChange={(e) => setChosen(e.target.value as Status)}>
          {options.map((s) => <option key={s} value={s}>{AMENDMENT_STATUS_LABELS[s]}</option>)}
        </select>
        {chosen !== current.status && (
          <button type="button" className="gw-btn-quiet px-2 py-0.5" disabled={busy} onClick={() => setAsking(chosen)}>
            Change status…
          </button>
        )}
      </span>
      {!asking && <Alert look="inline" className="max-w-xs">{error}</Alert>}
      {dialog}
    </span>
  );
}
