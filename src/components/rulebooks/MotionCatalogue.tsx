/**
 * The motion catalogue as a clerk reads it: the order of precedence, highest first (a tie is one
 * numbered place holding several motions), then the motions without rank by class. Reordered by
 * drag or by the move buttons (keyboard); each motion's characteristics open below it in a layout
 * that wraps to the page, with the citation they come from.
 */
import { useMemo, useState, type DragEvent } from "react";
import { CLASS_LABELS, RECONSIDERABLE_LABELS, thresholdWords } from "../../lib/procedure/fact-descriptions.ts";
import { addToOrder, applyPrecedence, moveBefore, moveDown, moveUp, precedenceView, removeFromOrder, separate, tieWithAbove, type PrecedenceView } from "../../lib/procedure/precedence-order.ts";
import { conditionClause, sentenceContext } from "../../lib/procedure/rule-sentence.ts";
import { MOTION_CLASSES, RECONSIDERABLE, type MotionInput, type RulebookInput } from "../../lib/procedure/rulebook-schema.ts";
import { VOTE_THRESHOLDS } from "../../lib/procedure/voting-section.ts";
import { CheckField, FieldMessages, SelectField, TextField, type IssueLookup } from "../shared/fields.tsx";

const CLASS_HEADINGS: Record<string, string> = { privileged: "Privileged motions", subsidiary: "Subsidiary motions", incidental: "Incidental motions", main: "Main motion", restorative: "Motions that bring a question back" };
const CLASS_CHIP: Record<string, string> = { privileged: "Privileged", subsidiary: "Subsidiary", incidental: "Incidental", main: "Main", restorative: "Bringing back" };
const SET_WORDS: Record<string, string> = { class: "class", rank: "rank", second: "needs a second", debatable: "debatable", amendable: "can be amended", vote: "vote", interrupt: "may interrupt a speaker", reconsiderable: "which vote may be reconsidered" };
const VOTE_LABELS = Object.fromEntries(VOTE_THRESHOLDS.map((t) => [t, thresholdWords(t).replace(/^./, (c) => c.toUpperCase())])) as Record<(typeof VOTE_THRESHOLDS)[number], string>;
const RECONSIDER_LABELS = Object.fromEntries(RECONSIDERABLE.map((r) => [r, RECONSIDERABLE_LABELS[r].replace(/^./, (c) => c.toUpperCase())])) as Record<(typeof RECONSIDERABLE)[number], string>;

interface Props {
  doc: RulebookInput;
  at: IssueLookup;
  readOnly: boolean;
  setMotion: (i: number, p: Partial<MotionInput>) => void;
  update: (p: Partial<RulebookInput>) => void;
}

function summary(m: MotionInput): string {
  const parts = [m.second ? "needs a second" : "no second", m.debatable ? "debatable" : "not debatable", m.amendable ? "amendable" : "not amendable", `vote: ${thresholdWords(m.vote)}`];
  if (m.interrupt) parts.push("may interrupt");
  return parts.join(" · ");
}

