import { useCallback, useEffect, useRef, useState } from "react";
import { apiCall, ApiError } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import { Alert } from "../shared/Alert.tsx";
import ConfirmBox from "./ConfirmBox.tsx";
import FloorHistory from "./FloorHistory.tsx";
import LegalMovesList from "./LegalMovesList.tsx";
import { recordedSchema, sittingSchema, type PendingItem, type Sitting } from "./schemas.ts";
import VoteForm, { type Outcome } from "./VoteForm.tsx";
import { questionName, shortQuestionName } from "../../lib/procedure/question-name.ts";

interface Props {
  sittingId: string;
  canRecord: boolean;
}

const STAGE_LABELS = { made: "Moved", seconded: "Seconded", stated: "Stated by the chair" } as const;

/** The live board of one sitting: pending stack, floor facts, legal moves, history; clerks record events here. */
export default function FloorBoard({ sittingId, canRecord }: Props) {
  const [data, setData] = useState<Sitting | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [live, setLive] = useState<"connecting" | "live" | "offline">("connecting");
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const [outOfOrder, setOutOfOrder] = useState<string | null>(null);
  const [motion, setMotion] = useState("");
  const [text, setText] = useState("");
  const [mover, setMover] = useState("");
  const [ref, setRef] = useState("");
  const [admitted, setAdmitted] = useState(false);
  const [speaker, setSpeaker] = useState("");
  const [withdrawing, setWithdrawing] = useState<string | null>(null);
  const [switching, setSwitching] = useState(false);
  const latest = useRef(0);
  const noticeRef = useRef<HTMLParagraphElement>(null);

  const load = useCallback(async () => {
    try {
      const d = await apiCall(sittingSchema, `/api/floor/sittings/${sittingId}`);
      if (d.sitting.revision >= latest.current) {
        latest.current = d.sitting.revision;
        setData(d);
      }
      setError(null);
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not load the floor.");
    }
  }, [sittingId]);

  useEffect(() => {
    void load();
    const es = new EventSource(`/api/floor/sittings/${sittingId}/stream`);
    es.addEventListener("ready", () => {
      setLive("live");
      void load();
    });
    es.addEventListener("floor", () => void load());
    es.onerror = () => setLive(es.readyState === EventSource.CLOSED ? "offline" : "connecting");
    return () => es.close();
  }, [sittingId, load]);

  /** Send one entry; the outcome goes back to the form that asked, which shows its own errors. */
  async function post(event: Record<string, unknown>): Promise<Outcome> {
    if (!data) return { ok: false, error: new Error("The floor is not loaded yet.") };
    setBusy(true);
    setNotice(null);
    setOutOfOrder(null);
    try {
      const r = await apiCall(recordedSchema, `/api/floor/sittings/${sittingId}/events`, { method: "POST", body: { revision: data.sitting.revision, event } });
      await load();
      setNotice(`Recorded: ${r.summary}`);
      requestAnimationFrame(() => noticeRef.current?.focus());
      return { ok: true };
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) await load();
      return { ok: false, error: e };
    } finally {
      setBusy(false);
    }
  }

  /** Record an entry from a button or a form without fields of its own: refusals are shown at the top of the form. */
  async function record(event: Record<string, unknown>) {
    const r = await post(event);
    if (r.ok) return true;
    const e = r.error;
    if (e instanceof ApiError && e.code === "unprocessable" && e.details?.reasons) setOutOfOrder(e.message);
    else setNotice(e instanceof Error ? e.message : "Not recorded.");
    requestAnimationFrame(() => noticeRef.current?.focus());
    return false;
  }

  if (error && !data) return <Alert>{error}</Alert>;
  if (!data) return <p className="text-ink-soft">Loading the floor…</p>;
  const { board, sitting } = data;
  const top = board.pending[board.pending.length - 1];
  const open = sitting.status === "open";
  const stack = [...board.pending].reverse();

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
      <div className="space-y-5">
        <h2 className="text-step-2" data-testid="sitting-title">{sitting.title}</h2>
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className={`gw-chip ${live === "live" ? "border-verdict-ok text-verdict-ok" : "border-brass text-brass-text"}`} data-testid="live-status">
            {live === "live" ? "● Live" : live === "connecting" ? "Connecting…" : "Offline — reload to reconnect"}
          </span>
          <span className="text-ink-soft">
            {open ? "Open" : "Closed"} · judged by rulebook version {data.rulebook.number} ({data.rulebook.title})
          </span>
        </div>
        {open && data.superseded && data.inForce && (
          <section role="alert" aria-labelledby="superseded-h" className="rounded-md border-2 border-verdict-bar bg-verdict-bar-tint p-4" data-testid="superseded">
            <h2 id="superseded-h" className="text-step-1 text-verdict-bar">This sitting is judged by a rulebook version no longer in force</h2>
            <p className="mt-1">
              The floor here, and every legal move on this page, follows version {data.rulebook.number} ({data.rulebook.title}). Version {data.inForce.number} ({data.inForce.title}) has been in force since {when(data.inForce.since)}.
            </p>
            {canRecord && open && !switching && (
              <button type="button" className="gw-btn mt-2" disabled={busy} onClick={() => setSwitching(true)}>
                Judge this sitting by version {data.inForce.number}…
              </button>
            )}
            {canRecord && open && switching && (
              <div className="mt-2">
                <ConfirmBox testId="switch-confirm" yes={`Yes, judge it by version ${data.inForce.number}`} no="Not now" busy={busy} onYes={async () => { if (await record({ kind: "rulebook", version: data.inForce!.versionId })) setSwitching(false); }} onNo={() => setSwitching(false)}>
                  From now on, judge “{sitting.title}” by rulebook version {data.inForce.number} ({data.inForce.title})? The change is recorded on the floor record; what was recorded so far stays as it is.
                </ConfirmBox>
              </div>
            )}
            {!canRecord && open && <p className="mt-1 text-sm">A clerk can move the sitting to the version in force.</p>}
          </section>
        )}

        <section aria-labelledby="stack-h" className="gw-card">
          <h2 id="stack-h" className="text-step-1">Pending questions</h2>
          {stack.length === 0 ? (
            <p className="mt-2 text-ink-soft" data-testid="stack-empty">No question is pending.</p>
          ) : (
            <ol className="mt-2 space-y-2" data-testid="pending-stack">
              {stack.map((p, i) => (
                <li key={p.key} className={`rounded-md border px-3 py-2 ${i === 0 ? "border-chamber bg-chamber-tint" : "border-rule bg-white"}`} data-motion={p.motion}>
                  <div className="flex flex-wrap items-center gap-2">
                    {i === 0 && <span className="gw-chip border-chamber text-chamber-dark">Immediately pending</span>}
                    <span className="font-semibold">{nameOf(board.pending, p.key)}</span>
                    {p.degree !== null && <span className="text-sm text-ink-soft">degree {p.degree}</span>}
                    <span className="gw-chip border-rule text-ink-soft">{STAGE_LABELS[p.stage]}</span>
                    {p.debateBegun && <span className="gw-chip border-brass text-brass-text">In debate</span>}
                  </div>
                  {p.text && p.text.length > 80 && <p className="mt-1 font-serif">{p.text}</p>}
                  {p.mover && <p className="text-sm text-ink-soft">Moved by {p.mover}</p>}
                  {canRecord && open && withdrawing !== p.key && (
                    <button type="button" className="gw-btn-quiet mt-1" disabled={busy} onClick={() => setWithdrawing(p.key)}>
                      Withdraw {shortLabel(p)}…
                    </button>
                  )}
                  {canRecord && open && withdrawing === p.key && (
                    <div className="mt-2">
                      <ConfirmBox testId="withdraw-confirm" danger yes="Yes, withdraw it" no="Keep it" busy={busy} onYes={async () => { if (await record({ kind: "withdrawn", key: p.key })) setWithdrawing(null); }} onNo={() => setWithdrawing(null)}>
                        Withdraw {nameOf(board.pending, p.key)}?{i > 0 ? ` ${i === 1 ? "The question above it leaves" : `The ${i} questions above it leave`} the floor with it.` : ""}
                      </ConfirmBox>
                    </div>
                  )}
                </li>
              ))}
            </ol>
          )}
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm">
            <dt className="text-ink-soft">Has the floor</dt>
            <dd data-testid="speaker">{board.speaker ?? "No one"}</dd>
            <dt className="text-ink-soft">Debate begun</dt>
            <dd>{top ? (top.debateBegun ? "Yes" : "Not yet") : "—"}</dd>
            <dt className="text-ink-soft">Chair has just ruled</dt>
            <dd>{board.chairHasRuled ? "Yes (an appeal lies)" : "No"}</dd>
            <dt className="text-ink-soft">On the table</dt>
            <dd>{board.tabled}</dd>
            <dt className="text-ink-soft">Last vote</dt>
            <dd>
              {board.lastVote
                ? `${board.lastVote.name}: ${board.lastVote.result}${board.lastVote.tally ? ` (${board.lastVote.tally.yes}–${board.lastVote.tally.no}${board.lastVote.tally.abstain ? `, ${board.lastVote.tally.abstain} abstaining` : ""})` : ""}`
                : "None yet"}
            </dd>
          </dl>
        </section>

        {canRecord && open && (
          <section aria-labelledby="record-h" className="gw-card space-y-4">
            <h2 id="record-h" className="text-step-1">Record the floor</h2>
            <p ref={noticeRef} tabIndex={-1} role="status" className="text-sm font-semibold empty:hidden" data-testid="record-notice">{notice}</p>
            <Alert>{outOfOrder}</Alert>
            <form
              className="space-y-2"
              onSubmit={async (e) => {
                e.preventDefault();
                if (!motion) return;
                if (await record({ kind: "made", motion, text, mover, ref, overrule: admitted })) {
                  setMotion("");
                  setMover("");
                  setText("");
                  setRef("");
                  setAdmitted(false);
                }
              }}
            >
              <h3 className="text-step-0 font-semibold">A motion is made</h3>
              <label className="gw-label" htmlFor="rec-motion">Motion</label>
              <select id="rec-motion" className="gw-input" value={motion} onChange={(e) => setMotion(e.target.value)} required>
                <option value="">Choose a motion…</option>
                <optgroup label="In order now">
                  {data.moves.filter((m) => m.inOrder).map((m) => <option key={m.motion} value={m.motion}>{m.name}</option>)}
                </optgroup>
                <optgroup label="Out of order now">
                  {data.moves.filter((m) => !m.inOrder).map((m) => <option key={m.motion} value={m.motion}>{m.name}</option>)}
                </optgroup>
              </select>
              <label className="gw-label" htmlFor="rec-text">Wording (optional)</label>
              <input id="rec-text" className="gw-input" value={text} maxLength={2000} onChange={(e) => setText(e.target.value)} />
              <label className="gw-label" htmlFor="rec-ref">Reference (optional, e.g. A2)</label>
              <input id="rec-ref" className="gw-input w-32" value={ref} maxLength={40} onChange={(e) => setRef(e.target.value)} />
              <label className="gw-label" htmlFor="rec-mover">Moved by (optional)</label>
              <input id="rec-mover" className="gw-input" value={mover} maxLength={200} onChange={(e) => setMover(e.target.value)} />
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" checked={admitted} onChange={(e) => setAdmitted(e.target.checked)} /> The chair admitted it although the rulebook finds it out of order
              </label>
              <button className="gw-btn" disabled={busy || !motion}>Record motion made</button>
            </form>

            {top && (
              <div className="space-y-2 border-t border-rule pt-3">
                <h3 className="text-step-0 font-semibold">On the immediately pending question: {data.question?.name ?? top.name}</h3>
                <div className="flex flex-wrap gap-2">
                  <button type="button" className="gw-btn-quiet" disabled={busy || top.stage !== "made"} onClick={() => void record({ kind: "seconded" })}>Seconded</button>
                  <button type="button" className="gw-btn-quiet" disabled={busy || top.stage === "stated"} onClick={() => void record({ kind: "stated" })}>Stated by the chair</button>
                  <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => void record({ kind: "floor", debateBegun: !top.debateBegun })}>{top.debateBegun ? "Debate not begun" : "Debate begun"}</button>
                </div>
                {data.question && <VoteForm question={data.question} busy={busy} record={post} />}
              </div>
            )}

            <div className="space-y-2 border-t border-rule pt-3">
              <h3 className="text-step-0 font-semibold">The floor</h3>
              <form
                className="flex flex-wrap items-end gap-2"
                onSubmit={async (e) => {
                  e.preventDefault();
                  if (await record({ kind: "floor", speaker: speaker.trim() || null })) setSpeaker("");
                }}
              >
                <label className="min-w-48 flex-1 text-sm">
                  <span className="gw-label">Member recognised (blank: no one)</span>
                  <input className="gw-input" value={speaker} maxLength={200} onChange={(e) => setSpeaker(e.target.value)} />
                </label>
                <button className="gw-btn-quiet" disabled={busy}>Set who has the floor</button>
              </form>
              <div className="flex flex-wrap gap-2">
                <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => void record({ kind: "floor", chairHasRuled: !board.chairHasRuled })}>{board.chairHasRuled ? "Appeal time over" : "The chair has ruled"}</button>
                <button type="button" className="gw-btn-quiet" disabled={busy} aria-pressed={board.committeeOfTheWhole} onClick={() => void record({ kind: "floor", committeeOfTheWhole: !board.committeeOfTheWhole })}>{board.committeeOfTheWhole ? "Leave Committee of the Whole" : "Into Committee of the Whole"}</button>
                <button type="button" className="gw-btn-danger" disabled={busy} onClick={() => { if (confirm("Close this sitting? Nothing more can be recorded in it.")) void record({ kind: "close" }); }}>Close the sitting</button>
              </div>
            </div>
          </section>
        )}

        <section aria-labelledby="hist-h" className="gw-card">
          <h2 id="hist-h" className="text-step-1">History of the sitting</h2>
          <FloorHistory history={data.history} canCorrect={canRecord && open} busy={busy} record={post} />
        </section>
      </div>
      <LegalMovesList moves={data.moves} caption={`revision ${sitting.revision}`} />
    </div>
  );
}

function nameOf(pending: PendingItem[], key: string): string {
  return questionName(pending, pending.findIndex((p) => p.key === key));
}
/** "Amendment A2", "Main motion M1", "the amendment (degree 2)" — for a button label. */
function shortLabel(item: PendingItem): string {
  return item.degree !== null && !item.ref ? `the amendment (degree ${item.degree})` : shortQuestionName(item);
}
