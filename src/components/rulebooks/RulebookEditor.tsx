import { useEffect, useMemo, useState } from "react";
import { z } from "zod";
import { AMENDMENT_FORMS } from "../../lib/amendments/case-schema.ts";
import { isGavelError } from "../../lib/errors.ts";
import { parseRulebook } from "../../lib/procedure/parse-rulebook.ts";
import { rulebookSchema, type MotionInput, type RulebookInput } from "../../lib/procedure/rulebook-schema.ts";
import { ORDER_CONSTRAINTS, QUORUM_KINDS, TIE_RULES, VOTE_THRESHOLDS } from "../../lib/procedure/voting-section.ts";
import { apiCall, ApiError, type Issue } from "../shared/api.ts";
import { day, today, when } from "../shared/dates.ts";
import { OperatorList } from "./ConditionBuilder.tsx";
import MotionCatalogue from "./MotionCatalogue.tsx";
import RulesPanel from "./RulesPanel.tsx";
import { CheckField, FieldMessages, issueLookup, NumberField, SelectField, TextField, type IssueLookup } from "../shared/fields.tsx";
import { adoptedSchema, documentSchema, librarySchema, savedSchema, staleSchema, templateSchema, versionSchema } from "./schemas.ts";
import { Alert } from "../shared/Alert.tsx";

type Rule = RulebookInput["rules"][number];
type Tab = "motions" | "rules" | "sections" | "raw";

interface Props {
  /** Open this version… */
  versionId?: string;
  /** …or start a new version from this template. */
  template?: string;
  canEdit: boolean;
  canAdopt: boolean;
}

interface Loaded {
  doc: RulebookInput;
  basedOn: string | null;
  meta: z.output<typeof versionSchema> | null;
  latest: { id: string; number: number } | null;
}

const VOTE_LABELS: Record<(typeof VOTE_THRESHOLDS)[number], string> = { majority: "Majority", "two-thirds": "Two-thirds", "majority-of-members": "Majority of members", none: "None", "two-thirds-of-members": "Two-thirds of members", "three-fifths-of-members": "Three-fifths of members", "two-thirds-of-present": "Two-thirds of members present" };
const TIE_LABELS: Record<(typeof TIE_RULES)[number], string> = { "motion-fails": "A tie defeats the motion", "chair-casting-vote": "The chair votes only to break a tie", "chair-votes": "The chair votes on every question", "chair-may-make-or-break-tie": "The chair may vote to make or break a tie" };

/** Validation with the core's own parser, run as the clerk types; the server runs the same on save. */
function validate(doc: unknown): Issue[] {
  try {
    parseRulebook(doc);
    return [];
  } catch (e) {
    if (isGavelError(e)) return e.issues.length ? e.issues : [{ path: "(root)", message: e.message }];
    return [{ path: "(root)", message: "could not be checked" }];
  }
}