export default function MotionCatalogue({ doc, at, readOnly, setMotion, update }: Props) {
  const view = useMemo(() => precedenceView(doc as never), [doc]);
  const [open, setOpen] = useState<string | null>(null);
  const [dragging, setDragging] = useState<string | null>(null);
  const [announce, setAnnounce] = useState("");
  const byId = new Map(doc.motions.map((m, i) => [m.id, { m, i }]));
  const name = (id: string) => byId.get(id)?.m.name ?? id;

  const reorder = (next: PrecedenceView, said: string) => {
    if (readOnly) return;
    const written = applyPrecedence(doc as never, next) as RulebookInput;
    // Ranks are written as numbers; chains, if any, are replaced by them.
    update({ motions: written.motions, precedence: undefined });
    setAnnounce(said);
  };
  const place = (v: PrecedenceView, id: string) => v.tiers.findIndex((t) => t.includes(id)) + 1;

  const onDrop = (e: DragEvent, target: string) => {
    e.preventDefault();
    const id = dragging ?? e.dataTransfer.getData("text/plain");
    setDragging(null);
    if (!id || id === target) return;
    const next = moveBefore(view, id, target);
    reorder(next, `${name(id)} is now place ${place(next, id)}, above ${name(target)}.`);
  };

  const row = (id: string, tierIndex: number | null, tierSize: number) => {
    const entry = byId.get(id);
    if (!entry) return null;
    const { m, i } = entry;
    const bad = Object.keys(m).some((k) => at(`motions.${i}.${k}`).length > 0);
    const isOpen = open === id || bad;
    return (
      <div
        key={id}
        data-motion={m.id}
        className={`rounded-md border bg-white p-2 ${dragging === id ? "border-brass opacity-60" : "border-rule"}`}
        draggable={!readOnly && tierIndex !== null && !isOpen}
        onDragStart={(e) => {
          setDragging(id);
          e.dataTransfer.setData("text/plain", id);
          e.dataTransfer.effectAllowed = "move";
        }}
        onDragEnd={() => setDragging(null)}
        onDragOver={(e) => {
          if (tierIndex !== null && dragging) e.preventDefault();
        }}
        onDrop={(e) => tierIndex !== null && onDrop(e, id)}
      >
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
          {!readOnly && tierIndex !== null && <span aria-hidden="true" className="cursor-grab select-none text-ink-soft" title="Drag to reorder">⠿</span>}
          <span className="font-semibold">{m.name}</span>
          <span className="gw-chip border-rule text-ink-soft">{CLASS_CHIP[m.class] ?? m.class}</span>
          {tierSize > 1 && <span className="gw-chip border-brass text-brass-text">equal rank</span>}
          <span className="min-w-0 flex-1 basis-48 text-sm text-ink-soft">{summary(m)}</span>
          <div className="flex flex-wrap gap-1">
            {!readOnly && tierIndex !== null && (
              <>
                <button type="button" className="gw-btn-quiet px-2" aria-label={`Move ${m.name} up`} disabled={tierIndex === 0 && tierSize === 1} onClick={() => { const next = moveUp(view, id); reorder(next, `${m.name} moved up to place ${place(next, id)}.`); }}>↑</button>
                <button type="button" className="gw-btn-quiet px-2" aria-label={`Move ${m.name} down`} disabled={tierIndex === view.tiers.length - 1 && tierSize === 1} onClick={() => { const next = moveDown(view, id); reorder(next, `${m.name} moved down to place ${place(next, id)}.`); }}>↓</button>
                {tierSize > 1 ? (
                  <button type="button" className="gw-btn-quiet px-2 text-sm" aria-label={`Own place: ${m.name} gets a place of its own`} onClick={() => { const next = separate(view, id); reorder(next, `${m.name} has its own place, ${place(next, id)}.`); }}>Own place</button>
                ) : (
                  tierIndex > 0 && <button type="button" className="gw-btn-quiet px-2 text-sm" aria-label={`Equal with above: ${m.name} takes equal rank with the motion above`} onClick={() => { const next = tieWithAbove(view, id); reorder(next, `${m.name} now has equal rank with ${view.tiers[tierIndex - 1].map(name).join(" and ")}.`); }}>Equal with above</button>
                )}
              </>
            )}
            <button type="button" className="gw-btn-quiet px-2 text-sm" aria-expanded={isOpen} aria-controls={`motion-${i}`} onClick={() => setOpen(isOpen && !bad ? null : id)}>
              {readOnly ? "Details" : "Edit"}<span className="sr-only"> {m.name}</span>
            </button>
          </div>
        </div>
        {isOpen && <Characteristics id={`motion-${i}`} doc={doc} m={m} i={i} at={at} readOnly={readOnly} setMotion={setMotion} ranked={tierIndex !== null} onRank={() => reorder(tierIndex === null ? addToOrder(view, id) : removeFromOrder(view, id), tierIndex === null ? `${m.name} is now last in the order.` : `${m.name} is now without rank.`)} onRemove={() => update({ motions: doc.motions.filter((_, j) => j !== i) })} />}
      </div>
    );
  };

  let lastClass: string | null = null;
  const unrankedByClass = MOTION_CLASSES.map((c) => ({ c, ids: view.unranked.filter((id) => byId.get(id)?.m.class === c) })).filter((g) => g.ids.length);

  return (
    <div className="space-y-4">
      <p role="status" aria-live="polite" className="sr-only" data-testid="order-announce">{announce}</p>
      <section aria-labelledby="order-h" className="space-y-2">
        <h2 id="order-h" className="text-step-1">Order of precedence <span className="text-sm font-normal text-ink-soft">(highest first)</span></h2>
        <p className="gw-hint">A motion may be made while a motion lower in this list is immediately pending, not while one of equal or higher rank is. {readOnly ? "" : "Drag a motion, or use ↑ and ↓, to change its place; “Equal with above” gives two motions the same rank."}</p>
        <ol className="space-y-1" data-testid="precedence-list">
          {view.tiers.map((tier, t) => {
            const cls = byId.get(tier[0])?.m.class ?? "";
            const heading = cls !== lastClass ? CLASS_HEADINGS[cls] : null;
            lastClass = cls;
            return (
              <li key={tier.join("|")} className="list-none" data-place={t + 1}>
                {heading && <p className="mt-3 text-xs font-semibold uppercase tracking-wide text-ink-soft">{heading}</p>}
                <div className="flex items-start gap-2">
                  <span className="mt-2 w-7 shrink-0 text-right font-serif font-semibold text-chamber-dark" aria-label={`Place ${t + 1}`}>{t + 1}.</span>
                  <div className={`min-w-0 flex-1 space-y-1 ${tier.length > 1 ? "rounded-md border-l-4 border-brass pl-1" : ""}`}>{tier.map((id) => row(id, t, tier.length))}</div>
                </div>
              </li>
            );
          })}
        </ol>
        {view.tiers.length === 0 && <p className="gw-hint">No motion is ranked yet.</p>}
      </section>
      <section aria-labelledby="unranked-h" className="space-y-2">
        <h2 id="unranked-h" className="text-step-1">Motions without rank</h2>
        <p className="gw-hint">Incidental motions and those that bring a question back take no place in the order; the rules decide when they are in order.</p>
        {unrankedByClass.map((g) => (
          <div key={g.c} className="space-y-1">
            <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{CLASS_HEADINGS[g.c]}</p>
            {g.ids.map((id) => row(id, null, 1))}
          </div>
        ))}
      </section>
      {!readOnly && (
        <button type="button" className="gw-btn-quiet" onClick={() => update({ motions: [...doc.motions, { id: `new-motion-${doc.motions.length + 1}`, name: "New motion", class: "incidental", rank: null, second: true, debatable: false, amendable: false, vote: "majority", interrupt: false, reconsiderable: "neither", citation: "Standing orders" }] })}>
          + Add a motion
        </button>
      )}
      <FieldMessages path="motions" at={at} />
      <FieldMessages path="precedence" at={at} />
    </div>
  );
}

