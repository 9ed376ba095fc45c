/**
 * The chamber's own rules beside a rulebook version: upload the document (PDF, Word, text, Markdown),
 * see it split into numbered clauses, link motions, rules and thresholds to the clauses they encode
 * (saved as a new version), and the coverage: clauses no item cites, motions and rules citing none.
 */
import { useCallback, useEffect, useState } from "react";
import { z } from "zod";
import { apiCall, ApiError, type Issue } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import { Alert } from "../shared/Alert.tsx";

const clauseSchema = z.object({ key: z.string(), label: z.string(), title: z.string().nullable(), text: z.string(), level: z.number(), parent: z.string().nullable() });
const itemSchema = z.object({ path: z.string(), kind: z.enum(["motion", "rule", "threshold", "section"]), label: z.string(), citation: z.string().nullable(), clause: z.string().nullable() });
const coverageSchema = z.object({
  version: z.object({ id: z.string(), number: z.number() }),
  text: z.object({ id: z.string(), number: z.number(), title: z.string(), filename: z.string(), createdAt: z.string(), clauses: z.array(clauseSchema) }).nullable(),
  items: z.array(itemSchema),
  coverage: z
    .object({
      uncitedClauses: z.array(clauseSchema),
      itemsWithoutClause: z.array(itemSchema),
      brokenLinks: z.array(itemSchema),
      linked: z.array(itemSchema.extend({ clauseLabel: z.string() })),
      counts: z.object({ clauses: z.number(), citedClauses: z.number(), items: z.number(), linkedItems: z.number() }),
    })
    .nullable(),
});
type CoverageData = z.output<typeof coverageSchema>;
type ClauseRow = z.output<typeof clauseSchema>;
const uploadedSchema = z.object({ id: z.string(), number: z.number(), clauses: z.number() });
const savedSchema = z.object({ id: z.string(), number: z.number() });

const KIND_WORDS = { motion: "Motion", rule: "Rule", threshold: "Threshold", section: "Section" } as const;

function ClauseText({ clause }: { clause: ClauseRow }) {
  return (
    <details className="text-sm">
      <summary className="cursor-pointer">
        <span className="font-semibold">{clause.label}</span>
        {clause.title ? ` — ${clause.title}` : ""}
      </summary>
      <p className="mt-1 whitespace-pre-wrap border-l-2 border-rule pl-3 text-ink-soft">{clause.text || "(no text of its own; see the clauses within it)"}</p>
    </details>
  );
}

