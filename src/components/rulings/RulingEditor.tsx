import { useEffect, useMemo, useState, type SubmitEvent } from "react";
import { appealOutcome, APPEAL_OUTCOME_LABELS } from "../../lib/rulings/appeal-outcome.ts";
import { DECISION_LABELS, DECISIONS, TARGET_KINDS, type Decision, type TargetKind } from "../../lib/rulings/ruling-content.ts";
import { Alert } from "../shared/Alert.tsx";
import { apiCall } from "../shared/api.ts";
import { day, today } from "../shared/dates.ts";
import { ChoiceField, describedBy, FieldMessages, issueLookup, noIssues, TextField, type IssueLookup } from "../shared/fields.tsx";
import { draftingOptions, rulingView, searchResults, type CitationView, type DraftingOptions, type RulingView } from "./api.ts";

type Mode = "new" | "edit" | "revise";

interface Props {
  mode: Mode;
  initial?: RulingView;
  onSaved?: (r: RulingView) => void;
  onCancel?: () => void;
}

const TARGET_LABELS: Record<TargetKind, string> = { motion: "A motion", amendment: "An amendment", finding: "A finding in the amendment tree", measure: "A measure", other: "Something else" };

interface Draft {
  raisedById: string;
  targetKind: TargetKind;
  targetRef: string;
  targetLabel: string;
  measureId: string;
  amendmentId: string;
  motion: string;
  question: string;
  decision: Decision | "";
  decisionNote: string;
  reasoning: string;
  citations: CitationView[];
  appealed: boolean;
  ayes: string;
  noes: string;
  abstentions: string;
  appellant: string;
  sittingId: string;
  sitting: string;
  sittingDate: string;
  note: string;
}

function fromRuling(r?: RulingView): Draft {
  return {
    raisedById: r?.raisedById ?? "",
    targetKind: r?.target.kind ?? "motion",
    targetRef: r?.target.ref ?? "",
    targetLabel: r?.target.label ?? "",
    measureId: r?.measureId ?? "",
    amendmentId: r?.amendmentId ?? "",
    motion: r?.motion ?? "",
    question: r?.question ?? "",
    decision: r?.decision ?? "",
    decisionNote: r?.decisionNote ?? "",
    reasoning: r?.reasoning ?? "",
    citations: r?.citations ?? [],
    appealed: !!r?.appeal,
    ayes: String(r?.appeal?.ayes ?? ""),
    noes: String(r?.appeal?.noes ?? ""),
    abstentions: String(r?.appeal?.abstentions ?? "0"),
    appellant: r?.appeal?.appellant ?? "",
    sittingId: r?.sittingId ?? "",
    sitting: r?.sitting ?? "",
    sittingDate: r?.sittingDate ?? today(),
    note: "",
  };
}

