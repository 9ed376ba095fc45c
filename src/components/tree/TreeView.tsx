import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from "react";
import { Background, Controls, MiniMap, ReactFlow, ReactFlowProvider, useReactFlow, type Edge } from "@xyflow/react";
import "@xyflow/react/dist/style.css";
import { formLabel, statusLabel, treeViewSchema, type FindingView, type TreeNodeView, type TreeView as TreeData } from "../../lib/measures/measure-schemas.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { conflictText } from "../measures/api.ts";
import { layoutTree } from "./layout.ts";
import { roleWords, slotWords } from "./role-words.ts";
import TreeLegend from "./TreeLegend.tsx";
import ClauseCitation from "../rulebooks/ClauseCitation.tsx";
import TreeNodeCard, { type TreeFlowNode } from "./TreeNodeCard.tsx";
import { z } from "zod";
import { Alert } from "../shared/Alert.tsx";
import { day, when } from "../shared/dates.ts";

interface Props {
  measureId: string;
  initial: TreeData;
  canOverride: boolean;
}

const nodeTypes = { tree: TreeNodeCard };
const SEVERITY_WORDS: Record<string, string> = { error: "error", warning: "warning", info: "note" };
const SEVERITY_CHIP: Record<string, string> = { error: "border-verdict-bar bg-verdict-bar-tint text-verdict-bar", warning: "border-verdict-query bg-verdict-query-tint text-verdict-query", info: "border-chamber bg-chamber-tint text-chamber-dark" };
const LARGE = 40;
/** Below this zoom the drawing's smallest text (12 px) would read under 11 px. */
const LEGIBLE = 0.9;

/** What an amendment amends, in words. */
function targetWords(byKey: Map<string, TreeNodeView>, key: string | null): string {
  const t = key ? byKey.get(key) : undefined;
  if (!t) return "(missing target)";
  return t.kind === "measure" ? `the whole measure (${t.label})` : t.kind === "section" ? `§ ${t.label}` : `Amendment ${t.label}`;
}

/** The other amendments a finding concerns, as a person reads them (the tree's keys: "A3", a draft "Draft"). */
function relatedWords(f: FindingView): string[] {
  return (f.related ?? []).filter((k) => k !== f.amendment);
}

/** The other amendments a finding concerns (conflicts, cycles, perfecting before a substitute), in words. */
function RelatedAmendments({ finding }: { finding: FindingView }) {
  const others = relatedWords(finding);
  if (others.length === 0) return null;
  return <p className="text-sm" data-testid={`related-amendments-${finding.amendment}`}>Other amendments concerned: {others.join(", ")}.</p>;
}

/** The tree as an indented outline, in reading order: the view on narrow screens. */
function Outline({ data, selected, onSelect }: { data: TreeData; selected: string; onSelect: (key: string) => void }) {
  const children = new Map<string, TreeNodeView[]>();
  for (const n of data.nodes) if (n.parent) children.set(n.parent, [...(children.get(n.parent) ?? []), n]);
  const errors = new Map<string, number>();
  for (const f of data.findings) if (!f.overridden && f.severity === "error") errors.set(f.amendment, (errors.get(f.amendment) ?? 0) + 1);
  const item = (n: TreeNodeView, seen: Set<string>): ReactNode => {
    if (seen.has(n.key)) return null;
    seen.add(n.key);
    const kids = children.get(n.key) ?? [];
    const name = n.kind === "amendment" ? `Amendment ${n.label}` : n.kind === "section" ? `§ ${n.label}` : n.label;
    return (
      <li key={n.key}>
        <button type="button" className={`w-full rounded px-2 py-1.5 text-left ${n.key === selected ? "bg-chamber-tint font-semibold" : "hover:bg-chamber-tint"}`} aria-current={n.key === selected ? "true" : undefined} onClick={() => onSelect(n.key)}>
          {name}
          {n.title ? ` — ${n.title}` : ""}
          {n.kind === "amendment" && <span className="text-ink-soft"> · {statusLabel("amendment", n.status)}</span>}
          {errors.get(n.key) ? <span className="text-verdict-bar"> · {errors.get(n.key)} {errors.get(n.key) === 1 ? "error" : "errors"}</span> : null}
        </button>
        {kids.length > 0 && <ul className="ml-4 border-l border-rule pl-2">{kids.map((k) => item(k, seen))}</ul>}
      </li>
    );
  };
  const seen = new Set<string>();
  const roots = data.nodes.filter((n) => n.kind === "measure");
  const listed = roots.map((r) => item(r, seen));
  const rest = data.nodes.filter((n) => !seen.has(n.key));
  return (
    <section className="gw-card md:hidden" aria-labelledby="tree-outline-h" data-testid="tree-outline">
      <h2 id="tree-outline-h" className="text-step-1">Outline of the tree</h2>
      <ul className="mt-2">{listed}</ul>
      {rest.length > 0 && (
        <>
          <h3 className="mt-3 text-step-0">Amendments whose target is missing or in a cycle</h3>
          <ul>{rest.map((n) => item(n, seen))}</ul>
        </>
      )}
    </section>
  );
}