export default function ChamberTextPanel({ versionId, canEdit }: { versionId: string; canEdit: boolean }) {
  const [data, setData] = useState<CoverageData | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string; issues?: Issue[] } | null>(null);
  const [busy, setBusy] = useState(false);
  const [file, setFile] = useState<File | null>(null);
  const [pending, setPending] = useState<Array<{ path: string; clause: string }>>([]);
  const [item, setItem] = useState("");
  const [clause, setClause] = useState("");

  const load = useCallback(async () => {
    try {
      setData(await apiCall(coverageSchema, `/api/rulebooks/${versionId}/coverage`));
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not load the chamber's rules.");
    }
  }, [versionId]);
  useEffect(() => void load(), [load]);

  if (error) return <Alert>{error}</Alert>;
  if (!data) return <p className="text-ink-soft">Loading the chamber's rules…</p>;
  const clauses = data.text?.clauses ?? [];
  const byKey = new Map(clauses.map((c) => [c.key, c]));
  const itemByPath = new Map(data.items.map((i) => [i.path, i]));
  const linkable = data.items.filter((i) => i.kind !== "section");

  async function upload() {
    if (!file) return;
    setBusy(true);
    setMessage(null);
    const form = new FormData();
    form.set("file", file);
    try {
      const r = await apiCall(uploadedSchema, "/api/rulebooks/text", { method: "POST", form });
      setMessage({ tone: "ok", text: `Uploaded as text ${r.number}: ${r.clauses} numbered clauses found.` });
      setFile(null);
      await load();
    } catch (e) {
      setMessage({ tone: "error", text: e instanceof Error ? e.message : "Not uploaded.", issues: e instanceof ApiError ? e.issues : [] });
    } finally {
      setBusy(false);
    }
  }

  async function saveLinks() {
    setBusy(true);
    setMessage(null);
    try {
      const r = await apiCall(savedSchema, `/api/rulebooks/${versionId}/links`, { method: "POST", body: { links: pending, textId: data!.text?.id } });
      window.location.assign(`/rulebooks/${r.id}?saved=${r.number}#chamber-text`);
    } catch (e) {
      setMessage({ tone: "error", text: e instanceof Error ? e.message : "Links not saved.", issues: e instanceof ApiError ? e.issues : [] });
      setBusy(false);
    }
  }

  const c = data.coverage;
  return (
    <section id="chamber-text" className="gw-card space-y-4" aria-labelledby="chamber-text-h" data-testid="chamber-text">
      <div>
        <h2 id="chamber-text-h" className="text-step-1">The chamber's own rules</h2>
        {data.text ? (
          <p className="text-sm text-ink-soft" data-testid="chamber-text-summary">
            Text {data.text.number}: “{data.text.title}” ({data.text.filename}), uploaded {when(data.text.createdAt)} — {clauses.length} numbered clauses.
          </p>
        ) : (
          <p className="text-sm text-ink-soft">No text of the chamber's rules yet. Upload it to link each motion and rule to the clause it encodes.</p>
        )}
      </div>

      {canEdit && (
        <div className="flex flex-wrap items-end gap-3">
          <div className="min-w-0 flex-1">
            <label htmlFor="chamber-text-file" className="gw-label">{data.text ? "Upload a new text of the chamber's rules" : "Document of the chamber's rules"}</label>
            <input id="chamber-text-file" type="file" className="gw-input max-w-full" accept=".pdf,.docx,.txt,.md,.markdown" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
            <p className="gw-hint">PDF, Word (.docx), plain text or Markdown. Earlier texts are kept.</p>
          </div>
          <button type="button" className="gw-btn" disabled={busy || !file} onClick={() => void upload()}>Upload</button>
        </div>
      )}
      {message && <Alert tone={message.tone} testId="chamber-text-message" issues={message.issues?.filter((i) => !i.path.startsWith("("))}>{message.text}</Alert>}

      {data.text && canEdit && (
        <div className="space-y-2 border-t border-rule pt-3">
          <h3 className="font-semibold">Link to a clause</h3>
          <div className="grid gap-3 md:grid-cols-[1fr_1fr_auto] md:items-end">
            <div className="min-w-0">
              <label htmlFor="link-item" className="gw-label">Motion, rule or threshold</label>
              <select id="link-item" className="gw-input w-full" value={item} onChange={(e) => setItem(e.target.value)}>
                <option value="">Choose…</option>
                {linkable.map((i) => (
                  <option key={i.path} value={i.path}>
                    {KIND_WORDS[i.kind]}: {i.label.length > 90 ? `${i.label.slice(0, 90)}…` : i.label}
                    {i.clause && byKey.has(i.clause) ? ` (now ${byKey.get(i.clause)!.label})` : ""}
                  </option>
                ))}
              </select>
            </div>
            <div className="min-w-0">
              <label htmlFor="link-clause" className="gw-label">Clause</label>
              <select id="link-clause" className="gw-input w-full" value={clause} onChange={(e) => setClause(e.target.value)}>
                <option value="">Choose…</option>
                {clauses.map((x) => (
                  <option key={x.key} value={x.key}>
                    {"\u00a0".repeat(x.level * 2)}
                    {x.label}
                    {x.title ? ` — ${x.title}` : x.text ? ` — ${x.text.slice(0, 50)}${x.text.length > 50 ? "…" : ""}` : ""}
                  </option>
                ))}
              </select>
            </div>
            <button
              type="button"
              className="gw-btn-quiet"
              disabled={!item || !clause}
              onClick={() => {
                setPending([...pending.filter((p) => p.path !== item), { path: item, clause }]);
                setItem("");
                setClause("");
              }}
            >
              Add link
            </button>
          </div>
          {pending.length > 0 && (
            <div data-testid="pending-links">
              <ul className="list-disc pl-5 text-sm">
                {pending.map((p) => (
                  <li key={p.path}>
                    {KIND_WORDS[itemByPath.get(p.path)!.kind]} “{itemByPath.get(p.path)!.label}” → {byKey.get(p.clause)?.label}{" "}
                    <button type="button" className="underline" onClick={() => setPending(pending.filter((x) => x.path !== p.path))}>remove</button>
                  </li>
                ))}
              </ul>
              <button type="button" className="gw-btn mt-2" disabled={busy} onClick={() => void saveLinks()}>
                Save {pending.length === 1 ? "this link" : `these ${pending.length} links`} as a new version
              </button>
            </div>
          )}
        </div>
      )}

      {c && (
        <div className="space-y-3 border-t border-rule pt-3" data-testid="coverage">
          <h3 className="font-semibold">Coverage</h3>
          <p className="text-sm">
            {c.counts.citedClauses} of {c.counts.clauses} clauses are cited; {c.counts.linkedItems} items of this version are linked to a clause.
          </p>
          <div className="grid gap-4 md:grid-cols-2">
            <div data-testid="uncited-clauses">
              <h4 className="text-sm font-semibold">Clauses no rule cites ({c.uncitedClauses.length})</h4>
              {c.uncitedClauses.length === 0 ? <p className="text-sm text-ink-soft">Every clause is cited.</p> : <ul className="mt-1 space-y-1">{c.uncitedClauses.map((x) => <li key={x.key}><ClauseText clause={x} /></li>)}</ul>}
            </div>
            <div data-testid="items-without-clause">
              <details open={c.itemsWithoutClause.length <= 12}>
                <summary className="cursor-pointer text-sm font-semibold">Motions and rules that cite no clause ({c.itemsWithoutClause.length})</summary>
                <ul className="mt-1 list-disc pl-5 text-sm">
                  {c.itemsWithoutClause.map((i) => (
                    <li key={i.path}>
                      {KIND_WORDS[i.kind]}: {i.label}
                    </li>
                  ))}
                </ul>
              </details>
            </div>
          </div>
          {c.brokenLinks.length > 0 && (
            <Alert look="box" testId="broken-links">
              Linked to clauses this text does not have: {c.brokenLinks.map((i) => `${KIND_WORDS[i.kind]} “${i.label}”`).join("; ")}. Upload the text they were linked to, or link them again.
            </Alert>
          )}
          {c.linked.length > 0 && (
            <div data-testid="linked">
              <h4 className="text-sm font-semibold">Linked ({c.linked.length})</h4>
              <ul className="mt-1 space-y-1">
                {c.linked.map((i) => (
                  <li key={i.path} className="text-sm">
                    {KIND_WORDS[i.kind]} “{i.label}” encodes <ClauseText clause={byKey.get(i.clause!)!} />
                  </li>
                ))}
              </ul>
            </div>
          )}
        </div>
      )}
    </section>
  );
}
