import { useState } from "react";
import { z } from "zod";
import { apiCall } from "../shared/api.ts";
import { Alert, errorText } from "../shared/Alert.tsx";
import ConfirmBox from "../floor/ConfirmBox.tsx";

interface Props {
  sittingId: string;
  sittingTitle: string;
  /** The floor record's revision the page shows. */
  revision: number;
  approved: boolean;
  /** The floor record changed since the journal was approved or last corrected. */
  recordChanged: boolean;
}

const stored = z.object({ seq: z.number(), kind: z.string() });

/** Approve the journal (once, with a confirmation that names the sitting), or record a correction with its reason. */
export default function JournalActions({ sittingId, sittingTitle, revision, approved, recordChanged }: Props) {
  const [confirming, setConfirming] = useState(false);
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [reasonIssue, setReasonIssue] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function send(url: string, body: unknown, message: string) {
    setBusy(true);
    setError(null);
    setReasonIssue(null);
    try {
      await apiCall(stored, url, { method: "POST", body });
      setDone(message);
      window.location.reload();
    } catch (e) {
      const issues = (e as { issues?: Array<{ path: string; message: string }> }).issues ?? [];
      const r = issues.find((i) => i.path === "reason");
      if (r) setReasonIssue(r.message);
      else setError(errorText(e, "Nothing was stored."));
    } finally {
      setBusy(false);
      setConfirming(false);
    }
  }

  if (!approved)
    return (
      <div className="space-y-3">
        <Alert>{error}</Alert>
        <Alert tone="ok">{done}</Alert>
        {confirming ? (
          <ConfirmBox yes="Approve the journal" no="Not yet" busy={busy} testId="approve-confirm" onNo={() => setConfirming(false)} onYes={() => send(`/api/floor/sittings/${sittingId}/journal`, { revision }, "The journal is approved.")}>
            Approve the journal of {sittingTitle} as the record? Once approved it is never edited: any later change is a correction, with its reason.
          </ConfirmBox>
        ) : (
          <button type="button" className="gw-btn" onClick={() => setConfirming(true)}>
            Approve the journal…
          </button>
        )}
      </div>
    );

  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        void send(`/api/floor/sittings/${sittingId}/journal/corrections`, { revision, reason }, "The correction is recorded.");
      }}
    >
      <Alert>{error}</Alert>
      <Alert tone="ok">{done}</Alert>
      <p className="text-sm">
        {recordChanged
          ? "The floor record has been corrected since the journal was approved. Record a correction to bring the journal in line with it, saying what changes and why."
          : "The approved journal is never edited. A correction regenerates it from the floor record as it now stands, with your reason kept beside it."}
      </p>
      <label className="flex flex-col text-sm font-semibold" htmlFor="journal-reason">
        Reason for the correction
      </label>
      <textarea id="journal-reason" className="gw-input w-full" rows={2} maxLength={1000} value={reason} onChange={(e) => setReason(e.target.value)} aria-invalid={reasonIssue ? true : undefined} aria-describedby={reasonIssue ? "journal-reason-issue" : undefined} />
      {reasonIssue && (
        <p id="journal-reason-issue" className="gw-error text-sm">
          {reasonIssue}
        </p>
      )}
      <button type="submit" className="gw-btn-quiet" disabled={busy}>
        Record the correction
      </button>
    </form>
  );
}