function Drawing({ data, selected, onSelect }: { data: TreeData; selected: string; onSelect: (key: string) => void }) {
  const flow = useReactFlow();
  const byAmendment = useMemo(() => {
    const m = new Map<string, FindingView[]>();
    for (const f of data.findings) m.set(f.amendment, [...(m.get(f.amendment) ?? []), f]);
    return m;
  }, [data.findings]);
  const boxes = useMemo(() => layoutTree(data.nodes), [data.nodes]);
  const nodes: TreeFlowNode[] = useMemo(
    () =>
      data.nodes.map((n) => {
        const b = boxes.get(n.key)!;
        return { id: n.key, type: "tree", position: { x: b.x, y: b.y }, width: b.width, height: b.height, data: { node: n, findings: byAmendment.get(n.key) ?? [], selected: n.key === selected }, draggable: false, connectable: false } as TreeFlowNode;
      }),
    [data.nodes, boxes, byAmendment, selected],
  );
  const edges: Edge[] = useMemo(() => data.nodes.filter((n) => n.parent).map((n) => ({ id: `${n.parent}->${n.key}`, source: n.parent!, target: n.key, type: "smoothstep", style: { stroke: "#44574f" } })), [data.nodes]);
  const large = data.nodes.length > LARGE;

  // Large trees open at a readable zoom on the selected node (the measure at first) and follow the selection.
  useEffect(() => {
    const b = boxes.get(selected);
    if (b && large) void flow.setCenter(b.x + b.width / 2 + 300, b.y + b.height / 2, { zoom: Math.max(flow.getZoom(), 1), duration: 150 });
  }, [selected, boxes, flow, large]);

  return (
    <ReactFlow
      nodes={nodes}
      edges={edges}
      nodeTypes={nodeTypes}
      onNodeClick={(_, n) => onSelect(n.id)}
      onInit={(instance) => {
        // The whole tree when it fits at a legible size; otherwise its top (the first sections, in reading order) at full size.
        if (large) return;
        void instance.fitView({ padding: 0.08, maxZoom: 1.1 }).then(() => {
          if (instance.getZoom() < LEGIBLE) void instance.setViewport({ x: 0, y: 0, zoom: 1 });
        });
      }}
      nodesFocusable={false}
      edgesFocusable={false}
      elementsSelectable={false}
      minZoom={0.05}
      maxZoom={2}
      nodesDraggable={false}
      nodesConnectable={false}
      onlyRenderVisibleElements={large}
      proOptions={{ hideAttribution: true }}
    >
      <Background gap={24} color="#d9d2c3" />
      <Controls showInteractive={false} />
      {large && <MiniMap pannable zoomable nodeColor={(n) => ((n as TreeFlowNode).data.findings.some((f) => !f.overridden && f.severity === "error") ? "#a4262c" : "#1d4f47")} />}
    </ReactFlow>
  );
}

