import { useState } from "react";
import { z } from "zod";
import { AMENDMENT_STATUS_LABELS, type AmendmentStatus as Status } from "../../lib/measures/measure-schemas.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

interface Props {
  id: string;
  status: Status;
  version: number;
  /** Clerks set any status; the filer may withdraw or file a draft. */
  clerk: boolean;
  statuses: Status[];
}

/** Change an amendment's status, sending the version it was read at; a stale change shows what changed. */
export default function AmendmentStatus({ id, status, version, clerk, statuses }: Props) {
  const [current, setCurrent] = useState({ status, version });
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const row = z.object({ status: z.enum(statuses as [Status, ...Status[]]), version: z.number() });

  async function send(url: string, body: Record<string, unknown>) {
    setBusy(true);
    setError(null);
    try {
      const out = await apiCall(row, url, { method: url.endsWith("/file") ? "POST" : "PATCH", body });
      setCurrent({ status: out.status, version: out.version });
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
  const options = clerk ? statuses.filter((s) => s !== "draft") : ([current.status, "withdrawn"] as Status[]).filter((s, i, a) => a.indexOf(s) === i);
  return (
    <span className="flex flex-col gap-1">
      <label className="sr-only" htmlFor={`st-${id}`}>Status</label>
      <select id={`st-${id}`} className="gw-input mt-0 py-0.5 text-sm" value={current.status} disabled={busy} onChange={(e) => void send(`/api/amendments/${id}`, { version: current.version, status: e.target.value })}>
        {options.map((s) => <option key={s} value={s}>{AMENDMENT_STATUS_LABELS[s]}</option>)}
      </select>
      <Alert look="inline" className="max-w-xs">{error}</Alert>
    </span>
  );
}