export default function RulebookEditor({ versionId, template, canEdit, canAdopt }: Props) {
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [doc, setDoc] = useState<RulebookInput | null>(null);
  const [rev, setRev] = useState(0);
  const [tab, setTab] = useState<Tab>("motions");
  const [note, setNote] = useState("");
  const [serverIssues, setServerIssues] = useState<Issue[]>([]);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [stale, setStale] = useState<z.output<typeof staleSchema> | null>(null);
  const [busy, setBusy] = useState(false);
  const [effective, setEffective] = useState(() => today());
  const [adoptNote, setAdoptNote] = useState("");
  const [loadError, setLoadError] = useState<string | null>(null);
  /** The template's title, shown instead of its file name. */
  const [templateName, setTemplateName] = useState<string | null>(null);

  useEffect(() => {
    (async () => {
      try {
        if (versionId) {
          const v = await apiCall(versionSchema, `/api/rulebooks/${versionId}`);
          const d = documentSchema.parse(v.document);
          setLoaded({ doc: d, basedOn: v.id, meta: v, latest: v.latest });
          setDoc(d);
        } else {
          const lib = await apiCall(librarySchema, "/api/rulebooks");
          let d: RulebookInput;
          let templateTitle: string | null = null;
          if (template) {
            const t = await apiCall(templateSchema, `/api/rulebooks/templates/${encodeURIComponent(template)}`);
            templateTitle = t.title;
            d = documentSchema.parse(t.document);
          } else if (lib.latest) d = documentSchema.parse((await apiCall(versionSchema, `/api/rulebooks/${lib.latest.id}`)).document);
          else throw new Error("Choose a template to start from.");
          setLoaded({ doc: d, basedOn: lib.latest?.id ?? null, meta: null, latest: lib.latest });
          setDoc(d);
          if (templateTitle) {
            setNote(`Started from the template “${templateTitle}”`);
            setTemplateName(templateTitle);
          }
        }
      } catch (e) {
        setLoadError(e instanceof Error ? e.message : "Could not load the rulebook.");
      }
    })();
  }, [versionId, template]);

  const liveIssues = useMemo(() => (doc ? validate(doc) : []), [doc]);
  const issues = liveIssues.length ? liveIssues : serverIssues;
  const at = useMemo(() => issueLookup(issues), [issues]);
  const dirty = loaded !== null && doc !== null && JSON.stringify(doc) !== JSON.stringify(loaded.doc);

  if (loadError) return <Alert>{loadError}</Alert>;
  if (!loaded || !doc) return <p className="text-ink-soft">Loading the rulebook…</p>;
  const readOnly = !canEdit;
  const meta = loaded.meta;
  const notLatest = meta && loaded.latest && loaded.latest.id !== meta.id;

  const update = (patch: Partial<RulebookInput>) => {
    setDoc({ ...doc, ...patch });
    setServerIssues([]);
    setMessage(null);
  };
  const setMotion = (i: number, patch: Partial<MotionInput>) => update({ motions: doc.motions.map((m, j) => (j === i ? { ...m, ...patch } : m)) });
  const setRule = (i: number, patch: Partial<Rule>) => update({ rules: doc.rules.map((r, j) => (j === i ? { ...r, ...patch } : r)) });

  async function save() {
    if (!doc || !loaded) return;
    setBusy(true);
    setMessage(null);
    setStale(null);
    try {
      const r = await apiCall(savedSchema, "/api/rulebooks", { method: "POST", body: { basedOn: loaded.basedOn, note, document: doc, ...(template ? { template } : {}) } });
      window.location.assign(`/rulebooks/${r.id}?saved=${r.number}`);
    } catch (e) {
      if (e instanceof ApiError) {
        setServerIssues(e.issues.filter((i) => i.path !== "basedOn"));
        const s = staleSchema.safeParse(e.details);
        if (e.status === 409 && s.success) setStale(s.data);
        setMessage({ kind: "error", text: e.message });
      } else setMessage({ kind: "error", text: "Not saved: the server could not be reached." });
      setBusy(false);
    }
  }

  async function adopt() {
    if (!meta) return;
    setBusy(true);
    try {
      const r = await apiCall(adoptedSchema, `/api/rulebooks/${meta.id}/adopt`, { method: "POST", body: { effectiveFrom: effective, note: adoptNote } });
      setMessage({ kind: "ok", text: `Version ${r.number} adopted with effect from ${day(r.effectiveFrom)}${r.inForce ? "; it is now in force." : "; it comes into force on that date."}` });
      const v = await apiCall(versionSchema, `/api/rulebooks/${meta.id}`);
      setLoaded({ ...loaded!, meta: v });
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof Error ? e.message : "Not adopted." });
    } finally {
      setBusy(false);
    }
  }

  const tabButton = (t: Tab, label: string, prefixes: string[]) => {
    const n = issues.filter((i) => prefixes.some((p) => i.path === p || i.path.startsWith(`${p}.`))).length;
    return (
      <button type="button" role="tab" aria-selected={tab === t} onClick={() => setTab(t)} className={`rounded-t-md border border-b-0 px-3 py-1.5 text-sm font-semibold ${tab === t ? "border-rule bg-white text-chamber-dark" : "border-transparent text-ink-soft hover:text-ink"}`}>
        {label}
        {n > 0 && <span className="ml-1.5 rounded-full bg-verdict-bar px-1.5 text-xs text-white">{n}</span>}
      </button>
    );
  };

  return (
    <div className="space-y-4">
      <OperatorList />
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1>{doc.title}</h1>
          <p className="mt-1 text-sm text-ink-soft">
            {meta ? (
              <>
                Version {meta.number} · saved {when(meta.createdAt)} by {meta.author ?? "unknown"}
                {meta.note ? ` · “${meta.note}”` : ""}
                {meta.inForce && <span className="gw-chip ml-2 border-verdict-ok bg-verdict-ok-tint text-verdict-ok">In force</span>}
                {meta.adoptions.length > 0 && !meta.inForce && <span className="gw-chip ml-2 border-brass text-brass-text">Adopted {meta.adoptions.map((a) => day(a.effectiveFrom)).join(", ")}</span>}
              </>
            ) : (
              <>New version{templateName ? ` from the template “${templateName}”` : ""}, based on {loaded.latest ? `version ${loaded.latest.number}` : "nothing (the chamber's first rulebook)"}</>
            )}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {meta && <a className="gw-btn-quiet no-underline" href={`/api/rulebooks/${meta.id}/export`} download>Export JSON</a>}
          {meta && loaded.latest && loaded.latest.id !== meta.id && <a className="gw-btn-quiet no-underline" href={`/rulebooks/compare?from=${meta.id}&to=${loaded.latest.id}`}>Compare with latest</a>}
        </div>
      </header>

      {notLatest && canEdit && (
        <p className="gw-advisory">
          This is not the latest version (version {loaded.latest!.number} is). A save based on it would be refused as stale.{" "}
          <button type="button" className="font-semibold underline" onClick={() => setLoaded({ ...loaded, basedOn: loaded.latest!.id })}>Use this text as the next version after {loaded.latest!.number}</button>
        </p>
      )}
      {!canEdit && <p className="gw-hint">You can read this rulebook; clerks edit and adopt it.</p>}
      {message && <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "gw-error" : "font-semibold text-verdict-ok"} data-testid="editor-message">{message.text}</p>}
      {stale && (
        <div className="gw-card border-verdict-bar" data-testid="stale">
          <h2 className="text-step-1">Someone saved first</h2>
          <p className="text-sm">Saved since you started: {stale.savedSince.map((v) => `version ${v.number} by ${v.author ?? "someone"}${v.note ? ` (“${v.note}”)` : ""}`).join("; ")}. What changed:</p>
          <ul className="mt-1 list-disc pl-5 text-sm">{stale.plainChanges.length ? stale.plainChanges.map((c, n) => <li key={n}>{c.from !== undefined || c.to !== undefined ? `${c.what}: ${c.from ?? "—"} → ${c.to ?? "—"}` : `${c.what}: ${c.text ?? ""}`}{c.citation ? ` (${c.citation})` : ""}</li>) : stale.changes.summary.map((s) => <li key={s}>{s}</li>)}</ul>
          <p className="mt-2 text-sm">Your edits are still here. <a href={`/rulebooks/${stale.latest.id}`} target="_blank" rel="noreferrer">Open version {stale.latest.number}</a> to merge by hand, or <button type="button" className="font-semibold underline" onClick={() => { setLoaded({ ...loaded, basedOn: stale.latest.id }); setStale(null); setMessage(null); }}>save over it as the next version</button>.</p>
        </div>
      )}

      <div role="tablist" className="flex flex-wrap gap-1 border-b border-rule">
        {tabButton("motions", "Motion catalogue", ["motions", "precedence"])}
        {tabButton("rules", "Rules", ["rules"])}
        {tabButton("sections", "Amendments, voting & chamber", ["amendments", "voting", "chamber", "source", "title", "id", "version"])}
        {tabButton("raw", "Raw JSON", ["(root)", "format", "formatVersion"])}
      </div>

      <div key={rev}>
        {tab === "motions" && <MotionCatalogue doc={doc} at={at} readOnly={readOnly} setMotion={setMotion} update={update} />}
        {tab === "rules" && <RulesPanel doc={doc} at={at} issuePaths={issues.map((x) => x.path)} readOnly={readOnly} setRule={setRule} update={update} />}
        {tab === "sections" && <SectionsPanel doc={doc} at={at} readOnly={readOnly} update={update} />}
        {tab === "raw" && <RawPanel doc={doc} readOnly={readOnly} onApply={(d) => { setDoc(d); setRev(rev + 1); setServerIssues([]); }} />}
      </div>

      {issues.length > 0 && (
        <section className="gw-card border-verdict-bar" aria-labelledby="issues-h" data-testid="issues">
          <h2 id="issues-h" className="text-step-1">{issues.length} problem{issues.length === 1 ? "" : "s"} to fix before saving</h2>
          <ul className="mt-1 list-disc pl-5 text-sm">{issues.slice(0, 30).map((i, n) => <li key={n}><code>{i.path}</code>: {i.message}</li>)}</ul>
        </section>
      )}

      {canEdit && (
        <section className="gw-card flex flex-wrap items-end gap-3" aria-label="Save">
          <div className="min-w-64 flex-1">
            <TextField path="(note)" label="Note for this version" at={() => []} value={note} maxLength={1000} onChange={setNote} hint="Saving adds a new version; earlier versions are kept." />
          </div>
          <button type="button" className="gw-btn" disabled={busy || issues.length > 0 || (!dirty && !!meta && loaded.basedOn === meta.id)} onClick={() => void save()}>
            Save as new version
          </button>
        </section>
      )}

      {canAdopt && meta && (
        <section className="gw-card flex flex-wrap items-end gap-3" aria-label="Adopt">
          <div>
            <label htmlFor="adopt-date" className="gw-label">Effective from</label>
            <input id="adopt-date" type="date" className="gw-input" value={effective} onChange={(e) => setEffective(e.target.value)} />
          </div>
          <div className="min-w-64 flex-1">
            <label htmlFor="adopt-note" className="gw-label">Adoption note (e.g. the resolution)</label>
            <input id="adopt-note" className="gw-input" value={adoptNote} maxLength={1000} onChange={(e) => setAdoptNote(e.target.value)} />
          </div>
          <button type="button" className="gw-btn" disabled={busy || dirty} onClick={() => void adopt()}>Adopt version {meta.number}</button>
          {dirty && <p className="gw-hint w-full">Save your edits first; an adoption applies to a saved version.</p>}
        </section>
      )}
    </div>
  );
}

