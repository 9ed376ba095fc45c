import { useCallback, useEffect, useState, type SubmitEvent } from "react";
import { z } from "zod";
import { ApiError, apiCall } from "../shared/api.ts";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";
import { messageView, type ListView } from "../rulings/api.ts";
import DeliveryTable from "./DeliveryTable.tsx";
import { Alert } from "../shared/Alert.tsx";
import { dateInput, day, today } from "../shared/dates.ts";
import { describedBy, FieldMessages, issueLookup, noIssues, TextField, type IssueLookup } from "../shared/fields.tsx";

const sittingsView = z.object({
  sittings: z.array(
    z.object({
      id: z.string(),
      title: z.string(),
      status: z.string(),
      openedAt: z.string(),
    }),
  ),
});
const sentView = z.object({
  id: z.string(),
  listName: z.string(),
  subject: z.string(),
  queued: z.number(),
  skipped: z.array(z.object({ email: z.string() })).catch([]),
});
const detailView = z.object({
  messages: z.array(messageView),
  circulation: z.object({
    skipped: z.array(z.object({ email: z.string() })).catch([]),
  }),
});
const SEVERITIES = [
  { value: "error", label: "Out of order" },
  { value: "warning", label: "Query" },
  { value: "info", label: "Note" },
] as const;
type Severity = (typeof SEVERITIES)[number]["value"];
interface FindingRow {
  key: number;
  severity: Severity;
  subject: string;
  message: string;
}

const OTHER = "__other";
const recipients = (n: number | undefined) => (n === undefined ? "? recipients" : `${n} recipient${n === 1 ? "" : "s"}`);

/** "Label — note" or "Label", one question per line. */
function parseOrder(text: string) {
  return text
    .split("\n")
    .map((l) => l.trim())
    .filter(Boolean)
    .map((l) => {
      const i = l.indexOf(" — ");
      return i > 0 ? { label: l.slice(0, i).trim(), note: l.slice(i + 3).trim() } : { label: l, note: "" };
    });
}

/** The delivery of one sending, refreshed while messages are still queued or being sent. */
function DigestDelivery({ id }: { id: string }) {
  const [d, setD] = useState<z.output<typeof detailView> | null>(null);
  const [error, setError] = useState<string | null>(null);
  const load = useCallback(() => apiCall(detailView, `/api/circulation/${id}`).then(setD, (e: Error) => setError(e.message)), [id]);
  useEffect(() => void load(), [load]);
  const pending = d?.messages.some((m) => m.status === "queued" || m.status === "sending") ?? false;
  useEffect(() => {
    if (!pending) return;
    const t = setInterval(() => void load(), 2500);
    return () => clearInterval(t);
  }, [pending, load]);

  async function retry(messageId: string) {
    try {
      await apiCall(z.object({ id: z.string() }), `/api/circulation/messages/${messageId}/retry`, { method: "POST" });
      await load();
    } catch (e) {
      setError((e as Error).message);
    }
  }

  if (error) return <Alert>{error}</Alert>;
  if (!d) return <p className="text-sm text-ink-soft">Loading…</p>;
  return (
    <DeliveryTable testId="digest-delivery" messages={d.messages} skipped={d.circulation.skipped} onRetry={retry} />
  );
}

/**
 * Queue the floor-day digest of a sitting to the clerks' list, or to another list of the chamber
 * the sender picks: the sitting and day, the measure, the tree's findings and the proposed order
 * of questions as the clerk states them.
 */