function Characteristics({ id, doc, m, i, at, readOnly, setMotion, ranked, onRank, onRemove }: { id: string; doc: RulebookInput; m: MotionInput; i: number; at: IssueLookup; readOnly: boolean; setMotion: (i: number, p: Partial<MotionInput>) => void; ranked: boolean; onRank: () => void; onRemove: () => void }) {
  const ctx = sentenceContext(doc);
  const flag = (k: "second" | "debatable" | "amendable" | "interrupt", label: string) => (
    <CheckField path={`motions.${i}.${k}`} label={label} at={at} disabled={readOnly} checked={Boolean(m[k])} onChange={(v) => setMotion(i, { [k]: v })} />
  );
  const reconsiderable = typeof m.reconsiderable === "boolean" ? (m.reconsiderable ? "both" : "neither") : m.reconsiderable;
  return (
    <div id={id} className="mt-2 space-y-3 border-t border-rule pt-2" role="group" aria-label={`Characteristics of ${m.name}`}>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField path={`motions.${i}.name`} label="Name" at={at} disabled={readOnly} value={m.name} onChange={(v) => setMotion(i, { name: v })} />
        <SelectField path={`motions.${i}.class`} label={`Class of ${m.name}`} at={at} disabled={readOnly} value={m.class} options={MOTION_CLASSES} labels={CLASS_CHIP} onChange={(v) => setMotion(i, { class: v })} />
        <SelectField path={`motions.${i}.vote`} label={`Vote required for ${m.name}`} at={at} disabled={readOnly} value={m.vote} options={VOTE_THRESHOLDS} labels={VOTE_LABELS} onChange={(v) => setMotion(i, { vote: v })} />
        <SelectField path={`motions.${i}.reconsiderable`} label="Which vote may be reconsidered" at={at} disabled={readOnly} value={reconsiderable} options={RECONSIDERABLE} labels={RECONSIDER_LABELS} onChange={(v) => setMotion(i, { reconsiderable: v })} />
      </div>
      <div className="flex flex-wrap gap-x-5 gap-y-1">
        {flag("second", `Needs a second`)}
        {flag("debatable", `Debatable`)}
        {flag("amendable", `Can be amended`)}
        {flag("interrupt", `May interrupt a speaker`)}
      </div>
      <TextField path={`motions.${i}.citation`} label={`Source of these characteristics (citation)`} at={at} disabled={readOnly} value={m.citation} onChange={(v) => setMotion(i, { citation: v })} />
      {(m.voteAlternatives?.length || m.variants?.length || m.window) && (
        <ul className="space-y-1 text-sm" aria-label="Characteristics in stated circumstances">
          {m.window && <li>May be made within {m.window.days != null ? `${m.window.days === 0 ? "the same day" : `${m.window.days} day(s)`}` : ""}{m.window.days != null && m.window.sittings != null ? " or " : ""}{m.window.sittings != null ? `${m.window.sittings} sitting(s)` : ""} of the vote it applies to <span className="text-ink-soft">— {m.window.citation}</span></li>}
          {m.voteAlternatives?.map((a, k) => <li key={`a${k}`}>{a.kind === "or" ? "Also adopted by" : "Instead needs"} {thresholdWords(a.vote)} if {a.if} <span className="text-ink-soft">— {a.citation}</span></li>)}
          {m.variants?.map((v, k) => <li key={`v${k}`}>When {conditionClause(v.when, ctx).text}: {Object.entries(v.set).map(([key, val]) => `${SET_WORDS[key] ?? key}: ${key === "class" ? CLASS_LABELS[String(val)] : key === "vote" ? thresholdWords(val) : key === "reconsiderable" ? RECONSIDERABLE_LABELS[String(val) as keyof typeof RECONSIDERABLE_LABELS] : typeof val === "boolean" ? (val ? "yes" : "no") : String(val ?? "none")}`).join(", ")} <span className="text-ink-soft">— {v.citation}</span></li>)}
        </ul>
      )}
      <details className="text-sm">
        <summary className="cursor-pointer text-ink-soft">Name used in rules and floor states</summary>
        <TextField className="mt-1 max-w-xs" path={`motions.${i}.id`} label={`Identifier of ${m.name}`} at={at} disabled={readOnly} value={m.id} onChange={(v) => setMotion(i, { id: v })} hint="Rules and recorded floor states refer to the motion by this name." />
      </details>
      {!readOnly && (
        <div className="flex flex-wrap gap-2">
          <button type="button" className="gw-btn-quiet text-sm" onClick={onRank}>{ranked ? `Take ${m.name} out of the order` : `Give ${m.name} a place in the order`}</button>
          <button type="button" className="gw-btn-danger text-sm" onClick={() => { if (window.confirm(`Remove the motion “${m.name}” from the catalogue?`)) onRemove(); }}>Remove {m.name}</button>
        </div>
      )}
    </div>
  );
}
