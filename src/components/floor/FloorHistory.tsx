import { useState } from "react";
import { when } from "../shared/dates.ts";
import { Alert } from "../shared/Alert.tsx";
import ConfirmBox from "./ConfirmBox.tsx";
import VoteFields from "./VoteFields.tsx";
import type { HistoryLine } from "./schemas.ts";
import { checkDraft, EMPTY_VOTE, showRefusal, voteWords, type VoteDraft, type VoteEvent, type VoteField } from "./vote-entry.ts";
import type { Outcome } from "./VoteForm.tsx";

const NOT_CORRECTABLE = new Set(["strike", "rulebook", "close"]);

interface Props {
  history: HistoryLine[];
  canCorrect: boolean;
  busy: boolean;
  record: (event: Record<string, unknown>) => Promise<Outcome>;
}

/** The sitting's record in order. Entries are never edited: a correction strikes one out, with who and why, shown here struck through. */
export default function FloorHistory({ history, canCorrect, busy, record }: Props) {
  const [open, setOpen] = useState<number | null>(null);
  return (
    <ol className="mt-2 space-y-2 text-sm" data-testid="history">
      {history.map((h) => (
        <li key={h.seq} data-testid="history-entry" data-seq={h.seq} data-struck={h.struck ? "yes" : "no"} className={h.strikes !== null ? "border-l-4 border-brass pl-2" : undefined}>
          <span className="text-ink-soft">{h.seq}. {when(h.at)}</span>{" "}
          {h.struck ? (
            <del className="text-ink-soft" data-testid="struck-summary">
              {h.summary}
            </del>
          ) : (
            <span>{h.summary}</span>
          )}
          {h.by ? <span className="text-ink-soft"> · recorded by {h.by}</span> : null}
          {h.struck && (
            <p className="mt-0.5 font-semibold text-verdict-bar" data-testid="struck-note">
              Struck out by entry {h.struck.entry}
              {h.struck.by ? `, by ${h.struck.by}` : ""}, {when(h.struck.at)}. Reason: {h.struck.reason}
            </p>
          )}
          {canCorrect && !h.struck && !NOT_CORRECTABLE.has(h.kind) && open !== h.seq && (
            <button type="button" className="gw-btn-quiet ml-2 py-0.5" aria-label={`Correct entry ${h.seq}`} disabled={busy} onClick={() => setOpen(h.seq)}>
              Correct…
            </button>
          )}
          {open === h.seq && <Correction line={h} busy={busy} record={record} onDone={() => setOpen(null)} />}
        </li>
      ))}
      {history.length === 0 && <li className="text-ink-soft">Nothing recorded yet.</li>}
    </ol>
  );
}

function Correction({ line, busy, record, onDone }: { line: HistoryLine; busy: boolean; record: Props["record"]; onDone: () => void }) {
  const isVote = line.kind === "voted";
  const [reason, setReason] = useState("");
  const [replace, setReplace] = useState(isVote);
  const [draft, setDraft] = useState<VoteDraft>(EMPTY_VOTE);
  const [errors, setErrors] = useState<Partial<Record<VoteField | "reason", string>>>({});
  const [confirm, setConfirm] = useState<{ reason: string; vote: VoteEvent | null } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [rosterSize, setRosterSize] = useState(0);
  const id = `fix-${line.seq}`;

  async function send(c: { reason: string; vote: VoteEvent | null }, againstCount = false) {
    setFailure(null);
    const r = await record({ kind: "strike", entry: line.seq, reason: c.reason, ...(c.vote ? { replacement: { kind: "voted", ...c.vote, againstCount } } : {}) });
    if (r.ok) return onDone();
    setConfirm(null);
    showRefusal(r.error, true, setErrors, setFailure);
  }

  return (
    <form
      className="mt-2 space-y-3 rounded-md border border-rule bg-white p-3"
      noValidate
      aria-label={`Correct entry ${line.seq}`}
      data-testid="correction"
      onSubmit={(e) => {
        e.preventDefault();
        const errs: Partial<Record<VoteField | "reason", string>> = {};
        if (!reason.trim()) errs.reason = "Reason: say why the entry is struck out (it is kept on the record).";
        const v = replace ? checkDraft(draft, false, rosterSize) : { errors: {}, vote: null };
        Object.assign(errs, v.errors);
        setErrors(errs);
        setConfirm(Object.keys(errs).length ? null : { reason: reason.trim(), vote: v.vote });
      }}
    >
      <p className="font-semibold">Correct entry {line.seq}: the entry stays on the record, struck out, and the floor is recomputed without it.</p>
      <div>
        <label className="gw-label" htmlFor={`${id}-reason`}>Reason for the correction (required)</label>
        <textarea id={`${id}-reason`} className="gw-input" rows={2} maxLength={1000} value={reason} onChange={(e) => { setReason(e.target.value); setConfirm(null); setErrors({}); }} {...(errors.reason ? { "aria-invalid": true, "aria-describedby": `${id}-reason-err` } : {})} />
        {errors.reason && <p id={`${id}-reason-err`} className="gw-error">{errors.reason}</p>}
      </div>
      {isVote && (
        <>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={replace} onChange={(e) => { setReplace(e.target.checked); setConfirm(null); }} /> Record the right result in its place
          </label>
          {!replace && <p className="gw-hint">Without a result in its place, the question is pending again, as if the vote had not been recorded.</p>}
          {replace && <VoteFields id={id} value={draft} onChange={(v) => { setDraft(v); setConfirm(null); setErrors({}); }} errors={errors} needsCount={false} disabled={busy} onRoster={setRosterSize} />}
        </>
      )}
      <Alert>{failure}</Alert>
      {confirm ? (
        <ConfirmBox testId="correction-confirm" danger yes="Yes, strike it out" no="Go back" busy={busy} onYes={() => void send(confirm)} onNo={() => setConfirm(null)}>
          Strike out entry {line.seq} (“{line.summary}”) because “{confirm.reason}”{confirm.vote ? `, and record instead: ${voteWords(confirm.vote)}` : ""}?
        </ConfirmBox>
      ) : (
        <div className="flex flex-wrap gap-2">
          <button className="gw-btn-danger" disabled={busy}>Strike out entry {line.seq}…</button>
          <button type="button" className="gw-btn-quiet" onClick={onDone}>Cancel</button>
        </div>
      )}
    </form>
  );
}
