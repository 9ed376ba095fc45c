/**
 * The rulebook's rules, each read as a sentence generated from its conditions (rule-sentence.ts)
 * with its citation, and edited through the guided condition builder. "Show the names used in
 * the file" switches a rule's conditions to the fact, path and operator names of the JSON.
 */
import { useState } from "react";
import { SEVERITY_LABELS } from "../../lib/procedure/fact-descriptions.ts";
import { ruleSentence, sentenceContext } from "../../lib/procedure/rule-sentence.ts";
import { FINDING_SEVERITIES, type RulebookInput } from "../../lib/procedure/rulebook-schema.ts";
import { RULE_SCOPES } from "../../lib/procedure/rule-vocabulary.ts";
import ConditionBuilder from "./ConditionBuilder.tsx";
import { SelectField, TextField, type IssueLookup } from "../shared/fields.tsx";

type Rule = RulebookInput["rules"][number];
const SCOPE_LABELS = { motion: "Makes a motion out of order", amendment: "Draws a finding on an amendment" } as const;
const SEVERITY_CHOICES = Object.fromEntries(FINDING_SEVERITIES.map((s) => [s, SEVERITY_LABELS[s].replace(/^an? /, "").replace(/^./, (c) => c.toUpperCase())])) as Record<(typeof FINDING_SEVERITIES)[number], string>;

export default function RulesPanel({ doc, at, issuePaths, readOnly, setRule, update }: { doc: RulebookInput; at: IssueLookup; issuePaths: string[]; readOnly: boolean; setRule: (i: number, p: Partial<Rule>) => void; update: (p: Partial<RulebookInput>) => void }) {
  const [opened, setOpened] = useState<number | null>(null);
  const [names, setNames] = useState<Set<number>>(new Set());
  const ctx = sentenceContext(doc);
  const motions = doc.motions.map((m) => ({ id: m.id, name: m.name }));
  return (
    <div className="space-y-3">
      <p className="gw-hint">Each rule says when a motion is out of order, or when an amendment draws a finding, and where the chamber's rules say so. The sentence is written from the conditions below it.</p>
      <ol className="space-y-2" data-testid="rule-list">
        {doc.rules.map((r, i) => {
          const hasIssue = issuePaths.some((p) => p === `rules.${i}` || p.startsWith(`rules.${i}.`));
          const sentence = ruleSentence(r, ctx);
          const showNames = names.has(i);
          return (
            <li key={i} className="list-none">
              <details className="gw-card" data-rule={r.id} open={hasIssue || opened === i || undefined}>
                <summary className="cursor-pointer">
                  <span className="font-semibold" data-testid="rule-sentence">{sentence.text}</span> <span className="text-sm text-ink-soft">— {r.citation}</span>
                </summary>
                {sentence.undescribed.length > 0 && <p className="gw-hint mt-2">Part of this rule is read with the names used in the file, because the product has no words for it yet.</p>}
                <div className="mt-3 grid gap-3 md:grid-cols-2">
                  <SelectField path={`rules.${i}.scope`} label="What the rule does" at={at} disabled={readOnly} value={r.scope} options={RULE_SCOPES} labels={SCOPE_LABELS} onChange={(v) => setRule(i, { scope: v, ...(v === "amendment" ? { code: r.code ?? "needs-ruling", severity: r.severity ?? "warning" } : { code: undefined, severity: undefined, related: undefined }) })} />
                  <TextField path={`rules.${i}.citation`} label="Citation (the clause of the chamber's rules)" at={at} disabled={readOnly} value={r.citation} onChange={(v) => setRule(i, { citation: v })} />
                  <TextField className="md:col-span-2" multiline path={`rules.${i}.message`} label="Message shown when the rule applies" at={at} disabled={readOnly} value={r.message} onChange={(v) => setRule(i, { message: v })} hint="May name the motion with {motion.name} and the pending question with {immediatelyPending.name}." />
                  {r.scope === "amendment" && <SelectField path={`rules.${i}.severity`} label="The finding is" at={at} disabled={readOnly} value={r.severity} options={FINDING_SEVERITIES} labels={SEVERITY_CHOICES} onChange={(v) => setRule(i, { severity: v })} />}
                </div>
                <div className="mt-3 flex flex-wrap items-center justify-between gap-2">
                  <p className="gw-label">Conditions</p>
                  <label className="flex items-center gap-1.5 text-sm text-ink-soft">
                    <input type="checkbox" checked={showNames} onChange={(e) => setNames((s) => { const n = new Set(s); if (e.target.checked) n.add(i); else n.delete(i); return n; })} /> Show the names used in the file
                  </label>
                </div>
                <ConditionBuilder node={r.conditions} path={`rules.${i}.conditions`} scope={r.scope} at={at} readOnly={readOnly} names={showNames} motions={motions} onChange={(c) => setRule(i, { conditions: c })} />
                {showNames && (
                  <div className="mt-3 grid gap-3 md:grid-cols-2">
                    <TextField path={`rules.${i}.id`} label="Rule name in the file" at={at} disabled={readOnly} value={r.id} onChange={(v) => setRule(i, { id: v })} />
                    {r.scope === "amendment" && <TextField path={`rules.${i}.code`} label="Finding code (for exports)" at={at} disabled={readOnly} value={r.code} onChange={(v) => setRule(i, { code: v || undefined })} />}
                  </div>
                )}
                {!readOnly && (
                  <button type="button" className="gw-btn-danger mt-3" onClick={() => { if (window.confirm(`Remove the rule “${sentence.text}”?`)) update({ rules: doc.rules.filter((_, j) => j !== i) }); }}>
                    Remove this rule
                  </button>
                )}
              </details>
            </li>
          );
        })}
      </ol>
      {!readOnly && (
        <button
          type="button"
          className="gw-btn-quiet"
          onClick={() => {
            const taken = new Set(doc.rules.map((r) => r.id));
            let n = doc.rules.length + 1;
            while (taken.has(`rule-${n}`)) n++;
            update({ rules: [...doc.rules, { id: `rule-${n}`, scope: "motion", citation: "Standing orders", message: "{motion.name} is out of order here.", conditions: { all: [{ fact: "motion", path: "$.id", operator: "equal", value: doc.motions[0]?.id ?? "main" }] } }] });
            setOpened(doc.rules.length);
          }}
        >
          + Add a rule
        </button>
      )}
    </div>
  );
}