const rulingHitSchema = z.object({ id: z.string(), number: z.number(), question: z.string(), decision: z.string().nullable(), sittingDate: z.string().nullable(), status: z.string() });
type RulingHit = z.output<typeof rulingHitSchema>;
const rulingListSchema = z.object({ results: z.array(rulingHitSchema) });
const DECISION_WORDS: Record<string, string> = { sustained: "sustained", "not-sustained": "not sustained", other: "decided" };
const rulingLabel = (r: RulingHit) => `Ruling ${r.number}${r.decision ? ` (${DECISION_WORDS[r.decision] ?? r.decision})` : ""}: ${r.question}`;

/** Issued rulings matching a number ("14") or words; numbers are matched on the chamber's issued list. */
async function findRulings(query: string): Promise<RulingHit[]> {
  const q = query.trim();
  const n = /^(?:ruling\s*)?(\d{1,6})$/i.exec(q);
  if (n) {
    const { results } = await apiCall(rulingListSchema, "/api/rulings?status=issued&limit=100");
    return results.filter((r) => String(r.number).startsWith(n[1])).slice(0, 8);
  }
  const { results } = await apiCall(rulingListSchema, `/api/rulings?${new URLSearchParams({ status: "issued", limit: "8", ...(q ? { q } : {}) })}`);
  return results;
}

/** Issued precedents citing the rule a finding applies. */
function RelatedPrecedents({ finding }: { finding: FindingView }) {
  const [hits, setHits] = useState<RulingHit[] | null>(null);
  useEffect(() => {
    let live = true;
    // Same rule only: matching on the message's words would offer rulings that merely share "amendment".
    const q = new URLSearchParams({ rule: finding.rule, limit: "3" });
    apiCall(rulingListSchema, `/api/rulings/related?${q}`).then((r) => live && setHits(r.results), () => live && setHits([]));
    return () => {
      live = false;
    };
  }, [finding.rule]);
  if (!hits || hits.length === 0) return null;
  return (
    <div className="mt-1 text-xs" data-testid={`related-${finding.amendment}-${finding.code}`}>
      <span className="text-ink-soft">Related precedents: </span>
      {hits.map((r, i) => (
        <span key={r.id}>
          {i > 0 && " · "}
          <a href={`/rulings/${r.id}`} className="text-chamber underline">{rulingLabel(r).slice(0, 90)}</a>
        </span>
      ))}
    </div>
  );
}

function OverrideForm({ measureId, finding, version, onDone }: { measureId: string; finding: FindingView; version: number; onDone: (msg: string) => void }) {
  const [ref, setRef] = useState("");
  const [note, setNote] = useState("");
  const [search, setSearch] = useState("");
  const [hits, setHits] = useState<RulingHit[]>([]);
  const [picked, setPicked] = useState<RulingHit | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const id = `ov-${finding.amendment}-${finding.code}`;

  useEffect(() => {
    let live = true;
    const t = setTimeout(() => {
      findRulings(search).then((r) => live && setHits(r), () => live && setHits([]));
    }, 250);
    return () => {
      live = false;
      clearTimeout(t);
    };
  }, [search]);

  function pick(r: RulingHit) {
    setPicked(r);
    setRef(rulingLabel(r).slice(0, 500));
  }

  async function submit() {
    setBusy(true);
    setError(null);
    try {
      await apiCall(z.object({ id: z.string() }), `/api/measures/${measureId}/overrides`, { method: "POST", body: { amendmentId: finding.amendmentId, code: finding.code, version, rulingRef: ref, rulingId: picked?.id ?? null, note: note || null } });
      onDone(`Override on Amendment ${finding.amendment} recorded${picked ? `, resting on Ruling ${picked.number}` : ""}: “${finding.message}”`);
    } catch (e) {
      setError(conflictText(e, "Could not record the override."));
    } finally {
      setBusy(false);
    }
  }
  return (
    <form
      className="mt-2 space-y-2 rounded border border-rule bg-vellum p-2"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <div>
        <label htmlFor={`${id}-find`} className="gw-label">Find an issued ruling (number or words)</label>
        <input id={`${id}-find`} type="search" className="gw-input" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="e.g. 12, or germane lighting" aria-controls={`${id}-hits`} />
        <ul id={`${id}-hits`} className="mt-1 max-h-40 space-y-1 overflow-y-auto" aria-label="Matching rulings">
          {hits.map((r) => (
            <li key={r.id}>
              <button type="button" className={`w-full rounded border px-2 py-1 text-left text-xs ${picked?.id === r.id ? "border-chamber bg-chamber-tint" : "border-rule bg-white hover:bg-chamber-tint"}`} aria-pressed={picked?.id === r.id} onClick={() => pick(r)}>
                <span className="font-semibold">Ruling {r.number}</span>{r.sittingDate ? ` · ${day(r.sittingDate)}` : ""} — {r.question.slice(0, 140)}
              </button>
            </li>
          ))}
          {hits.length === 0 && <li className="gw-hint">No issued ruling matches; describe the ruling below instead.</li>}
        </ul>
      </div>
      {picked && (
        <Alert tone="ok">
          Linked to <a className="text-chamber underline" href={`/rulings/${picked.id}`}>Ruling {picked.number}</a>.{" "}
          <button type="button" className="underline" onClick={() => setPicked(null)}>Unlink</button>
        </Alert>
      )}
      <div>
        <label htmlFor={`${id}-ref`} className="gw-label">Ruling relied on</label>
        <input id={`${id}-ref`} className="gw-input" value={ref} onChange={(e) => setRef(e.target.value)} required maxLength={500} placeholder="Pick one above, or e.g. Ruling of the Presiding Officer, 3 March" />
      </div>
      <div>
        <label htmlFor={`${id}-note`} className="gw-label">Note (optional)</label>
        <input id={`${id}-note`} className="gw-input" value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />
      </div>
      <Alert>{error}</Alert>
      <button type="submit" className="gw-btn" disabled={busy || !ref.trim()}>Record override</button>
    </form>
  );
}

