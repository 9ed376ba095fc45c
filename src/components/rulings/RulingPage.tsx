import { useCallback, useEffect, useState } from "react";
import { DECISION_LABELS } from "../../lib/rulings/ruling-content.ts";
import { APPEAL_OUTCOME_LABELS } from "../../lib/rulings/appeal-outcome.ts";
import DeliveryTable from "../circulation/DeliveryTable.tsx";
import { ApiError, apiCall } from "../shared/api.ts";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";
import { listsView, rulingDetail, type ListView, type RulingDetail, type RulingView } from "./api.ts";
import RulingEditor from "./RulingEditor.tsx";
import { z } from "zod";
import { day, when } from "../shared/dates.ts";

interface Props {
  initial: RulingDetail;
  can: { draft: boolean; issue: boolean; send: boolean };
  /** The chamber's time zone (this island renders on the server too, with dates in its first paint). */
  timeZone: string;
}


export function RulingBody({ r }: { r: RulingView }) {
  return (
    <div className="space-y-4">
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="font-semibold text-ink-soft">Sitting</dt>
        <dd>{[r.sitting, day(r.sittingDate)].filter(Boolean).join(", ") || "—"}</dd>
        <dt className="font-semibold text-ink-soft">Raised by</dt>
        <dd>{r.raisedByName}</dd>
        <dt className="font-semibold text-ink-soft">Against</dt>
        <dd>
          {r.target.label}
          {r.measureLabel && <span className="text-ink-soft"> · {r.measureLabel}</span>}
          {r.motion && <span className="gw-chip ml-2 border-rule text-ink-soft">{r.motionName ?? r.motion}</span>}
        </dd>
        <dt className="font-semibold text-ink-soft">Question</dt>
        <dd>{r.question}</dd>
        <dt className="font-semibold text-ink-soft">Decision</dt>
        <dd>
          {r.decision ? (
            <span className={`gw-chip ${r.decision === "sustained" ? "border-verdict-bar bg-verdict-bar-tint text-verdict-bar" : r.decision === "not-sustained" ? "border-verdict-ok bg-verdict-ok-tint text-verdict-ok" : "border-verdict-query bg-verdict-query-tint text-verdict-query"}`}>{DECISION_LABELS[r.decision]}</span>
          ) : (
            <span className="text-ink-soft">Not yet decided</span>
          )}
          {r.decisionNote && <span className="ml-2">{r.decisionNote}</span>}
        </dd>
      </dl>
      <section>
        <h3>Reasoning</h3>
        {r.reasoning ? (
          r.reasoning.split(/\n{2,}/).map((p, i) => (
            <p key={i} className="mt-2 whitespace-pre-line font-serif">
              {p}
            </p>
          ))
        ) : (
          <p className="mt-2 text-ink-soft">None recorded yet.</p>
        )}
      </section>
      {r.citations.length > 0 && (
        <section>
          <h3>Citations</h3>
          <ul className="mt-2 list-disc pl-5 text-sm">
            {r.citations.map((c, i) => (
              <li key={i} data-rule={c.kind === "rule" ? (c.ruleId ?? undefined) : undefined}>
                {c.kind === "rule" ? (
                  c.citation
                ) : (
                  <a href={`/rulings/${c.rulingId}`}>{c.label ?? "Earlier ruling"}</a>
                )}
              </li>
            ))}
          </ul>
        </section>
      )}
      {r.appeal && (
        <section>
          <h3>Appeal</h3>
          <p className="mt-2 text-sm">
            {r.appeal.appellant && <>Appealed by {r.appeal.appellant}. </>}
            {r.appeal.ayes} to sustain the chair, {r.appeal.noes} against{r.appeal.abstentions ? `, ${r.appeal.abstentions} abstaining` : ""}. <strong>{APPEAL_OUTCOME_LABELS[r.appeal.outcome]}</strong>
            {r.appeal.ayes === r.appeal.noes && " — a tie sustains the chair (Robert's Rules of Order Revised, 1915, §21)"}.
          </p>
        </section>
      )}
    </div>
  );
}

const sentView = z.object({ id: z.string(), queued: z.number(), skipped: z.array(z.object({ email: z.string() })).catch([]) });
const issuedView = z.object({ ruling: z.object({ id: z.string() }) });