function SectionsPanel({ doc, at, readOnly, update }: { doc: RulebookInput; at: IssueLookup; readOnly: boolean; update: (p: Partial<RulebookInput>) => void }) {
  const a = doc.amendments;
  const v = doc.voting;
  const setA = (p: Partial<RulebookInput["amendments"]>) => update({ amendments: { ...a, ...p } });
  const setV = (p: Partial<RulebookInput["voting"]>) => update({ voting: { ...v, ...p } });
  const quorum = v.quorum ?? { kind: "majority-of-members" as const };
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <fieldset className="gw-card space-y-3">
        <legend className="px-1 font-serif text-step-1 font-semibold text-chamber-dark">Amendments</legend>
        <SelectField path="amendments.motion" label="Catalogue motion to amend" at={at} disabled={readOnly} value={a.motion ?? "amend"} options={doc.motions.map((m) => m.id)} onChange={(x) => setA({ motion: x })} />
        <div>
          <p className="gw-label">Forms allowed</p>
          <div className="flex flex-wrap gap-3">
            {AMENDMENT_FORMS.map((f) => (
              <label key={f} className="flex items-center gap-1.5 text-sm">
                <input type="checkbox" disabled={readOnly} checked={a.forms.includes(f)} onChange={(e) => setA({ forms: e.target.checked ? [...a.forms, f] : a.forms.filter((x) => x !== f) })} /> {f}
              </label>
            ))}
          </div>
          <FieldMessages path="amendments.forms" at={at} />
        </div>
        <div className="grid grid-cols-2 gap-3">
          <NumberField path="amendments.maxDegree" label="Maximum degree" at={at} disabled={readOnly} value={a.maxDegree} min={1} max={10} onChange={(x) => setA({ maxDegree: x ?? 1 })} />
          <NumberField nullable path="amendments.pendingPerSlot" label="Pending per slot" at={at} disabled={readOnly} value={a.pendingPerSlot} min={1} onChange={(x) => setA({ pendingPerSlot: x })} />
          <NumberField nullable path="amendments.maxPending" label="Pending on a measure at most" at={at} disabled={readOnly} value={a.maxPending} min={1} onChange={(x) => setA({ maxPending: x })} />
          <NumberField path="amendments.minSponsors" label="Minimum sponsors" at={at} disabled={readOnly} value={a.minSponsors ?? 1} min={0} onChange={(x) => setA({ minSponsors: x ?? 0 })} />
        </div>
        <CheckField path="amendments.substituteSlot" label="A substitute has its own slot beside the perfecting amendment (four-amendment tree)" at={at} disabled={readOnly} checked={a.substituteSlot ?? false} onChange={(x) => setA({ substituteSlot: x })} />
        <CheckField path="amendments.substituteForAmendment" label="A substitute for a first-degree amendment counts as first degree, with its own amendment (House Rule XVI cl. 6)" at={at} disabled={readOnly} checked={a.substituteForAmendment ?? false} onChange={(x) => setA({ substituteForAmendment: x })} />
        <SelectField path="amendments.perfectingUnderSubstitute" label="An amendment to the text a pending substitute would strike out is of the" at={at} disabled={readOnly} value={a.perfectingUnderSubstitute ?? "first-degree"} options={["first-degree", "second-degree"] as const} labels={{ "first-degree": "first degree (its own place)", "second-degree": "second degree, under the substitute (RONR 1915 §33)" }} onChange={(x) => setA({ perfectingUnderSubstitute: x })} />
        <div className="grid grid-cols-2 gap-3">
          <SelectField path="amendments.germaneness.test" label="Germaneness test" at={at} disabled={readOnly} value={a.germaneness.test} options={["subjects", "section", "committee", "none"] as const} onChange={(x) => setA({ germaneness: { ...a.germaneness, test: x } })} />
          <TextField path="amendments.germaneness.citation" label="Germaneness citation" at={at} disabled={readOnly} value={a.germaneness.citation} onChange={(x) => setA({ germaneness: { ...a.germaneness, citation: x } })} />
          <NumberField nullable path="amendments.filingDeadline.hoursBefore" label="Filing deadline (hours before the sitting)" at={at} disabled={readOnly} value={a.filingDeadline?.hoursBefore ?? null} min={0} onChange={(x) => setA({ filingDeadline: x === null ? null : { hoursBefore: x, citation: a.filingDeadline?.citation ?? "Standing orders" } })} />
          {a.filingDeadline && <TextField path="amendments.filingDeadline.citation" label="Filing deadline citation" at={at} disabled={readOnly} value={a.filingDeadline.citation} onChange={(x) => setA({ filingDeadline: { ...a.filingDeadline!, citation: x } })} />}
        </div>
        <TextField path="amendments.citation" label="Citation for the amendment rules" at={at} disabled={readOnly} value={a.citation} onChange={(x) => setA({ citation: x })} />
      </fieldset>
      <fieldset className="gw-card space-y-3">
        <legend className="px-1 font-serif text-step-1 font-semibold text-chamber-dark">Voting</legend>
        <SelectField path="voting.procedure" label="Procedure" at={at} disabled={readOnly} value={v.procedure} options={["amendment", "successive"] as const} labels={{ amendment: "Amendment procedure (pairwise)", successive: "Successive procedure" }} onChange={(x) => setV({ procedure: x })} />
        <div>
          <p className="gw-label">Ordering constraints</p>
          {ORDER_CONSTRAINTS.map((c) => (
            <label key={c} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" disabled={readOnly} checked={(v.constraints ?? []).includes(c)} onChange={(e) => setV({ constraints: e.target.checked ? [...(v.constraints ?? []), c] : (v.constraints ?? []).filter((x) => x !== c) })} /> {c}
            </label>
          ))}
          <FieldMessages path="voting.constraints" at={at} />
        </div>
        <div className="grid grid-cols-2 gap-3">
          <SelectField path="voting.tieRule" label="Tie rule" at={at} disabled={readOnly} value={v.tieRule ?? "motion-fails"} options={TIE_RULES} labels={TIE_LABELS} onChange={(x) => setV({ tieRule: x })} />
          <SelectField path="voting.amendmentThreshold" label="Threshold to adopt an amendment" at={at} disabled={readOnly} value={typeof v.amendmentThreshold === "string" ? v.amendmentThreshold : "majority"} options={VOTE_THRESHOLDS} labels={VOTE_LABELS} onChange={(x) => setV({ amendmentThreshold: x })} />
          <SelectField path="voting.passageThreshold" label="Threshold for final passage (unset: the main motion's vote)" at={at} disabled={readOnly} value={typeof v.passageThreshold === "string" ? v.passageThreshold : "none"} options={VOTE_THRESHOLDS} labels={{ ...VOTE_LABELS, none: "The main motion's vote" }} onChange={(x) => setV({ passageThreshold: x === "none" ? undefined : x })} />
          {(typeof v.amendmentThreshold === "object" || typeof v.passageThreshold === "object") && (
            <p className="gw-hint col-span-2">
              {typeof v.amendmentThreshold === "object" ? `Amendments need a fixed number: at least ${v.amendmentThreshold.value} votes in favour. ` : ""}
              {typeof v.passageThreshold === "object" ? `Passage needs a fixed number: at least ${v.passageThreshold.value} votes in favour. ` : ""}
              Choosing a threshold above replaces the fixed number.
            </p>
          )}
          <SelectField path="voting.quorum.kind" label="Quorum" at={at} disabled={readOnly} value={quorum.kind} options={QUORUM_KINDS} onChange={(x) => setV({ quorum: { ...quorum, kind: x } })} />
          {quorum.kind === "number" && <NumberField path="voting.quorum.value" label="Quorum (members)" at={at} disabled={readOnly} value={quorum.value ?? null} nullable min={1} onChange={(x) => setV({ quorum: { ...quorum, value: x ?? undefined } })} />}
          {quorum.kind === "fraction" && <NumberField path="voting.quorum.numerator" label="Quorum: numerator (of the members)" at={at} disabled={readOnly} value={quorum.numerator ?? null} nullable min={1} onChange={(x) => setV({ quorum: { ...quorum, numerator: x ?? undefined } })} />}
          {quorum.kind === "fraction" && <NumberField path="voting.quorum.denominator" label="Quorum: denominator" at={at} disabled={readOnly} value={quorum.denominator ?? null} nullable min={1} onChange={(x) => setV({ quorum: { ...quorum, denominator: x ?? undefined } })} />}
        </div>
        <TextField path="voting.citation" label="Citation for the voting rules" at={at} disabled={readOnly} value={v.citation} onChange={(x) => setV({ citation: x })} />
      </fieldset>
      <fieldset className="gw-card space-y-3 lg:col-span-2">
        <legend className="px-1 font-serif text-step-1 font-semibold text-chamber-dark">Rulebook and chamber</legend>
        <div className="grid gap-3 md:grid-cols-3">
          <TextField path="title" label="Title" at={at} disabled={readOnly} value={doc.title} onChange={(x) => update({ title: x })} />
          <TextField path="id" label="Rulebook id" at={at} disabled={readOnly} value={doc.id} onChange={(x) => update({ id: x })} />
          <TextField path="version" label="Edition label" at={at} disabled={readOnly} value={doc.version} onChange={(x) => update({ version: x || undefined })} />
          <TextField path="chamber.name" label="Chamber name" at={at} disabled={readOnly} value={doc.chamber.name} onChange={(x) => update({ chamber: { ...doc.chamber, name: x } })} />
          <NumberField nullable path="chamber.members" label="Members" at={at} disabled={readOnly} value={doc.chamber.members ?? null} min={1} onChange={(x) => update({ chamber: { ...doc.chamber, members: x ?? undefined } })} />
          <TextField path="source.title" label="Source" at={at} disabled={readOnly} value={doc.source.title} onChange={(x) => update({ source: { ...doc.source, title: x } })} />
          <TextField path="source.edition" label="Edition of the source" at={at} disabled={readOnly} value={doc.source.edition} onChange={(x) => update({ source: { ...doc.source, edition: x || undefined } })} />
          <TextField path="source.date" label="Date of the text used" at={at} disabled={readOnly} value={doc.source.date} onChange={(x) => update({ source: { ...doc.source, date: x || undefined } })} />
        </div>
        <VerifyField doc={doc} at={at} readOnly={readOnly} update={update} />
      </fieldset>
    </div>
  );
}