function RevokeButton({ measureId, finding, onDone }: { measureId: string; finding: FindingView; onDone: (msg: string) => void }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function revoke() {
    if (!window.confirm(`Revoke the override on Amendment ${finding.amendment} (“${finding.message}”)? The finding will count again.`)) return;
    setBusy(true);
    setError(null);
    try {
      await apiCall(z.object({ revoked: z.string() }), `/api/measures/${measureId}/overrides/${finding.overrideId}`, { method: "DELETE" });
      onDone(`Override on Amendment ${finding.amendment} revoked: “${finding.message}” counts again.`);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Could not revoke the override.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <span className="mt-1 block">
      <button type="button" className="gw-btn-danger" disabled={busy} onClick={() => void revoke()}>Revoke override</button>
      <Alert look="inline" className="block">{error}</Alert>
    </span>
  );
}

export default function TreeView({ measureId, initial, canOverride }: Props) {
  const [data, setData] = useState<TreeData>(initial);
  const [selected, setSelected] = useState<string>(() => "measure");
  const [message, setMessage] = useState<string | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [openForm, setOpenForm] = useState<string | null>(null);
  const wrapper = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const h = decodeURIComponent(window.location.hash.slice(1));
    if (h && initial.nodes.some((n) => n.key === h)) setSelected(h);
  }, [initial.nodes]);

  const reload = useCallback(async () => {
    try {
      setData(await apiCall(treeViewSchema, `/api/measures/${measureId}/tree`));
      setLoadError(null);
    } catch (e) {
      setLoadError(e instanceof ApiError ? e.message : "Could not reload the tree.");
    }
  }, [measureId]);

  const byKey = useMemo(() => new Map(data.nodes.map((n) => [n.key, n])), [data.nodes]);
  const children = useMemo(() => {
    const m = new Map<string, string[]>();
    for (const n of data.nodes) if (n.parent) m.set(n.parent, [...(m.get(n.parent) ?? []), n.key]);
    return m;
  }, [data.nodes]);

  function onKeyDown(e: KeyboardEvent<HTMLDivElement>) {
    const cur = byKey.get(selected);
    if (!cur) return;
    const siblings = cur.parent ? (children.get(cur.parent) ?? []) : [cur.key];
    const i = siblings.indexOf(cur.key);
    let next: string | undefined;
    if (e.key === "ArrowLeft") next = cur.parent ?? undefined;
    else if (e.key === "ArrowRight") next = children.get(cur.key)?.[0];
    else if (e.key === "ArrowDown") next = siblings[i + 1];
    else if (e.key === "ArrowUp") next = siblings[i - 1];
    else if (e.key === "Home") next = "measure";
    else return;
    e.preventDefault();
    if (next) setSelected(next);
  }

  const node = byKey.get(selected);
  const findings = data.findings.filter((f) => f.amendment === selected);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2" data-testid="tree-counts">
        <span className={`gw-chip ${SEVERITY_CHIP.error}`}>{data.counts.error} {data.counts.error === 1 ? "error" : "errors"}</span>
        <span className={`gw-chip ${SEVERITY_CHIP.warning}`}>{data.counts.warning} {data.counts.warning === 1 ? "warning" : "warnings"}</span>
        <span className={`gw-chip ${SEVERITY_CHIP.info}`}>{data.counts.info} {data.counts.info === 1 ? "note" : "notes"}</span>
        <span className="gw-chip border-verdict-ok bg-verdict-ok-tint text-verdict-ok">{data.counts.overridden} overridden</span>
        <span className="text-sm text-ink-soft">
          Rulebook: {data.rulebook.title} — {data.rulebook.source}
        </span>
      </div>
      <Alert tone="ok" look="box">{message}</Alert>
      <Alert>{loadError}</Alert>
      <div className="grid gap-4 2xl:grid-cols-[1fr_22rem]">
        <div
          ref={wrapper}
          tabIndex={0}
          role="application"
          aria-roledescription="amendment tree"
          aria-label={`Amendment tree of ${data.measure.number}. Selected: ${node ? `${node.label}${node.title ? `, ${node.title}` : ""}` : "none"}. Arrow keys move between nodes.`}
          onKeyDown={onKeyDown}
          className="gw-card hidden h-[600px] p-0 focus-visible:outline-4 md:block"
          data-testid="tree-drawing"
        >
          <ReactFlowProvider>
            <Drawing data={data} selected={selected} onSelect={(k) => { setSelected(k); wrapper.current?.focus(); }} />
          </ReactFlowProvider>
        </div>
        <Outline data={data} selected={selected} onSelect={setSelected} />
        <aside className="grid gap-4 lg:grid-cols-2 2xl:grid-cols-1 2xl:content-start">
          <section className="gw-card" aria-live="polite" data-testid="tree-details">
            {node ? (
              <>
                <h3 className="text-step-1">
                  {node.kind === "amendment" ? `Amendment ${node.label}` : node.kind === "section" ? `Section ${node.label}` : node.label}
                </h3>
                {node.title && <p className="font-semibold">{node.title}</p>}
                <dl className="mt-2 grid grid-cols-[7rem_1fr] gap-x-2 gap-y-1 text-sm">
                  {node.kind === "amendment" && (
                    <>
                      <dt className="text-ink-soft">Degree</dt><dd data-testid="tree-degree">{node.degree ?? "unknown"}{roleWords(node.role, node.underSubstitute) ? ` · ${roleWords(node.role, node.underSubstitute)}` : ""}</dd>
                      {node.slot && (<><dt className="text-ink-soft">Place</dt><dd data-testid="tree-slot">{slotWords(node.slot)}</dd></>)}
                      <dt className="text-ink-soft">Form</dt><dd>{formLabel(node.form)}</dd>
                      <dt className="text-ink-soft">Amends</dt><dd>{targetWords(byKey, node.parent)}{node.lines ? `, lines ${node.lines[0]}–${node.lines[1]}` : ""}</dd>
                      <dt className="text-ink-soft">Status</dt><dd>{statusLabel("amendment", node.status)}</dd>
                      <dt className="text-ink-soft">Filed</dt><dd>{node.filedAt ? when(node.filedAt) : "not yet"}</dd>
                      <dt className="text-ink-soft">Sponsors</dt><dd>{node.sponsors.join(", ") || "none"}</dd>
                    </>
                  )}
                  <dt className="text-ink-soft">Subjects</dt><dd>{node.subjects.join(", ") || "none"}</dd>
                </dl>
                {node.text && <p className="mt-2 whitespace-pre-line border-l-2 border-rule pl-2 text-sm">{node.text}</p>}
                {node.kind === "amendment" && (
                  <div className="mt-3">
                    <h4 className="font-semibold">Findings</h4>
                    {findings.length === 0 && <p className="text-sm text-verdict-ok">No findings: nothing in the rulebook's tests stands against it.</p>}
                    <ul className="space-y-2">
                      {findings.map((f) => (
                        <li key={f.code} className="rounded border border-rule p-2 text-sm" data-testid={`finding-${f.amendment}-${f.code}`}>
                          <span className={`gw-chip ${f.overridden ? "border-verdict-ok bg-verdict-ok-tint text-verdict-ok" : SEVERITY_CHIP[f.severity]}`}>{f.overridden ? "overridden" : SEVERITY_WORDS[f.severity]}</span>
                          <p className="mt-1">{f.message}</p>
                          <RelatedAmendments finding={f} />
                          <p className="text-xs text-ink-soft"><ClauseCitation citation={f.citation} clause={f.clause} /></p>
                          {f.overridden && (
                            <p className="text-xs font-semibold text-verdict-ok">
                              Ruling: {f.overrideRulingId ? <a className="underline" href={`/rulings/${f.overrideRulingId}`}>{f.ruling}</a> : f.ruling}
                              {f.overrideNote && <span className="block font-normal text-ink-soft">Note: {f.overrideNote}</span>}
                            </p>
                          )}
                          <RelatedPrecedents finding={f} />
                          {canOverride && f.overridden && f.overrideId && <RevokeButton measureId={measureId} finding={f} onDone={(msg) => void reload().then(() => setMessage(msg))} />}
                          {canOverride && !f.overridden && f.amendmentId && (
                            openForm === `${f.amendment}/${f.code}` ? (
                              <OverrideForm measureId={measureId} finding={f} version={node.version ?? 1} onDone={(msg) => { setOpenForm(null); void reload().then(() => setMessage(msg)); }} />
                            ) : (
                              <button type="button" className="gw-btn-quiet mt-1" onClick={() => setOpenForm(`${f.amendment}/${f.code}`)}>Override with a ruling…</button>
                            )
                          )}
                        </li>
                      ))}
                    </ul>
                  </div>
                )}
              </>
            ) : (
              <p>Select a node.</p>
            )}
          </section>
          <TreeLegend />
        </aside>
      </div>
      <p className="gw-advisory">These findings apply the chamber's rulebook mechanically. The presiding officer's ruling, the chamber's own rules and its counsel prevail; an override records such a ruling.</p>
      <details className="gw-card relative overflow-x-auto" open={data.findings.length <= 30}>
        <summary className="cursor-pointer font-serif text-step-1 font-semibold text-chamber-dark">All findings ({data.findings.length})</summary>
        <table className="gw-table mt-2" data-testid="findings-table">
          <thead>
            <tr><th>Amendment</th><th>Severity</th><th>Finding</th><th>Rule</th></tr>
          </thead>
          <tbody>
            {data.findings.map((f) => (
              <tr key={`${f.amendment}/${f.code}`}>
                <td><button type="button" className="font-semibold text-chamber underline" onClick={() => { setSelected(f.amendment); wrapper.current?.focus(); }}>{f.amendment}</button></td>
                <td><span className={`gw-chip ${f.overridden ? "border-verdict-ok bg-verdict-ok-tint text-verdict-ok" : SEVERITY_CHIP[f.severity]}`}>{f.overridden ? "overridden" : SEVERITY_WORDS[f.severity]}</span></td>
                <td data-code={f.code}>{f.message}{relatedWords(f).length > 0 && <span className="block text-sm">With: {relatedWords(f).join(", ")}</span>}{f.overridden && <span className="block text-xs text-verdict-ok">Ruling: {f.ruling}</span>}</td>
                <td className="text-xs text-ink-soft"><ClauseCitation citation={f.citation} clause={f.clause} /></td>
              </tr>
            ))}
            {data.findings.length === 0 && <tr><td colSpan={4}>No findings.</td></tr>}
          </tbody>
        </table>
      </details>
    </div>
  );
}