function toContent(d: Draft) {
  const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s));
  return {
    raisedById: d.raisedById,
    target: { kind: d.targetKind, ref: d.targetRef.trim() || null, label: d.targetLabel },
    measureId: d.measureId || null,
    amendmentId: d.amendmentId || null,
    motion: d.motion.trim() || null,
    question: d.question,
    decision: d.decision || null,
    decisionNote: d.decisionNote,
    reasoning: d.reasoning,
    citations: d.citations.map((c) => (c.kind === "rule" ? c : { kind: "ruling" as const, rulingId: c.rulingId })),
    appeal: d.appealed ? { ayes: num(d.ayes), noes: num(d.noes), abstentions: num(d.abstentions || "0"), appellant: d.appellant } : null,
    sittingId: d.sittingId || null,
    sitting: d.sitting,
    sittingDate: d.sittingDate || null,
  };
}

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export default function RulingEditor({ mode, initial, onSaved, onCancel }: Props) {
  const [d, setD] = useState<Draft>(() => fromRuling(initial));
  const [opts, setOpts] = useState<DraftingOptions | null>(null);
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [related, setRelated] = useState<Array<{ id: string; number: number; label: string; question: string }>>([]);
  const [ruleChoice, setRuleChoice] = useState("");
  const [freeCitation, setFreeCitation] = useState("");
  const [rulingChoice, setRulingChoice] = useState("");
  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => setD((x) => ({ ...x, [k]: v }));

  useEffect(() => {
    apiCall(draftingOptions, "/api/rulings/options").then(setOpts, (e: Error) => setMessage(e.message));
  }, []);

  const ruleIds = d.citations.flatMap((c) => (c.kind === "rule" && c.ruleId ? [c.ruleId] : []));
  const relatedKey = useDebounced(JSON.stringify({ text: `${d.targetLabel} ${d.question} ${d.reasoning}`.trim(), rule: ruleIds[0] ?? d.motion ?? "" }), 500);
  useEffect(() => {
    const k = JSON.parse(relatedKey) as { text: string; rule: string };
    if (!k.text && !k.rule) return setRelated([]);
    const q = new URLSearchParams();
    if (k.text) q.set("text", k.text.slice(0, 4000));
    if (k.rule) q.set("rule", k.rule);
    if (initial) q.set("exclude", initial.id);
    apiCall(searchResults, `/api/rulings/related?${q}`).then(
      (r) => setRelated(r.results.map((x) => ({ id: x.id, number: x.number, label: x.target.label, question: x.question }))),
      () => setRelated([]),
    );
  }, [relatedKey, initial]);

  const appealPreview = useMemo(() => {
    const a = Number(d.ayes);
    const n = Number(d.noes);
    if (!d.appealed || d.ayes === "" || d.noes === "" || !Number.isInteger(a) || !Number.isInteger(n) || a < 0 || n < 0) return null;
    return APPEAL_OUTCOME_LABELS[appealOutcome({ ayes: a, noes: n })] + (a === n ? " — a tie sustains the chair (Robert's Rules of Order Revised, 1915, §21)." : ".");
  }, [d.appealed, d.ayes, d.noes]);

  function addRule() {
    if (ruleChoice && opts?.rulebook) {
      const r = opts.rulebook.rules.find((x) => x.ruleId === ruleChoice);
      if (r) set("citations", [...d.citations, { kind: "rule", rulebookVersionId: opts.rulebook.id, ruleId: r.ruleId, citation: r.citation }]);
      setRuleChoice("");
    } else if (freeCitation.trim()) {
      set("citations", [...d.citations, { kind: "rule", rulebookVersionId: null, ruleId: null, citation: freeCitation.trim() }]);
      setFreeCitation("");
    }
  }
  function addRuling() {
    const r = opts?.rulings.find((x) => x.id === rulingChoice);
    if (r && !d.citations.some((c) => c.kind === "ruling" && c.rulingId === r.id)) set("citations", [...d.citations, { kind: "ruling", rulingId: r.id, label: r.label.split(" — ")[0] }]);
    setRulingChoice("");
  }

  async function submit(e: SubmitEvent) {
    e.preventDefault();
    setBusy(true);
    setAt(() => noIssues);
    setMessage(null);
    try {
      const content = toContent(d);
      let saved: RulingView;
      if (mode === "new") saved = await apiCall(rulingView, "/api/rulings", { method: "POST", body: content });
      else if (mode === "edit") saved = await apiCall(rulingView, `/api/rulings/${initial!.id}`, { method: "PUT", body: { version: initial!.version, content } });
      else saved = await apiCall(rulingView, `/api/rulings/${initial!.id}/revisions`, { method: "POST", body: { revision: initial!.revision, note: d.note, content } });
      if (onSaved) onSaved(saved);
      else window.location.assign(`/rulings/${saved.id}`);
    } catch (err) {
      setAt(() => issueLookup(err, { strip: "content." }));
      setMessage((err as Error).message);
    } finally {
      setBusy(false);
    }
  }

  // The rulebook's motions by name; a motion a ruling already names that the rulebook no longer has stays choosable.
  const motionChoices = [...(opts?.rulebook?.motions ?? []), ...(d.motion && !opts?.rulebook?.motions.some((m) => m.id === d.motion) ? [{ id: d.motion, name: initial?.motionName ?? d.motion }] : [])];
  const amendmentsHere = opts?.amendments.filter((a) => !d.measureId || a.measureId === d.measureId) ?? [];

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_18rem]">
      <form onSubmit={submit} className="gw-card space-y-5" noValidate aria-label={mode === "new" ? "Record a ruling" : mode === "edit" ? "Edit the draft" : "Record a correction"}>
        {mode === "revise" && (
          <TextField id="f-note" path="note" label="What does this correction change?" value={d.note} onChange={(v) => set("note", v)} at={at}>
            <p className="gw-hint">Revision {initial!.revision + 1}. The text as issued stays in the history.</p>
          </TextField>
        )}
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="mb-2 font-serif text-step-1 font-semibold text-chamber-dark">The point of order</legend>
          <div>
            <label htmlFor="f-raisedById" className="gw-label">
              Raised by
            </label>
            <select id="f-raisedById" className="gw-input" value={d.raisedById} onChange={(e) => set("raisedById", e.target.value)} {...describedBy("f-raisedById", "raisedById", at)}>
              <option value="">Choose a legislator…</option>
              {opts?.legislators.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name} ({l.bloc}
                  {l.office ? `, ${l.office}` : ""})
                </option>
              ))}
            </select>
            <FieldMessages id="f-raisedById" path="raisedById" at={at} />
          </div>
          <div>
            <label htmlFor="f-targetKind" className="gw-label">
              Raised against
            </label>
            <select id="f-targetKind" className="gw-input" value={d.targetKind} onChange={(e) => set("targetKind", e.target.value as TargetKind)}>
              {TARGET_KINDS.map((k) => (
                <option key={k} value={k}>
                  {TARGET_LABELS[k]}
                </option>
              ))}
            </select>
          </div>
          <TextField id="f-targetLabel" path="target.label" label="What it was raised against" value={d.targetLabel} onChange={(v) => set("targetLabel", v)} placeholder="e.g. Motion to postpone the Harbour Dredging Levy indefinitely" className="sm:col-span-2" at={at} />
          <ChoiceField path="measureId" label="Measure (optional)" empty="None" value={d.measureId} choices={opts?.measures ?? []} onChange={(v) => setD((x) => ({ ...x, measureId: v, amendmentId: "" }))} at={at} />
          <ChoiceField path="amendmentId" label="Amendment (optional)" empty="None" value={d.amendmentId} choices={amendmentsHere} onChange={(v) => set("amendmentId", v)} at={at} />
          <div>
            <label htmlFor="f-motion" className="gw-label">
              Motion concerned (optional)
            </label>
            <select id="f-motion" className="gw-input" value={d.motion} onChange={(e) => set("motion", e.target.value)} {...describedBy("f-motion", "motion", at)}>
              <option value="">None</option>
              {motionChoices.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </select>
            <FieldMessages id="f-motion" path="motion" at={at} />
          </div>
          <TextField id="f-targetRef" label="Reference (optional)" value={d.targetRef} onChange={(v) => set("targetRef", v)} placeholder="e.g. Journal, p. 214" />
          <TextField id="f-question" path="question" label="Question put to the chair" value={d.question} onChange={(v) => set("question", v)} multiline rows={2} className="sm:col-span-2" at={at} />
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="mb-2 font-serif text-step-1 font-semibold text-chamber-dark">The ruling</legend>
          <div role="radiogroup" aria-labelledby="decision-label" className="flex flex-wrap gap-4">
            <span id="decision-label" className="gw-label w-full">
              Decision of the chair
            </span>
            {DECISIONS.map((k) => (
              <label key={k} className="inline-flex items-center gap-2 text-sm">
                <input type="radio" name="decision" value={k} checked={d.decision === k} onChange={() => set("decision", k)} />
                {DECISION_LABELS[k]}
              </label>
            ))}
          </div>
          <FieldMessages id="f-decision" path="decision" at={at} />
          {d.decision === "other" && (
            <TextField id="f-decisionNote" path="decisionNote" label="The other disposition" value={d.decisionNote} onChange={(v) => set("decisionNote", v)} at={at} />
          )}
          <TextField id="f-reasoning" path="reasoning" label="Reasoning" value={d.reasoning} onChange={(v) => set("reasoning", v)} multiline rows={6} at={at} />
          <div>
            <span className="gw-label">Citations</span>
            {d.citations.length === 0 && <p className="gw-hint">No citations yet.</p>}
            <ul className="mt-1 space-y-1">
              {d.citations.map((c, i) => (
                <li key={i} className="flex items-center justify-between gap-2 rounded border border-rule bg-vellum px-2 py-1 text-sm">
                  <span>
                    {c.kind === "rule" ? (
                      <>
                        {c.citation}
                        {c.ruleId && opts?.rulebook && <span className="text-ink-soft"> · {opts.rulebook.rules.find((r) => r.ruleId === c.ruleId)?.name ?? "a rule of the rulebook"}</span>}
                      </>
                    ) : (
                      <>{c.label ?? "Earlier ruling"} (precedent)</>
                    )}
                    {(() => {
                      const problem = [...at(`citations.${i}.ruleId`), ...at(`citations.${i}.rulingId`), ...at(`citations.${i}.rulebookVersionId`)][0];
                      return problem ? <span className="gw-error block" data-issue-path={`citations.${i}`}>{problem}</span> : null;
                    })()}
                  </span>
                  <button type="button" className="gw-btn-quiet" onClick={() => set("citations", d.citations.filter((_, j) => j !== i))} aria-label={`Remove citation ${i + 1}`}>
                    Remove
                  </button>
                </li>
              ))}
            </ul>
            <div className="mt-2 grid gap-2 sm:grid-cols-[1fr_auto]">
              {opts?.rulebook ? (
                <div>
                  <label htmlFor="f-rule" className="gw-label">
                    Rule of {opts.rulebook.label}
                  </label>
                  <select id="f-rule" className="gw-input" value={ruleChoice} onChange={(e) => setRuleChoice(e.target.value)}>
                    <option value="">Choose a rule…</option>
                    {opts.rulebook.rules.map((r) => (
                      <option key={r.ruleId} value={r.ruleId}>
                        {r.citation} — {r.name.length > 90 ? `${r.name.slice(0, 89)}…` : r.name}
                      </option>
                    ))}
                  </select>
                </div>
              ) : (
                <p className="gw-hint">No rulebook version is adopted yet: cite rules by their text.</p>
              )}
              <div className="self-end">
                <label htmlFor="f-freeCitation" className="gw-label">
                  Or a citation as printed
                </label>
                <input id="f-freeCitation" className="gw-input" value={freeCitation} onChange={(e) => setFreeCitation(e.target.value)} placeholder="Standing Order 31(2)" />
              </div>
            </div>
            <button type="button" className="gw-btn-quiet mt-2" onClick={addRule} disabled={!ruleChoice && !freeCitation.trim()}>
              Add rule citation
            </button>
            {opts && opts.rulings.length > 0 && (
              <div className="mt-3 flex flex-wrap items-end gap-2">
                <ChoiceField className="min-w-64 flex-1" id="f-ruling" label="Earlier ruling" empty="Choose a ruling…" value={rulingChoice} choices={opts.rulings.filter((r) => r.id !== initial?.id)} onChange={setRulingChoice} />
                <button type="button" className="gw-btn-quiet" onClick={addRuling} disabled={!rulingChoice}>
                  Cite ruling
                </button>
              </div>
            )}
          </div>
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="mb-2 font-serif text-step-1 font-semibold text-chamber-dark">Appeal</legend>
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="checkbox" checked={d.appealed} onChange={(e) => set("appealed", e.target.checked)} />
            The decision was appealed
          </label>
          {d.appealed && (
            <div className="grid gap-3 sm:grid-cols-4">
              <TextField id="f-ayes" path="appeal.ayes" label="To sustain the chair" value={d.ayes} onChange={(v) => set("ayes", v)} inputMode="numeric" at={at} />
              <TextField id="f-noes" path="appeal.noes" label="Against" value={d.noes} onChange={(v) => set("noes", v)} inputMode="numeric" at={at} />
              <TextField id="f-abst" label="Abstaining" value={d.abstentions} onChange={(v) => set("abstentions", v)} inputMode="numeric" />
              <TextField id="f-appellant" label="Appellant" value={d.appellant} onChange={(v) => set("appellant", v)} />
              {appealPreview && <p className="gw-hint sm:col-span-4" aria-live="polite">{appealPreview}</p>}
            </div>
          )}
        </fieldset>

        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-2 font-serif text-step-1 font-semibold text-chamber-dark">Sitting</legend>
          {opts && opts.sittings.length > 0 && (
            <div>
              <label htmlFor="f-sittingId" className="gw-label">
                Recorded sitting
              </label>
              <select
                id="f-sittingId"
                className="gw-input"
                value={d.sittingId}
                onChange={(e) => {
                  const s = opts.sittings.find((x) => x.id === e.target.value);
                  setD((x) => ({ ...x, sittingId: e.target.value, sitting: s ? s.title : x.sitting, sittingDate: s ? s.date : x.sittingDate }));
                }}
              >
                <option value="">Not linked</option>
                {opts.sittings.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.title} ({day(s.date)})
                  </option>
                ))}
              </select>
            </div>
          )}
          <TextField id="f-sitting" path="sitting" label="Sitting" value={d.sitting} onChange={(v) => set("sitting", v)} at={at} />
          <TextField id="f-sittingDate" path="sittingDate" label="Date" value={d.sittingDate} onChange={(v) => set("sittingDate", v)} type="date" at={at} />
        </fieldset>

        <Alert>{message}</Alert>
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="gw-btn" disabled={busy}>
            {mode === "new" ? "Save draft" : mode === "edit" ? "Save changes" : "Issue correction"}
          </button>
          {onCancel && (
            <button type="button" className="gw-btn-quiet" onClick={onCancel}>
              Cancel
            </button>
          )}
        </div>
      </form>

      <aside aria-labelledby="related-h" className="space-y-3">
        <h2 id="related-h" className="text-step-1">
          Related precedents
        </h2>
        <p className="gw-hint">Issued rulings citing the same rule or sharing words with this one. Updated as you type.</p>
        {related.length === 0 ? (
          <p className="text-sm text-ink-soft">None found yet.</p>
        ) : (
          <ul className="space-y-2" data-testid="related">
            {related.map((r) => (
              <li key={r.id} className="gw-card p-3 text-sm">
                <a href={`/rulings/${r.id}`} target="_blank" rel="noopener" className="font-semibold">
                  Ruling {r.number}
                </a>
                <p className="text-ink-soft">{r.label}</p>
                <p className="mt-1">{r.question}</p>
              </li>
            ))}
          </ul>
        )}
      </aside>
    </div>
  );
}
