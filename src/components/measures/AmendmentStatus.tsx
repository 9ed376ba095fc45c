import { useState } from "react";
import { z } from "zod";
import { AMENDMENT_STATUS_LABELS, type AmendmentStatus as Status } from "../../lib/measures/measure-schemas.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";

interface Props {
  id: string;
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
export default function AmendmentStatus({ id, words, status, version, clerk, statuses }: Props) {
  const [current, setCurrent] = useState({ status, version });
  const [chosen, setChosen] = useState<Status>(status);
  const [asking, setAsking] = useState<Status | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const row = z.object({ status: z.enum(statuses as [Status, ...Status[]]), version: z.number() });

  async function send(url: string, body: Record<string, unknown>) {
    setBusy(true);
    setError(null);
    try {
      const out = await apiCall(row, url, { method: url.endsWith("/file") ? "POST" : "PATCH", body });
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
        <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => void send(`/api/amendments/${id}/file`, { version: current.version })}>File now</button>
        <Alert look="inline">{error}</Alert>
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