/** The "verify before use" list, one point per line; blank lines are dropped from the rulebook but kept while typing. */
function VerifyField({ doc, at, readOnly, update }: { doc: RulebookInput; at: IssueLookup; readOnly: boolean; update: (p: Partial<RulebookInput>) => void }) {
  const [text, setText] = useState(() => (doc.source.verify ?? []).join("\n"));
  return (
    <TextField
      multiline
      path="source.verify"
      label="Verify before use (one point per line)"
      at={at}
      disabled={readOnly}
      value={text}
      onChange={(x) => {
        setText(x);
        update({ source: { ...doc.source, verify: x.split("\n").map((l) => l.trim()).filter(Boolean) } });
      }}
    />
  );
}

function RawPanel({ doc, readOnly, onApply }: { doc: RulebookInput; readOnly: boolean; onApply: (d: RulebookInput) => void }) {
  const [text, setText] = useState(() => JSON.stringify(doc, null, 2));
  const [problems, setProblems] = useState<Issue[]>([]);
  const apply = () => {
    let value: unknown;
    try {
      value = JSON.parse(text);
    } catch (e) {
      setProblems([{ path: "(root)", message: `not valid JSON: ${(e as Error).message}` }]);
      return;
    }
    const r = rulebookSchema.safeParse(value);
    if (!r.success) {
      setProblems(r.error.issues.map((i) => ({ path: i.path.join(".") || "(root)", message: i.message })));
      return;
    }
    setProblems([]);
    onApply(documentSchema.parse(value));
  };
  return (
    <div className="space-y-2">
      <label htmlFor="raw-json" className="gw-label">The rulebook as JSON</label>
      <textarea id="raw-json" className="gw-input h-[32rem] font-mono text-xs" spellCheck={false} readOnly={readOnly} value={text} onChange={(e) => setText(e.target.value)} />
      {problems.length > 0 && <Alert issues={problems} showPaths listFrom={1}>Not applied:</Alert>}
      {!readOnly && <button type="button" className="gw-btn" onClick={apply}>Apply to the forms</button>}
      <p className="gw-hint">The format is described in docs/rulebook-format.md. Applying checks the shape; the tabs then show any remaining problem at its field.</p>
    </div>
  );
}
