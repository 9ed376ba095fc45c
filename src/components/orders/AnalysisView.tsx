/**
 * The order analysis of one estimate: starts a run (off the request path, on the server's worker
 * threads), polls its progress, then shows the versions, the majority graph and sets, the outcome
 * counts, findings, the orders (paged, filtered, CSV) and the walk-through of a chosen order.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import { z } from "zod";
import { ApiError, apiCall } from "../shared/api.ts";
import { ordersPageSchema, runResultSchema, walkSchema, type Step } from "./api.ts";
import MajorityGraph from "./MajorityGraph.tsx";
import MajorityMatrix from "./MajorityMatrix.tsx";
import { cycleSentence, graphSelection } from "../../lib/estimates/majority-matrix.ts";
import OutcomeChart from "./OutcomeChart.tsx";
import { thresholdInWords } from "../../lib/estimates/version-words.ts";
import { Alert } from "../shared/Alert.tsx";
import { TableHead } from "../shared/TableHead.tsx";

type RunResult = z.output<typeof runResultSchema>;
type OrdersPage = z.output<typeof ordersPageSchema>;
type Walk = z.output<typeof walkSchema>;

const ADVISORY = "These are projections from an estimate, not a forecast of the vote. The presiding officer's rulings, the chamber's own rules and its counsel prevail.";
const PHASES: Record<string, string> = { orders: "Counting legal orders", sincere: "Following sincere voting", sophisticated: "Working back from the last vote (sophisticated voting)", page: "Listing orders", listing: "Listing orders", done: "Done" };

export default function AnalysisView({ estimateId, version, userCanCancel = true }: { estimateId: string; version: number; userCanCancel?: boolean }) {
  const [result, setResult] = useState<RunResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState("");
  const [mode, setMode] = useState<"sincere" | "sophisticated">("sincere");
  const [page, setPage] = useState(1);
  const [orders, setOrders] = useState<OrdersPage | null>(null);
  const [walk, setWalk] = useState<Walk | null>(null);
  const [showAll, setShowAll] = useState(false);

  const poll = useCallback(async (runId: string) => {
    for (;;) {
      const r = await apiCall(runResultSchema, `/api/analysis/runs/${runId}`);
      setResult(r);
      if (r.run.status !== "running") return r;
      await new Promise((res) => setTimeout(res, 400));
    }
  }, []);

  // A link may name a run of this estimate version (e.g. back from the chair's script, or a run under
  // another rulebook version): show that run once instead of starting a new one.
  const given = useRef(typeof window === "undefined" ? null : new URLSearchParams(window.location.search).get("run"));
  const start = useCallback(async () => {
    setBusy(true);
    setError(null);
    setWalk(null);
    try {
      const runId = given.current;
      given.current = null;
      if (runId) {
        const r = await apiCall(runResultSchema, `/api/analysis/runs/${encodeURIComponent(runId)}`).catch(() => null);
        if (r && r.run.estimateId === estimateId && r.run.estimateVersion === version) {
          await poll(runId);
          return;
        }
      }
      const s = await apiCall(z.object({ runId: z.string() }), "/api/analysis/runs", { method: "POST", body: { estimateId, version } });
      await poll(s.runId);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The analysis could not be started.");
    } finally {
      setBusy(false);
    }
  }, [estimateId, version, poll]);

  useEffect(() => {
    void start();
  }, [start]);

  const runId = result?.run.status === "done" ? result.run.id : null;
  useEffect(() => {
    if (!runId) return;
    const q = new URLSearchParams({ page: String(page), pageSize: "10", mode, ...(outcome ? { outcome } : {}) });
    apiCall(ordersPageSchema, `/api/analysis/runs/${runId}/orders?${q}`).then(setOrders, () => setOrders(null));
  }, [runId, page, outcome, mode]);

  const open = async (order: string[]) => {
    if (!runId) return;
    try {
      setWalk(await apiCall(walkSchema, `/api/analysis/runs/${runId}/walk?order=${encodeURIComponent(order.join(","))}`));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Could not walk through that order.");
    }
  };

  // The walk-through answers the click: the page scrolls to it and focus moves to its heading.
  useEffect(() => {
    if (!walk) return;
    document.getElementById("walk-through")?.scrollIntoView({ behavior: "smooth" });
    document.getElementById("walk-h")?.focus();
  }, [walk]);

  const cancel = async () => {
    if (!result) return;
    await apiCall(z.looseObject({ run: z.object({ status: z.string() }) }), `/api/analysis/runs/${result.run.id}`, { method: "DELETE" }).catch(() => null);
  };

  if (error) return <div className="gw-card"><Alert>{error}</Alert><button className="gw-btn-quiet mt-2" onClick={() => void start()}>Try again</button></div>;
  if (!result || result.run.status === "running")
    return (
      <div className="gw-card" aria-live="polite">
        <p className="font-semibold">Analysing the voting orders…</p>
        <p className="gw-hint">{PHASES[result?.run.phase ?? ""] ?? "Starting the analysis"} — the work runs on the server; you can leave this page and come back.</p>
        <div className="mt-2 h-3 w-full overflow-hidden rounded bg-vellum" role="progressbar" aria-label="Analysis progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round((result?.run.progress ?? 0) * 100)}>
          <div className="h-full bg-chamber transition-all" style={{ width: `${Math.round((result?.run.progress ?? 0.02) * 100)}%` }} />
        </div>
        {userCanCancel && result && <button className="gw-btn-quiet mt-3" onClick={() => void cancel()} disabled={busy && !result}>Cancel</button>}
      </div>
    );
  if (result.run.status !== "done")
    return (
      <div className="gw-card">
        <Alert>{result.run.status === "cancelled" ? "The analysis was cancelled." : result.run.error?.stopped === "over-the-limit" ? result.run.error.message : `The analysis failed: ${result.run.error?.message ?? "unknown error"}`}</Alert>
        {result.run.error?.stopped === "over-the-limit" && result.run.error.limit && (
          <p className="gw-hint mt-1">Limit per analysis on this server: {String(result.run.error.limit.value)} {result.run.error.limit.unit === "s" ? "seconds" : "MB of memory"} (set by the operator).</p>
        )}
        <button className="gw-btn-quiet mt-2" onClick={() => void start()}>Run it again</button>
      </div>
    );

  const a = result.analysis!;
  const versions = result.versions!;
  const short = (id: string) => versions.find((v) => v.id === id)?.short ?? id;
  /** A question of an order in words: an amendment's key, a version by its short name, or final passage. */
  const ask = (q: string) => (q === "passage" ? "Final passage" : (result.labels?.amendments[q]?.label ?? short(q)));
  const m = a.majority;
  const graph = graphSelection(versions.map((v) => v.id), m.margins, m.topCycle, showAll);
  return (
    <div className="space-y-6">
      <p className="text-sm text-ink-soft">Rulebook: {result.run.rulebook}. Procedure: {a.procedure === "amendment" ? "amendment procedure (pairwise votes)" : "successive procedure (yes/no in turn)"}. {a.thresholds ? `Votes required: amendments ${thresholdInWords(a.thresholds.amendment)}; passage ${thresholdInWords(a.thresholds.passage)}${a.thresholds.passageFrom === "main-motion" ? " (the main motion's vote in the rulebook)" : ""}. ` : ""}{a.quorum ? (a.quorum.met === null ? `Quorum not checked (no membership known); ${a.quorum.present} attending. ` : `Quorum ${a.quorum.required}, ${a.quorum.present} attending. `) : ""}{a.tieRule && a.tieRule !== "motion-fails" ? `Tie rule: ${a.tieRule.replace(/-/g, " ")}. ` : ""}{result.run.cached ? "Answered from the stored analysis of identical inputs." : "Freshly computed."}</p>

      <section className="gw-card" aria-labelledby="findings-h">
        <h2 id="findings-h" className="text-lg font-semibold">Findings</h2>
        <p className="gw-advisory mt-2">{ADVISORY}</p>
        <ul className="mt-3 space-y-3">
          {result.findings!.map((f, i) => (
            <li key={i} className="border-l-4 border-chamber pl-3">
              <p className="font-semibold">{f.headline}</p>
              <p className="text-sm">{f.detail}</p>
              <p className="text-xs text-ink-soft">{f.caution}</p>
            </li>
          ))}
        </ul>
      </section>

      <section className="gw-card" aria-labelledby="versions-h">
        <h2 id="versions-h" className="text-lg font-semibold">The versions on the table</h2>
        <div className="relative mt-2 overflow-x-auto" role="region" aria-labelledby="versions-h" tabIndex={0}>
        <table className="gw-table">
          <thead><tr><th scope="col">Version</th><th scope="col">In plain words</th></tr></thead>
          <tbody>{versions.map((v) => <tr key={v.id}><th scope="row" className="text-left">{v.short}</th><td>{v.words}</td></tr>)}</tbody>
        </table>
        </div>
      </section>

      <section className="gw-card space-y-4" aria-labelledby="majority-h">
        <h2 id="majority-h" className="text-lg font-semibold">Head-to-head majorities</h2>
        <div className="grid gap-4 xl:grid-cols-2">
          <div className="min-w-0">
            <h3 className="font-semibold">Graph</h3>
            <p className="gw-hint">An arrow runs from the winner to the loser of each pairwise vote, with the margin.</p>
            {graph.note && (
              <p className="mt-1 text-sm" role="status" data-testid="graph-collapsed">{graph.note}{" "}<button type="button" className="gw-btn-quiet px-2 py-0.5" onClick={() => setShowAll(true)}>Show all {versions.length} versions</button></p>
            )}
            {showAll && versions.length > 8 && <p className="mt-1 text-sm">All {versions.length} versions are drawn. <button type="button" className="gw-btn-quiet px-2 py-0.5" onClick={() => setShowAll(false)}>Show only the top cycle</button></p>}
            <MajorityGraph versions={versions} margins={m.margins} highlight={m.condorcetWinner ? [] : m.topCycle} shown={graph.shown} />
          </div>
          <div className="min-w-0">
            <h3 className="font-semibold">Matrix</h3>
            <p className="gw-hint">Sort by a column with its button (Enter or Space); press it again to reverse.</p>
            <MajorityMatrix versions={versions} margins={m.margins} topCycle={m.topCycle} condorcetWinner={m.condorcetWinner} />
          </div>
        </div>
        <dl className="space-y-3 text-sm">
          <div><dt className="font-semibold">Condorcet winner</dt><dd>{m.condorcetWinner ? `${short(m.condorcetWinner)} — beats every other version head to head.` : `None: no version beats all the others; ${cycleSentence(m.topCycle, short)}.`}</dd></div>
          <div><dt className="font-semibold">Top cycle: {setInWords(m.topCycle, short, m.condorcetWinner ? "" : " (highlighted in the matrix)")}</dt><dd className="text-ink-soft">The smallest group of versions that each beat or tie every version outside it; sincere voting can end only here.</dd></div>
          <div><dt className="font-semibold">Uncovered set: {setInWords(m.uncoveredSet, short)}</dt><dd className="text-ink-soft">Versions no other version covers: y covers x when y beats x and every version that beats y also beats x (Gillies' variant on ties).</dd></div>
          <div><dt className="font-semibold">Banks set: {setInWords(m.banksSet, short)}{m.banksComplete ? "" : " (search stopped early; may be incomplete)"}</dt><dd className="text-ink-soft">Winners of strategic (sophisticated) voting under some order of pairwise votes: the tops of maximal chains of beating.</dd></div>
          <div><dt className="font-semibold">Legal orders of questions: {String(a.orders)}</dt><dd className="text-ink-soft">Orders allowed by the rulebook's voting constraints ({a.constraints.map(([x, y]) => `${ask(x)} before ${ask(y)}`).join("; ") || "none"}).</dd></div>
        </dl>
      </section>

      <section className="gw-card" aria-labelledby="outcomes-h">
        <h2 id="outcomes-h" className="text-lg font-semibold">Which outcome, under how many orders</h2>
        <OutcomeChart versions={versions} sincere={a.sincere} sophisticated={a.sophisticated} total={a.orders} />
      </section>

      <section className="gw-card" aria-labelledby="orders-h">
        <h2 id="orders-h" className="text-lg font-semibold">The legal orders</h2>
        <div className="mt-2 flex flex-wrap items-end gap-3">
          <label className="gw-label">Outcome
            <select className="gw-input" value={outcome} onChange={(e) => { setOutcome(e.target.value); setPage(1); }}>
              <option value="">Any outcome</option>
              {versions.map((v) => <option key={v.id} value={v.id}>{v.short}</option>)}
            </select>
          </label>
          <label className="gw-label">Under
            <select className="gw-input" value={mode} onChange={(e) => { setMode(e.target.value as "sincere" | "sophisticated"); setPage(1); }}>
              <option value="sincere">sincere voting</option>
              <option value="sophisticated">sophisticated voting</option>
            </select>
          </label>
          <a className="gw-btn-quiet" href={`/api/analysis/runs/${result.run.id}/orders?format=csv&mode=${mode}${outcome ? `&outcome=${encodeURIComponent(outcome)}` : ""}`} download>Export CSV</a>
        </div>
        {orders && (
          <>
            <div className="relative mt-3 overflow-x-auto" role="region" aria-labelledby="orders-h" tabIndex={0}>
            <table className="gw-table">
              <TableHead columns={["#", "Questions in order", "Sincere outcome", "Sophisticated outcome"]} actions />
              <tbody>
                {orders.orders.map((o) => (
                  <tr key={o.rank}>
                    <td>{o.rank}</td>
                    <td>{o.questions.map(ask).join(" → ")}</td>
                    <td>{o.sincereShort}</td>
                    <td>{o.sophisticatedShort}{o.sincere !== o.sophisticated && <span className="gw-chip ml-2 border-brass text-brass-text">differs</span>}</td>
                    <td className="whitespace-nowrap">
                      <button className="gw-btn-quiet" onClick={() => void open(o.questions)}>Walk through</button>{" "}
                      <a className="gw-btn-quiet" href={`/orders/${estimateId}/script?run=${result.run.id}&order=${encodeURIComponent(o.questions.join(","))}`}>Chair's script</a>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            </div>
            <div className="mt-2 flex flex-wrap items-center gap-3 text-sm">
              <button className="gw-btn-quiet" disabled={page <= 1} onClick={() => setPage(page - 1)}>Previous</button>
              <span>Page {page} of {Math.max(1, Math.ceil(orders.total / orders.pageSize))} · {orders.total} order{orders.total === 1 ? "" : "s"}{orders.complete ? "" : " (of the first listed)"}</span>
              <button className="gw-btn-quiet" disabled={page * orders.pageSize >= orders.total} onClick={() => setPage(page + 1)}>Next</button>
            </div>
          </>
        )}
      </section>

      {walk && (
        <section id="walk-through" className="gw-card" aria-labelledby="walk-h">
          <h2 id="walk-h" className="text-lg font-semibold" tabIndex={-1}>Vote by vote: {walk.walk.order.map(ask).join(" → ")}</h2>
          <p className="gw-advisory mt-2">{ADVISORY}</p>
          <div className="mt-3 grid gap-4 lg:grid-cols-2">
            <WalkColumn title="Sincere voting" note={a.procedure === "successive" ? "Successive procedure: a member votes for an amendment only if the text it makes is the member's first choice among the versions still within reach (the no-change option included); final passage sets the text reached against no change." : "Members vote for the version they prefer of the two before them."} steps={walk.walk.sincere.steps} outcome={walk.walk.sincere.outcome} short={short} ask={ask} />
            <WalkColumn title="Sophisticated voting" note="Members look ahead and vote for the branch that ends better for them." steps={walk.walk.sophisticated.steps} outcome={walk.walk.sophisticated.outcome} short={short} ask={ask} />
          </div>
          <a className="gw-btn mt-4" href={`/orders/${estimateId}/script?run=${result.run.id}&order=${encodeURIComponent(walk.walk.order.join(","))}`}>Open the chair's script for this order</a>
        </section>
      )}
    </div>
  );
}

/** A set of versions for a heading: named when short, otherwise counted (the matrix shows them). */
function setInWords(ids: string[], short: (id: string) => string, more = ""): string {
  return ids.length <= 6 ? ids.map(short).join(", ") : `${ids.length} versions${more}`;
}

function WalkColumn({ title, note, steps, outcome, short, ask }: { title: string; note: string; steps: Step[]; outcome: string; short: (id: string) => string; ask: (q: string) => string }) {
  return (
    <div>
      <h3 className="font-semibold">{title}</h3>
      <p className="gw-hint">{note}</p>
      <ol className="mt-2 space-y-2">
        {steps.map((s, i) => (
          <li key={i} className="rounded border border-rule p-2 text-sm">
            <span className="font-semibold">{ask(s.question)}</span>{" "}
            {!s.put ? <span className="text-ink-soft">— falls, not put</span> : (
              <>
                — {short(s.motion!)} against {short(s.base!)}:{" "}
                <span className={s.adopted ? "font-semibold text-verdict-ok" : "font-semibold text-verdict-bar"}>{s.adopted ? "adopted" : "rejected"}</span>
                {s.for !== undefined && <span> ({s.for} for, {s.against} against)</span>}
                {s.withinReach && s.withinReach.length > 0 && <span className="block text-xs text-ink-soft">Weighed against what was still within reach: {s.withinReach.map(short).join(", ")}</span>}
              </>
            )}
          </li>
        ))}
      </ol>
      <p className="mt-2 text-sm">Projected outcome: <strong>{short(outcome)}</strong></p>
    </div>
  );
}
