/**
 * Build an estimate from a CSV file: choose the measure and the amendments to consider, download the
 * template, pick the filled-in file, preview it (row-precise errors), then save it as a new estimate.
 */
import { useEffect, useState } from "react";
import { z } from "zod";
import { Alert } from "../shared/Alert.tsx";
import { useLatestAnswer } from "../shared/useLatestAnswer.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { versionSchema } from "./api.ts";

const optionsSchema = z.object({ measures: z.array(z.object({ id: z.string(), number: z.string(), title: z.string() })) });
const versionsSchema = z.object({ pending: z.array(z.object({ key: z.string(), label: z.string(), title: z.string().nullable(), target: z.string(), form: z.string(), outOfOrder: z.string().nullable().optional() })), versions: z.array(versionSchema.extend({ amendments: z.array(z.string()) })) });
const previewSchema = z.object({ preview: z.literal(true), content: z.object({ kind: z.string(), rows: z.array(z.object({ member: z.string(), bloc: z.string(), weight: z.number(), ranking: z.array(z.union([z.string(), z.array(z.string())])), chair: z.boolean().optional() })).optional(), members: z.array(z.object({ member: z.string(), bloc: z.string(), weight: z.number(), ideal: z.array(z.number()) })).optional() }) });

export default function NewEstimate() {
  const [measures, setMeasures] = useState<z.output<typeof optionsSchema>["measures"]>([]);
  const [measureId, setMeasureId] = useState("");
  const [tree, setTree] = useState<z.output<typeof versionsSchema> | null>(null);
  const [scope, setScope] = useState<string[]>([]);
  const [title, setTitle] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<z.output<typeof previewSchema> | null>(null);
  const [issues, setIssues] = useState<Array<{ path: string; message: string }>>([]);
  const [error, setError] = useState<string | null>(null);
  const [kind, setKind] = useState<"ballots" | "spatial">("ballots");
  const [dimensions, setDimensions] = useState("economy, environment");
  const [partial, setPartial] = useState<"abstain" | "bottom">("abstain");
  const [per, setPer] = useState<"bloc" | "member">("bloc");

  useEffect(() => {
    apiCall(optionsSchema, "/api/estimates/options").then((o) => {
      setMeasures(o.measures);
      if (o.measures[0]) setMeasureId(o.measures[0].id);
    }, () => setError("Could not load the measures."));
  }, []);
  // Only the answer for the latest choice counts: an earlier answer arriving late is dropped.
  useLatestAnswer(
    versionsSchema,
    measureId ? { url: `/api/estimates/versions?measureId=${measureId}&scope=${scope.join(",")}` } : null,
    (t) => {
      setTree(t);
      setError(null);
    },
    (e) => setError(e instanceof ApiError ? e.message : "Could not list the versions."),
  );
  useEffect(() => setPreview(null), [measureId, scope]);

  const query = (extra: Record<string, string>) => new URLSearchParams({ measureId, scope: scope.join(","), kind, partial, per, ...(kind === "spatial" ? { dimensions } : {}), ...extra }).toString();
  /** Start from the roster instead of a file: an unfilled draft (one row per bloc or member), filled in on the estimate's page. */
  const startBlank = async () => {
    setIssues([]);
    setError(null);
    if (!title.trim()) return setError("Give the estimate a title first.");
    try {
      const dims = dimensions.split(",").map((d) => d.trim()).filter(Boolean);
      const r = await apiCall(z.object({ id: z.string() }), "/api/estimates/roster", { method: "POST", body: { measureId, title: title.trim(), scope, kind, per, partial, ...(kind === "spatial" ? { dimensions: dims } : {}) } });
      window.location.href = `/orders/${r.id}`;
    } catch (e) {
      if (e instanceof ApiError) {
        setError(e.message);
        setIssues(e.issues);
      } else setError("Could not start the estimate. Nothing was saved.");
    }
  };
  const send = async (previewOnly: boolean) => {
    setIssues([]);
    setError(null);
    if (!file) return setError("Choose a CSV file first.");
    try {
      if (previewOnly) setPreview(await apiCall(previewSchema, `/api/estimates/import?${query({ preview: "1" })}`, { method: "POST", raw: file, type: "text/csv" }));
      else {
        const r = await apiCall(z.object({ id: z.string() }), `/api/estimates/import?${query({ title: title.trim() })}`, { method: "POST", raw: file, type: "text/csv" });
        window.location.href = `/orders/${r.id}`;
      }
    } catch (e) {
      setPreview(null);
      if (e instanceof ApiError) {
        setError(e.message);
        setIssues(e.issues);
      } else setError("The upload failed. Nothing was saved.");
    }
  };

  return (
    <div className="gw-card space-y-4">
      <h2 className="text-lg font-semibold">New estimate</h2>
      <div className="grid gap-4 md:grid-cols-2">
        <label className="gw-label">Measure
          <select className="gw-input" value={measureId} onChange={(e) => { setMeasureId(e.target.value); setScope([]); }}>
            {measures.map((m) => <option key={m.id} value={m.id}>{m.number} — {m.title}</option>)}
          </select>
        </label>
        <label className="gw-label">Title of the estimate
          <input className="gw-input" value={title} onChange={(e) => setTitle(e.target.value)} placeholder="e.g. Whips' count, Monday" maxLength={200} />
        </label>
        <label className="gw-label">Kind
          <select className="gw-input" value={kind} onChange={(e) => { setKind(e.target.value as "ballots" | "spatial"); setPreview(null); }}>
            <option value="ballots">Ranked ballots over the versions</option>
            <option value="spatial">Spatial: members' ideal points</option>
          </select>
        </label>
        <label className="gw-label">Rows
          <select className="gw-input" value={per} onChange={(e) => setPer(e.target.value as "bloc" | "member")}>
            <option value="bloc">One per bloc (weight = its size)</option>
            <option value="member">One per member</option>
          </select>
        </label>
        {kind === "ballots" && (
          <label className="gw-label">Versions a row leaves out
            <select className="gw-input" value={partial} onChange={(e) => { setPartial(e.target.value as "abstain" | "bottom"); setPreview(null); }}>
              <option value="abstain">abstain between them</option>
              <option value="bottom">rank below every listed version</option>
            </select>
          </label>
        )}
        {kind === "spatial" && (
          <label className="gw-label">Policy dimensions
            <input className="gw-input" value={dimensions} onChange={(e) => { setDimensions(e.target.value); setPreview(null); }} maxLength={800} />
            <span className="gw-hint block">Comma-separated names; the plot draws two.</span>
          </label>
        )}
      </div>
      {tree && (
        <fieldset>
          <legend className="gw-label">Pending amendments to consider</legend>
          <p className="gw-hint">A second-degree amendment needs the amendment it amends. Amendments that are out of order are not offered.</p>
          <div className="mt-1 flex flex-wrap gap-3">
            {tree.pending.filter((p) => !p.outOfOrder).map((p) => (
              <label key={p.key} className="inline-flex items-center gap-1 text-sm">
                <input type="checkbox" checked={scope.includes(p.key)} onChange={(e) => setScope(e.target.checked ? [...scope, p.key] : scope.filter((k) => k !== p.key))} />
                {p.label}{p.title ? ` (${p.title})` : ""}
              </label>
            ))}
          </div>
          {tree.pending.some((p) => p.outOfOrder) && (
            <p className="gw-hint mt-2" data-testid="not-offered">Not offered: {tree.pending.filter((p) => p.outOfOrder).map((p) => `${p.label}${p.title ? ` (${p.title})` : ""} — ${p.outOfOrder}`).join("; ")}.</p>
          )}
          <div className="mt-2 text-sm">
            <p>{tree.versions.length} versions to rank:</p>
            <ul className="mt-1 flex flex-wrap gap-x-2 gap-y-1" data-testid="versions-to-rank">
              {tree.versions.map((v) => <li key={v.id} title={v.words} className="max-w-full break-words rounded bg-vellum px-1">{v.short}</li>)}
            </ul>
          </div>
        </fieldset>
      )}
      <div className="flex flex-wrap items-end gap-3">
        <a className="gw-btn-quiet" href={`/api/estimates/template?${query({})}`} download>Download the CSV template</a>
        <label className="gw-label">CSV file
          <input className="gw-input" type="file" accept=".csv,text/csv" onChange={(e) => { setFile(e.target.files?.[0] ?? null); setPreview(null); setIssues([]); }} />
        </label>
        <button className="gw-btn-quiet" onClick={() => void send(true)} disabled={!file}>Preview</button>
        <button className="gw-btn" onClick={() => void send(false)} disabled={!file || !title.trim() || !preview}>Save estimate</button>
        <span className="text-sm text-ink-soft">or</span>
        <button className="gw-btn-quiet" onClick={() => void startBlank()} disabled={!measureId || !title.trim()}>Start from the roster and fill it in on the page</button>
      </div>
      <p className="gw-hint">{kind === "spatial" ? `Columns: member, bloc, weight, then one per dimension (${dimensions}). ` : ""}Ballots' columns: member, bloc, weight, ranking, and optionally chair ("yes" on the presiding officer's row, weight 1: its ranking gives the chair's vote under the rulebook's tie rule). Write the ranking best first with "&gt;" between places and "=" for equal ones, using the version names from the template's example row. Save the file as CSV UTF-8. Starting from the roster makes a draft to fill in on the page; it cannot be analysed until every row is filled in or marked unranked.</p>
      <Alert issues={issues}>{error}</Alert>
      {preview?.content.members && (
        <p className="font-semibold">Preview: {preview.content.members.length} ideal point{preview.content.members.length === 1 ? "" : "s"}, {preview.content.members.reduce((a, r) => a + r.weight, 0)} votes in all.</p>
      )}
      {preview?.content.rows && (
        <div>
          <h3 className="font-semibold">Preview: {preview.content.rows.length} row{preview.content.rows.length === 1 ? "" : "s"}, {preview.content.rows.reduce((a, r) => a + r.weight, 0)} votes in all</h3>
          <div className="relative mt-1 overflow-x-auto" role="region" aria-label="Preview of the rows" tabIndex={0}>
          <table className="gw-table">
            <thead><tr><th scope="col">Member or bloc</th><th scope="col">Bloc</th><th scope="col">Weight</th><th scope="col">Ranking, best first</th></tr></thead>
            <tbody>{preview.content.rows.slice(0, 50).map((r, i) => <tr key={i}><td>{r.member}{r.chair ? " (chair)" : ""}</td><td>{r.bloc}</td><td>{r.weight}</td><td className="text-xs">{r.ranking.map((x) => (typeof x === "string" ? [x] : x).map((id) => tree?.versions.find((v) => v.id === id)?.short ?? id).join(" = ")).join(" > ")}</td></tr>)}</tbody>
          </table>
          </div>
        </div>
      )}
    </div>
  );
}
