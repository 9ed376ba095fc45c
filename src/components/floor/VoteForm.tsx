import { useState } from "react";
import { ApiError } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import ConfirmBox from "./ConfirmBox.tsx";
import VoteFields from "./VoteFields.tsx";
import type { Question } from "./schemas.ts";
import { checkDraft, EMPTY_VOTE, showRefusal, voteWords, type VoteDraft, type VoteEvent, type VoteField } from "./vote-entry.ts";

export type Outcome = { ok: true } | { ok: false; error: unknown };

interface Props {
  question: Question;
  busy: boolean;
  record: (event: Record<string, unknown>) => Promise<Outcome>;
}

/**
 * The vote on the immediately pending question. The form is for the question it names: if
 * another question becomes pending while the clerk fills it in, it says so and records nothing
 * until the clerk starts again. Nothing is recorded without the confirmation that names the
 * question and the result; a count that does not give the declared result is recorded only when
 * the clerk says the chair declared it so.
 */
export default function VoteForm({ question, busy, record }: Props) {
  const [draft, setDraft] = useState<VoteDraft>(EMPTY_VOTE);
  const [disposesBelow, setDisposesBelow] = useState(false);
  const [errors, setErrors] = useState<Partial<Record<VoteField, string>>>({});
  const [forQuestion, setForQuestion] = useState<{ key: string; name: string } | null>(null);
  const [confirm, setConfirm] = useState<VoteEvent | null>(null);
  const [mismatch, setMismatch] = useState<{ message: string; vote: VoteEvent } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [rosterSize, setRosterSize] = useState(0);

  const target = forQuestion ?? { key: question.key, name: question.name };
  const retargeted = forQuestion !== null && forQuestion.key !== question.key;

  function reset() {
    setDraft(EMPTY_VOTE);
    setDisposesBelow(false);
    setErrors({});
    setForQuestion(null);
    setConfirm(null);
    setMismatch(null);
    setFailure(null);
  }

  function change(v: VoteDraft) {
    if (!forQuestion) setForQuestion({ key: question.key, name: question.name });
    setDraft(v);
    setErrors({});
    setConfirm(null);
    setMismatch(null);
  }

  async function send(vote: VoteEvent, againstCount: boolean) {
    setFailure(null);
    const r = await record({ kind: "voted", question: target.key, ...vote, disposesBelow, againstCount });
    if (r.ok) return reset();
    setConfirm(null);
    const e = r.error;
    if (e instanceof ApiError && e.details && (typeof e.details.countGives === "string" || e.details.noQuorum === true)) {
      setMismatch({ message: e.message, vote });
      return;
    }
    showRefusal(e, false, setErrors, setFailure);
  }

  return (
    <form
      className="space-y-3"
      noValidate
      aria-labelledby="vote-h"
      onSubmit={(e) => {
        e.preventDefault();
        if (retargeted) return;
        const c = checkDraft(draft, question.needsCount, rosterSize);
        setErrors(c.errors);
        setConfirm(c.vote);
      }}
    >
      <h3 id="vote-h" className="text-step-0 font-semibold">
        Vote on: <span data-testid="vote-question">{target.name}</span>
      </h3>
      <p className="gw-hint">Decided by {question.threshold}.</p>
      {retargeted && (
        <Alert look="box" testId="vote-retarget">
          <p className="font-semibold">The question pending changed while you were filling this in. Nothing was recorded.</p>
          <p className="mt-1">
            You began on: {forQuestion.name}. Now pending: {question.name}.
          </p>
          <button type="button" className="gw-btn-quiet mt-2" onClick={reset}>
            Start again on the question now pending
          </button>
        </Alert>
      )}
      <VoteFields id="vote" value={draft} onChange={change} errors={errors} needsCount={question.needsCount} disabled={busy || retargeted} rules={question} onRoster={setRosterSize} />
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={disposesBelow} disabled={busy || retargeted} onChange={(e) => { if (!forQuestion) setForQuestion({ key: question.key, name: question.name }); setDisposesBelow(e.target.checked); setConfirm(null); }} /> Adopting it disposes of the questions below (tabled, referred, postponed)
      </label>
      <Alert testId="vote-error">{mismatch ? null : failure}</Alert>
      {mismatch && (
        <ConfirmBox testId="vote-mismatch" yes={`The chair declared it ${mismatch.vote.result}: record it so`} no="Change the result or the count" busy={busy} onYes={() => void send(mismatch.vote, true)} onNo={() => setMismatch(null)}>
          {mismatch.message}
        </ConfirmBox>
      )}
      {confirm && !mismatch ? (
        <ConfirmBox testId="vote-confirm" yes="Yes, record it" no="Go back" busy={busy} onYes={() => void send(confirm, false)} onNo={() => setConfirm(null)}>
          Record: {target.name} — {voteWords(confirm)}?
        </ConfirmBox>
      ) : (
        !mismatch && (
          <button className="gw-btn" disabled={busy || retargeted}>
            Record the vote…
          </button>
        )
      )}
    </form>
  );
}