export default function RulingPage({ initial, can, timeZone }: Props) {
  const fmt = (iso: string | null) => (iso ? when(iso, timeZone) : "—");
  const [data, setData] = useState(initial);
  const [mode, setMode] = useState<"view" | "edit" | "revise">("view");
  const [lists, setLists] = useState<ListView[]>([]);
  const [listId, setListId] = useState("");
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  /** The confirmation open: issuing, or sending again to a list that already received this revision (the server's words). */
  const [asking, setAsking] = useState<{ kind: "issue" } | { kind: "resend"; question: string } | null>(null);
  const [refusal, setRefusal] = useState<string | null>(null);
  const r = data.ruling;

  const reload = useCallback(async () => {
    setData(await apiCall(rulingDetail, `/api/rulings/${r.id}`));
  }, [r.id]);

  useEffect(() => {
    if (can.send) apiCall(listsView, "/api/circulation/lists").then((l) => setLists(l.lists), () => setLists([]));
  }, [can.send]);

  const pending = data.circulations.some((c) => c.messages.some((m) => m.status === "queued" || m.status === "sending"));
  useEffect(() => {
    if (!pending) return;
    const t = setInterval(() => void reload().catch(() => {}), 2500);
    return () => clearInterval(t);
  }, [pending, reload]);

  async function act(fn: () => Promise<string>) {
    setBusy(true);
    setMessage(null);
    try {
      const text = await fn();
      await reload();
      setMessage({ kind: "ok", text });
    } catch (e) {
      setMessage({ kind: "error", text: (e as Error).message });
    } finally {
      setBusy(false);
    }
  }

  /** Run a confirmed action: success closes the dialog and says so; a refusal stays in the dialog. */
  async function confirmed(fn: () => Promise<string>) {
    setBusy(true);
    setRefusal(null);
    try {
      const text = await fn();
      setAsking(null);
      await reload();
      setMessage({ kind: "ok", text });
    } catch (e) {
      setRefusal((e as Error).message);
    } finally {
      setBusy(false);
    }
  }
  const issue = () =>
    confirmed(async () => {
      await apiCall(issuedView, `/api/rulings/${r.id}/issue`, { method: "POST", body: { version: r.version } });
      return `Ruling ${r.number} is issued.`;
    });
  const sendTo = async (confirm: boolean) => {
    const s = await apiCall(sentView, "/api/circulation", { method: "POST", body: { rulingId: r.id, listId, confirm } });
    return `Queued ${s.queued} message${s.queued === 1 ? "" : "s"}${s.skipped.length ? `; ${s.skipped.length} unsubscribed address${s.skipped.length === 1 ? "" : "es"} left out` : ""}.`;
  };
  const send = async () => {
    setBusy(true);
    setMessage(null);
    try {
      const text = await sendTo(false);
      await reload();
      setMessage({ kind: "ok", text });
    } catch (e) {
      if (e instanceof ApiError && e.code === "needs-confirmation") {
        setRefusal(null);
        setAsking({ kind: "resend", question: e.message });
      } else setMessage({ kind: "error", text: (e as Error).message });
    } finally {
      setBusy(false);
    }
  };
  const retry = (id: string) =>
    act(async () => {
      await apiCall(z.object({ id: z.string() }), `/api/circulation/messages/${id}/retry`, { method: "POST" });
      return "The message is queued again.";
    });

  if (mode !== "view")
    return (
      <RulingEditor
        mode={mode}
        initial={r}
        onCancel={() => setMode("view")}
        onSaved={() => {
          setMode("view");
          void reload();
          setMessage({ kind: "ok", text: mode === "edit" ? "Draft saved." : "Correction issued as a new revision." });
        }}
      />
    );

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="space-y-6">
        <article className="gw-card" aria-labelledby="ruling-h">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h2 id="ruling-h">
              Ruling {r.number}
              {r.revision > 1 && <span className="ml-2 text-step-0 text-ink-soft">revision {r.revision}</span>}
            </h2>
            <span className={`gw-chip ${r.status === "issued" ? "border-chamber bg-chamber-tint text-chamber-dark" : "border-brass bg-brass-tint text-brass-text"}`}>{r.status === "issued" ? `Issued ${fmt(r.issuedAt)}` : "Draft"}</span>
          </div>
          <div className="mt-4">
            <RulingBody r={r} />
          </div>
          <div className="mt-6 flex flex-wrap gap-2">
            {r.status === "draft" && can.draft && (
              <button type="button" className="gw-btn-quiet" onClick={() => setMode("edit")}>
                Edit draft
              </button>
            )}
            {r.status === "draft" && can.issue && (
              <button
                type="button"
                className="gw-btn"
                onClick={() => {
                  setRefusal(null);
                  setAsking({ kind: "issue" });
                }}
                disabled={busy}
              >
                Issue ruling…
              </button>
            )}
            {r.status === "issued" && can.issue && (
              <button type="button" className="gw-btn-quiet" onClick={() => setMode("revise")}>
                Record a correction
              </button>
            )}
          </div>
          <ConfirmDialog
            open={asking !== null}
            testId="ruling-confirm"
            title={asking?.kind === "resend" ? `Send Ruling ${r.number} to this list again?` : `Issue Ruling ${r.number}?`}
            confirm={asking?.kind === "resend" ? "Send it again" : "Issue it"}
            busy={busy}
            error={refusal}
            onConfirm={() => void (asking?.kind === "resend" ? confirmed(() => sendTo(true)) : issue())}
            onCancel={() => setAsking(null)}
          >
            {asking?.kind === "resend" ? (
              <p>{asking.question}</p>
            ) : (
              <p>Issuing makes the ruling part of the chamber's record. This cannot be undone: an issued ruling is never edited or withdrawn, and a later correction is a new revision beside it.</p>
            )}
          </ConfirmDialog>
          {message && (
            <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "gw-error mt-3" : "mt-3 text-sm font-semibold text-verdict-ok"}>
              {message.text}
            </p>
          )}
        </article>

        <section aria-labelledby="history-h" className="gw-card">
          <h2 id="history-h" className="text-step-1">
            History
          </h2>
          {data.revisions.length === 0 ? (
            <p className="mt-2 text-sm text-ink-soft">Not issued yet: a draft may be edited until it is issued; after that, only corrections as new revisions.</p>
          ) : (
            <ol className="mt-2 space-y-3">
              {data.revisions.map((v) => {
                const content = z.object({ question: z.string(), reasoning: z.string() }).safeParse(v.content);
                return (
                  <li key={v.revision} className="border-l-4 border-rule pl-3 text-sm">
                    <p>
                      <strong>Revision {v.revision}</strong> · {v.note} · {v.issuedByName}, {fmt(v.issuedAt)}
                    </p>
                    {content.success && v.revision !== r.revision && (
                      <details className="mt-1">
                        <summary className="cursor-pointer text-chamber">Text of revision {v.revision}</summary>
                        <p className="mt-1">
                          <em>Question:</em> {content.data.question}
                        </p>
                        <p className="mt-1 whitespace-pre-line">
                          <em>Reasoning:</em> {content.data.reasoning}
                        </p>
                      </details>
                    )}
                  </li>
                );
              })}
            </ol>
          )}
        </section>
      </div>

      {can.send && (
        <aside aria-labelledby="circ-h" className="space-y-4">
          <section className="gw-card">
            <h2 id="circ-h" className="text-step-1">
              Circulate
            </h2>
            {r.status !== "issued" ? (
              <p className="gw-hint">Only issued rulings are circulated.</p>
            ) : (
              <div className="mt-2 space-y-2">
                <label htmlFor="circ-list" className="gw-label">
                  Distribution list
                </label>
                <select id="circ-list" className="gw-input" value={listId} onChange={(e) => setListId(e.target.value)}>
                  <option value="">Choose a list…</option>
                  {lists.map((l) => (
                    <option key={l.id} value={l.id}>
                      {l.name} ({l.recipientCount ?? "?"} recipients)
                    </option>
                  ))}
                </select>
                <button type="button" className="gw-btn" onClick={send} disabled={!listId || busy}>
                  Send by e-mail
                </button>
                <p className="gw-hint">Sent as HTML and plain text, with an unsubscribe link. Messages are queued and delivered with retries.</p>
              </div>
            )}
          </section>
          {data.circulations.map((c) => (
            <section key={c.id} className="gw-card" aria-label={`Sent to ${c.listName}`}>
              <h3 className="text-step-0">
                {c.listName} <span className="font-sans text-sm font-normal text-ink-soft">· revision {c.rulingRevision} · {c.sentByName}, {fmt(c.createdAt)}</span>
              </h3>
              <DeliveryTable testId="delivery" messages={c.messages} skipped={c.skipped} onRetry={retry} busy={busy} />
            </section>
          ))}
        </aside>
      )}
    </div>
  );
}