export default function FloorDigestForm({ lists, onSent }: { lists: ListView[] | null; onSent: () => void }) {
  const [sittings, setSittings] = useState<z.output<typeof sittingsView>["sittings"]>([]);
  const [sittingId, setSittingId] = useState(OTHER);
  const [sitting, setSitting] = useState("");
  const [date, setDate] = useState(today());
  const [measure, setMeasure] = useState("");
  const [findings, setFindings] = useState<FindingRow[]>([]);
  const [order, setOrder] = useState("");
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [sent, setSent] = useState<z.output<typeof sentView> | null>(null);
  const [nextKey, setNextKey] = useState(1);
  const [listId, setListId] = useState("");
  /** The server's question when this digest already went to the list. */
  const [repeat, setRepeat] = useState<string | null>(null);

  useEffect(() => {
    apiCall(sittingsView, "/api/floor/sittings").then(
      (s) => {
        setSittings(s.sittings);
        if (s.sittings.length) pickSitting(s.sittings[0].id, s.sittings);
      },
      () => setSittings([]),
    );
  }, []);

  function pickSitting(id: string, from = sittings) {
    setSittingId(id);
    const s = from.find((x) => x.id === id);
    if (s) {
      setSitting(s.title);
      setDate(dateInput(s.openedAt));
    } else setSitting("");
  }

  const clerksList = lists?.find((l) => l.purpose === "clerks") ?? null;
  // A chosen list deleted since is dropped: the digest then goes to the clerks' list, as the line below the choice says.
  const chosen = (listId && lists?.find((l) => l.id === listId)) || null;

  async function submit(e: SubmitEvent) {
    e.preventDefault();
    await send(false);
  }

  async function send(confirm: boolean) {
    setBusy(true);
    setError(null);
    setAt(() => noIssues);
    setSent(null);
    const body = {
      sitting,
      date,
      measure,
      findings: findings.map((f) => ({
        severity: f.severity,
        subject: f.subject,
        message: f.message,
      })),
      proposedOrder: parseOrder(order),
      note,
      ...(chosen ? { listId: chosen.id } : {}),
      confirm,
    };
    try {
      const s = await apiCall(sentView, "/api/circulation/digest", {
        method: "POST",
        body,
      });
      setRepeat(null);
      setSent(s);
      onSent();
    } catch (err) {
      if (err instanceof ApiError && err.code === "needs-confirmation") setRepeat(err.message);
      else {
        setRepeat(null);
        setAt(() => issueLookup(err, { byField: true }));
        setError((err as Error).message);
      }
    } finally {
      setBusy(false);
    }
  }

  const setFinding = (key: number, patch: Partial<FindingRow>) => setFindings(findings.map((f) => (f.key === key ? { ...f, ...patch } : f)));

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Floor-day digest">
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="dg-sitting-pick" className="gw-label">
            Sitting
          </label>
          <select id="dg-sitting-pick" className="gw-input" value={sittingId} onChange={(e) => pickSitting(e.target.value)}>
            {sittings.map((s) => (
              <option key={s.id} value={s.id}>
                {s.title} ({s.status}, {day(s.openedAt)})
              </option>
            ))}
            <option value={OTHER}>Another sitting…</option>
          </select>
        </div>
        <TextField id="dg-date" path="date" type="date" label="Day" at={at} value={date} onChange={setDate} />
      </div>
      {sittingId === OTHER && (
        <TextField id="dg-sitting" path="sitting" label="Sitting name" at={at} value={sitting} onChange={setSitting} maxLength={200} />
      )}
      <TextField id="dg-measure" path="measure" label="Measure (optional)" at={at} value={measure} onChange={setMeasure} maxLength={300} />
      <fieldset>
        <legend className="gw-label">Findings on the amendment tree</legend>
        {findings.length === 0 && <p className="gw-hint">None added; the digest will say there are none.</p>}
        <ol className="mt-1 space-y-2">
          {findings.map((f, i) => (
            <li key={f.key} className="grid gap-2 rounded border border-rule p-2 sm:grid-cols-[10rem_minmax(0,1fr)_auto] sm:items-end">
              <div>
                <label htmlFor={`dg-f-sev-${f.key}`} className="gw-label">
                  Finding {i + 1}: kind
                </label>
                <select id={`dg-f-sev-${f.key}`} className="gw-input" value={f.severity} onChange={(e) => setFinding(f.key, { severity: e.target.value as Severity })}>
                  {SEVERITIES.map((s) => (
                    <option key={s.value} value={s.value}>
                      {s.label}
                    </option>
                  ))}
                </select>
              </div>
              <div>
                <label htmlFor={`dg-f-sub-${f.key}`} className="gw-label">
                  Finding {i + 1}: about
                </label>
                <input id={`dg-f-sub-${f.key}`} className="gw-input" value={f.subject} onChange={(e) => setFinding(f.key, { subject: e.target.value })} placeholder="Amendment 4" {...describedBy(`dg-f-sub-${f.key}`, `findings.${i}.subject`, at)} />
                <FieldMessages id={`dg-f-sub-${f.key}`} path={`findings.${i}.subject`} at={at} />
              </div>
              <div className="sm:col-span-3 sm:row-start-2">
                <label htmlFor={`dg-f-msg-${f.key}`} className="gw-label">
                  Finding {i + 1}: what
                </label>
                <input id={`dg-f-msg-${f.key}`} className="gw-input" value={f.message} onChange={(e) => setFinding(f.key, { message: e.target.value })} {...describedBy(`dg-f-msg-${f.key}`, `findings.${i}.message`, at)} />
                <FieldMessages id={`dg-f-msg-${f.key}`} path={`findings.${i}.message`} at={at} />
              </div>
              <button type="button" className="gw-btn-quiet" onClick={() => setFindings(findings.filter((x) => x.key !== f.key))} aria-label={`Remove finding ${i + 1}`}>
                Remove
              </button>
            </li>
          ))}
        </ol>
        <button
          type="button"
          className="gw-btn-quiet mt-2"
          onClick={() => {
            setFindings([...findings, { key: nextKey, severity: "error", subject: "", message: "" }]);
            setNextKey(nextKey + 1);
          }}
        >
          Add a finding
        </button>
      </fieldset>
      <div>
        <label htmlFor="dg-order" className="gw-label">
          Proposed order of questions
        </label>
        <textarea
          id="dg-order"
          rows={4}
          className="gw-input text-sm"
          value={order}
          onChange={(e) => setOrder(e.target.value)}
          placeholder={"Amendment 2 to Amendment 1\nAmendment 1 as amended — if Amendment 2 is adopted\nPassage"}
        />
        <p className="gw-hint">One question per line, in the order they would be put. To add a note, follow the question with a spaced dash: "Passage — if time allows".</p>
        <FieldMessages id="dg-order" path="proposedOrder" at={at} />
      </div>
      <TextField id="dg-note" path="note" label="Covering note (optional)" at={at} multiline rows={2} value={note} onChange={setNote} maxLength={4000} />
      <div>
        <label htmlFor="dg-list" className="gw-label">
          Send to
        </label>
        <select id="dg-list" className="gw-input" value={chosen?.id ?? ""} onChange={(e) => setListId(e.target.value)} {...describedBy("dg-list", "listId", at)}>
          <option value="">{clerksList ? `The clerks' list (${clerksList.name})` : "Every chief clerk and clerk"}</option>
          {(lists ?? [])
            .filter((l) => l !== clerksList)
            .map((l) => (
              <option key={l.id} value={l.id}>
                {l.name} ({recipients(l.recipientCount)})
              </option>
            ))}
        </select>
        <FieldMessages id="dg-list" path="listId" at={at} />
      </div>
      <p className="text-sm" data-testid="digest-destination">
        Goes to{" "}
        {lists === null ? (
          "…"
        ) : chosen ? (
          <>
            the list <strong>{chosen.name}</strong> ({recipients(chosen.recipientCount)}).
          </>
        ) : clerksList ? (
          <>
            the clerks' list, <strong>{clerksList.name}</strong> ({recipients(clerksList.recipientCount)}).
          </>
        ) : (
          <>every chief clerk and clerk of the chamber: no list is marked as the clerks' list.</>
        )}
      </p>
      <p className="gw-advisory">The digest is advisory: the presiding officer's ruling, the chamber's own rules and its counsel prevail. The e-mail says so.</p>
      <Alert>{error}</Alert>
      <button type="submit" className="gw-btn" disabled={busy || !sitting.trim() || !date}>
        Send the digest
      </button>
      <ConfirmDialog open={repeat !== null} testId="digest-repeat" title="Send the digest again?" confirm="Send it again" busy={busy} onConfirm={() => void send(true)} onCancel={() => setRepeat(null)}>
        <p>{repeat}</p>
      </ConfirmDialog>
      {sent && (
        <div className="gw-card mt-2" aria-label="Digest sent">
          <Alert tone="ok">
            Queued {sent.queued} message{sent.queued === 1 ? "" : "s"} to {sent.listName}
            {sent.skipped.length ? `; ${sent.skipped.length} unsubscribed address${sent.skipped.length === 1 ? "" : "es"} left out` : ""}.
          </Alert>
          <p className="text-sm text-ink-soft">{sent.subject}</p>
          <DigestDelivery id={sent.id} />
        </div>
      )}
    </form>
  );
}
