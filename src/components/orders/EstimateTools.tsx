/** Sharing (author only) and duplicating an estimate. */
import { useEffect, useState } from "react";
import { z } from "zod";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

const ROLE_NAMES: Record<string, string> = { "chief-clerk": "Chief clerk", clerk: "Clerks", member: "Members", staff: "Staff", observer: "Observers" };
const optionsSchema = z.object({ people: z.array(z.object({ id: z.string(), name: z.string(), role: z.string() })), roles: z.array(z.string()) });

interface UploadTarget {
  kind: "ballots" | "spatial";
  scope: string[];
  basedOn: number;
  /** Dimension names of a spatial estimate (the CSV's coordinate columns). */
  dimensions: string[];
}

/** Upload a filled-in CSV as the next version of this estimate (same measure, amendments and kind). */
function UploadVersion({ estimateId, target }: { estimateId: string; target: UploadTarget }) {
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [issues, setIssues] = useState<Array<{ path: string; message: string }>>([]);
  const [busy, setBusy] = useState(false);
  const query = new URLSearchParams({ estimateId, basedOn: String(target.basedOn), scope: target.scope.join(","), kind: target.kind, ...(target.kind === "spatial" ? { dimensions: target.dimensions.join(",") } : {}) });
  const upload = async () => {
    if (!file) return;
    setBusy(true);
    setError(null);
    setIssues([]);
    try {
      await apiCall(z.object({ id: z.string(), version: z.number() }), `/api/estimates/import?${query}`, { method: "POST", raw: file, type: "text/csv" });
      window.location.href = `/orders/${estimateId}`;
    } catch (e) {
      if (e instanceof ApiError) {
        setError(e.message);
        setIssues(e.issues);
      } else setError("The upload failed. Nothing was saved.");
    } finally {
      setBusy(false);
    }
  };
  return (
    <details className="gw-card" data-testid="upload-version">
      <summary className="cursor-pointer font-semibold">Upload a CSV as version {target.basedOn + 1}…</summary>
      <p className="gw-hint mt-2">
        {target.kind === "ballots" ? "Columns: member, bloc, weight, ranking." : `Columns: member, bloc, weight, ${target.dimensions.join(", ")}.`} The amendments considered stay as they are.</p>
      <label className="gw-label mt-2">CSV file
        <input className="gw-input" type="file" accept=".csv,text/csv" onChange={(e) => { setFile(e.target.files?.[0] ?? null); setError(null); setIssues([]); }} />
      </label>
      <button type="button" className="gw-btn mt-2" disabled={!file || busy} onClick={() => void upload()}>Upload as a new version</button>
      <Alert issues={issues} className="mt-2">{error}</Alert>
    </details>
  );
}

export default function EstimateTools({ estimateId, canEdit, canDuplicate, sharedRoles, sharedUsers, upload }: { estimateId: string; canEdit: boolean; canDuplicate: boolean; sharedRoles: string[]; sharedUsers: string[]; upload?: UploadTarget | null }) {
  const [opts, setOpts] = useState<z.output<typeof optionsSchema> | null>(null);
  const [roles, setRoles] = useState(sharedRoles);
  const [users, setUsers] = useState(sharedUsers);
  const [msg, setMsg] = useState<string | null>(null);
  useEffect(() => {
    if (canEdit) apiCall(optionsSchema, "/api/estimates/options").then(setOpts, () => null);
  }, [canEdit]);
  const share = async () => {
    try {
      await apiCall(z.looseObject({ id: z.string() }), `/api/estimates/${estimateId}/sharing`, { method: "PUT", body: { sharedRoles: roles, sharedUsers: users } });
      setMsg(roles.length || users.length ? "Sharing saved." : "Sharing saved: only you can see this estimate.");
    } catch (e) {
      setMsg(e instanceof ApiError ? e.message : "Could not save the sharing.");
    }
  };
  const duplicate = async () => {
    try {
      const r = await apiCall(z.object({ id: z.string() }), `/api/estimates/${estimateId}/duplicate`, { method: "POST", body: {} });
      window.location.href = `/orders/${r.id}`;
    } catch (e) {
      setMsg(e instanceof ApiError ? e.message : "Could not duplicate.");
    }
  };
  return (
    <div className="flex flex-wrap items-start gap-4">
      {canEdit && opts && (
        <details className="gw-card">
          <summary className="cursor-pointer font-semibold">Share…</summary>
          <fieldset className="mt-2">
            <legend className="gw-label">Roles that may read it</legend>
            {opts.roles.map((r) => (
              <label key={r} className="mr-3 inline-flex items-center gap-1 text-sm"><input type="checkbox" checked={roles.includes(r)} onChange={(e) => setRoles(e.target.checked ? [...roles, r] : roles.filter((x) => x !== r))} />{ROLE_NAMES[r] ?? r}</label>
            ))}
          </fieldset>
          <fieldset className="mt-2">
            <legend className="gw-label">People who may read it</legend>
            {opts.people.map((p) => (
              <label key={p.id} className="mr-3 inline-flex items-center gap-1 text-sm"><input type="checkbox" checked={users.includes(p.id)} onChange={(e) => setUsers(e.target.checked ? [...users, p.id] : users.filter((x) => x !== p.id))} />{p.name}</label>
            ))}
          </fieldset>
          <button className="gw-btn mt-2" onClick={() => void share()}>Save sharing</button>
        </details>
      )}
      {canEdit && upload && <UploadVersion estimateId={estimateId} target={upload} />}
      {canDuplicate && <button className="gw-btn-quiet" onClick={() => void duplicate()}>Duplicate as my own what-if</button>}
      <Alert tone="ok">{msg}</Alert>
    </div>
  );
}
