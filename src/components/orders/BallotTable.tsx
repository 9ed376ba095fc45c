/**
 * The ballots of an estimate as a table: one row per member or bloc, its weight, and a place for
 * each version of the measure (1 = best; equal places tie; blank = unranked). Saved as a new
 * version of the estimate; the page then shows the analysis of that version.
 */
import { useState } from "react";
import { z } from "zod";
import type { BallotRow } from "../../lib/estimates/estimate-content.ts";
import { placesFromRanking, rankingFromPlaces } from "../../lib/estimates/ranking-places.ts";
import { rankingText } from "../../lib/estimates/ballot-csv.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

interface Row {
  key: number;
  member: string;
  bloc: string;
  weight: string;
  places: Record<string, string>;
  /** Marked as ranking nothing: takes no part in the analysis. */
  unranked: boolean;
  /** The presiding officer's row (its ranking is the chair's vote under the rulebook's tie rule). */
  chair: boolean;
}

interface Props {
  estimateId: string;
  rows: BallotRow[];
  partial: "abstain" | "bottom";
  versions: Array<{ id: string; short: string; words: string }>;
  scope: string[];
  basedOn: number;
}

function toRows(rows: BallotRow[]): Row[] {
  return rows.map((r, i) => {
    const p = placesFromRanking(r.ranking);
    return { key: i, member: r.member, bloc: r.bloc, weight: String(r.weight), places: Object.fromEntries(Object.entries(p).map(([k, v]) => [k, String(v)])), unranked: r.unranked === true, chair: r.chair === true };
  });
}

/** A row's ranking (empty when nothing is filled in yet, or the row is marked unranked), or the first problem with it. */
function rankingOf(r: Row, order: string[], nameOf: (id: string) => string): { ranking: Array<string | string[]> } | { error: string } {
  if (r.unranked) return { ranking: [] };
  const places: Record<string, number | null> = {};
  for (const id of order) {
    const t = (r.places[id] ?? "").trim();
    if (!t) places[id] = null;
    else if (!/^\d{1,3}$/.test(t) || Number(t) < 1) return { error: `the place of ${nameOf(id)} must be a whole number from 1` };
    else places[id] = Number(t);
  }
  return { ranking: rankingFromPlaces(places, order) };
}

export default function BallotTable({ estimateId, rows: initial, partial: initialPartial, versions, scope, basedOn }: Props) {
  const [rows, setRows] = useState<Row[]>(() => toRows(initial));
  const [partial, setPartial] = useState(initialPartial);
  const [next, setNext] = useState(initial.length);
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [issues, setIssues] = useState<Array<{ path: string; message: string }>>([]);
  const [busy, setBusy] = useState(false);
  const order = versions.map((v) => v.id);
  const nameOf = (id: string) => versions.find((v) => v.id === id)?.short ?? id;

  const set = (i: number, part: Partial<Row>) => setRows((all) => all.map((r, j) => (j === i ? { ...r, ...part } : r)));
  const setPlace = (i: number, id: string, v: string) => setRows((all) => all.map((r, j) => (j === i ? { ...r, places: { ...r.places, [id]: v } } : r)));

  const problems = rows.map((r) => {
    if (!r.member.trim()) return "name the member or bloc";
    if (!/^\d{1,4}$/.test(r.weight.trim()) || Number(r.weight) < 1 || Number(r.weight) > 1000) return "weight must be a whole number from 1 to 1000";
    if (r.chair && Number(r.weight) !== 1) return "the chair's row has weight 1";
    const k = rankingOf(r, order, nameOf);
    return "error" in k ? k.error : null;
  });
  const unfilled = rows.filter((r) => !r.unranked && (() => { const k = rankingOf(r, order, nameOf); return "ranking" in k && k.ranking.length === 0; })()).length;
  const total = rows.reduce((a, r) => a + (Number(r.weight) || 0), 0);

  async function save() {
    setError(null);
    setIssues([]);
    const bad = problems.findIndex((p) => p !== null);
    if (bad >= 0) return setError(`Row ${bad + 1}: ${problems[bad]}.`);
    if (rows.length === 0) return setError("Add at least one row.");
    setBusy(true);
    try {
      const content = { kind: "ballots" as const, partial, rows: rows.map((r) => ({ member: r.member.trim(), bloc: r.bloc.trim(), weight: Number(r.weight), ranking: (rankingOf(r, order, nameOf) as { ranking: Array<string | string[]> }).ranking, ...(r.unranked ? { unranked: true } : {}), ...(r.chair ? { chair: true } : {}) })) };
      const fallback = unfilled > 0 ? `Ballots partly filled in; ${unfilled} row${unfilled === 1 ? "" : "s"} still to fill` : "Ballots edited in the table";
      await apiCall(z.object({ id: z.string(), version: z.number() }), `/api/estimates/${estimateId}/versions`, { method: "POST", body: { basedOn, scope, content, note: note.trim() || fallback } });
      window.location.href = `/orders/${estimateId}`;
    } catch (e) {
      if (e instanceof ApiError) {
        setError(e.message);
        setIssues(e.issues);
      } else setError("Could not save. Nothing was changed.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-3" data-testid="ballot-table">
      <p className="gw-hint">For each row give every version a place: 1 for the one it likes best, 2 for the next… Give two versions the same number to tie them; leave a box empty for a version it does not rank. Tick “Unranked” for a row that ranks nothing: it then takes no part in the analysis.</p>
      <p className={unfilled > 0 ? "font-semibold text-verdict-bar" : "text-sm text-ink-soft"} role="status" data-testid="rows-to-fill">{unfilled > 0 ? `${unfilled} of ${rows.length} row${rows.length === 1 ? "" : "s"} still to fill in (or mark unranked) before the estimate can be analysed.` : "Every row is filled in or marked unranked."}</p>
      <div className="relative overflow-x-auto" role="region" aria-label="Ballots" tabIndex={0}>
        <table className="gw-table">
          <thead>
            <tr>
              <th scope="col">Member or bloc</th>
              <th scope="col">Bloc</th>
              <th scope="col">Weight</th>
              <th scope="col">Unranked</th>
              {versions.map((v) => <th key={v.id} scope="col" title={v.words} className="min-w-[5rem] text-xs font-normal">{v.short}</th>)}
              <th scope="col">Ranking, best first</th>
              <th scope="col" title="The presiding officer's row (weight 1): its ranking gives the chair's vote under the rulebook's tie rule">Chair</th>
              <th scope="col"><span className="sr-only">Remove</span></th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => {
              const k = rankingOf(r, order, nameOf);
              const label = r.member.trim() || `Row ${i + 1}`;
              return (
                <tr key={r.key} className={problems[i] ? "bg-verdict-bar-tint" : undefined}>
                  <td><input className="gw-input mt-0 min-w-[10rem]" aria-label={`Row ${i + 1}: member or bloc`} value={r.member} onChange={(e) => set(i, { member: e.target.value })} maxLength={200} /></td>
                  <td><input className="gw-input mt-0 min-w-[8rem]" aria-label={`Row ${i + 1}: bloc`} value={r.bloc} onChange={(e) => set(i, { bloc: e.target.value })} maxLength={120} /></td>
                  <td><input className="gw-input mt-0 w-20" aria-label={`Row ${i + 1}: weight`} inputMode="numeric" value={r.weight} onChange={(e) => set(i, { weight: e.target.value })} /></td>
                  <td className="text-center"><input type="checkbox" aria-label={`${label}: unranked`} checked={r.unranked} onChange={(e) => set(i, { unranked: e.target.checked, ...(e.target.checked ? { places: {} } : {}) })} /></td>
                  {versions.map((v) => (
                    <td key={v.id}><input className="gw-input mt-0 w-14 text-center" aria-label={`${label}: place of ${v.short}`} inputMode="numeric" disabled={r.unranked} value={r.places[v.id] ?? ""} onChange={(e) => setPlace(i, v.id, e.target.value)} /></td>
                  ))}
                  <td className="text-xs">{"error" in k ? <span className="text-verdict-bar">{k.error}</span> : r.unranked ? <span className="text-ink-soft">unranked</span> : k.ranking.length === 0 ? <span className="text-verdict-bar">not filled in yet</span> : rankingText(k.ranking.map((x) => (typeof x === "string" ? nameOf(x) : x.map(nameOf))))}</td>
                  <td><input type="checkbox" aria-label={`${label}: the chair`} checked={r.chair} onChange={(e) => setRows((all) => all.map((x, j) => ({ ...x, chair: j === i ? e.target.checked : e.target.checked ? false : x.chair })))} /></td>
                  <td><button type="button" className="gw-btn-quiet px-2 py-0.5" aria-label={`Remove row ${i + 1}`} onClick={() => setRows((all) => all.filter((_, j) => j !== i))}>✕</button></td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <button type="button" className="gw-btn-quiet" onClick={() => { setRows((all) => [...all, { key: next, member: "", bloc: "", weight: "1", places: {}, unranked: false, chair: false }]); setNext((n) => n + 1); }}>Add a row</button>
        <label className="gw-label">Versions a row leaves out
          <select className="gw-input" value={partial} onChange={(e) => setPartial(e.target.value as "abstain" | "bottom")}>
            <option value="abstain">abstain between them</option>
            <option value="bottom">rank below every listed version</option>
          </select>
        </label>
        <label className="gw-label grow">Note for this version (optional)
          <input className="gw-input" value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} placeholder="e.g. after the whips' Tuesday count" />
        </label>
      </div>
      <p className="text-sm">{rows.length} row{rows.length === 1 ? "" : "s"}, {total} votes in all.</p>
      <details className="text-sm">
        <summary className="cursor-pointer">The versions in full ({versions.length})</summary>
        <ul className="mt-1 list-disc pl-6">{versions.map((v) => <li key={v.id}><strong>{v.short}</strong>: {v.words}</li>)}</ul>
      </details>
      <Alert issues={issues}>{error}</Alert>
      <button type="button" className="gw-btn" disabled={busy} onClick={() => void save()}>Save as version {basedOn + 1}</button>
    </div>
  );
}
