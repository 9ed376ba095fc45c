/**
 * The spatial view of an estimate: members' ideal points by bloc (drag them, or focus one and use the
 * arrow keys), the positions of the versions, the status quo's win set drawn exactly — the union, over
 * minimal winning coalitions, of the intersections of their members' open discs through the status
 * quo (win-set.ts) — and the majority cycle among the versions when there is one. Everything is
 * recomputed in the browser with the voting engine's pure functions as points move.
 */
import { useMemo, useRef, useState } from "react";
import { z } from "zod";
import { mergedIdealPoints, spatialInput, type EstimateContent } from "../../lib/estimates/estimate-content.ts";
import { addDimension, dimensionNameIssue, removeDimension } from "../../lib/estimates/dimension-edits.ts";
import { majorityGraph } from "../../lib/voting/majority-graph.ts";
import { majorityReport } from "../../lib/voting/majority-report.ts";
import { MAX_DIMENSIONS, scaleSpatial, spatialProfile, spatialSchema, versionPosition } from "../../lib/voting/spatial-profile.ts";
import { winSet } from "../../lib/voting/win-set.ts";
import { unscale } from "../../lib/voting/exact-decimal.ts";
import { ApiError, apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { axisTicks, tickLabel } from "../../lib/estimates/axis-ticks.ts";
import { cycleSentence } from "../../lib/estimates/majority-matrix.ts";

type Spatial = Extract<EstimateContent, { kind: "spatial" }>;
const BLOC_COLOURS = ["#1f4e79", "#8a4b08", "#2f6b3a", "#6b2f5f", "#5a5a5a", "#0f6470"];
const STEP = 0.5;

/** `labels`: what people read for each amendment key of the scope ("A3"; a draft's "Draft"). */
export default function SpatialView({ estimateId, content: initial, versions, scope, labels, basedOn, canEdit }: { estimateId: string; content: Spatial; versions: Array<{ id: string; amendments: string[]; short: string }>; scope: string[]; labels: Record<string, string>; basedOn: number; canEdit: boolean }) {
  const [content, setContent] = useState<Spatial>(initial);
  const [dirty, setDirty] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const dragging = useRef<number | null>(null);
  const groups = useMemo(() => mergedIdealPoints(content.members), [content]);

  const model = useMemo(() => {
    // Geometry does not depend on the dimensions' names; neutral ones keep a half-typed name from breaking the plot.
    const s = scaleSpatial(spatialSchema.parse(spatialInput({ ...content, dimensions: content.dimensions.map((_, i) => `d${i + 1}`) })));
    const positions = versions.map((v) => (v.id === "Q" ? s.statusQuo : versionPosition(s, v.amendments)));
    const g = majorityGraph(spatialProfile(s, versions.map((v) => v.id), positions));
    return { positions: positions.map((p) => p.map((c) => unscale(c, s.scale))), report: majorityReport(g), win: winSet(s, s.statusQuo) };
  }, [content, versions]);



  const all = [...groups.map((g) => g.ideal), ...model.positions];
  const xs = all.map((p) => p[0]);
  const ys = all.map((p) => p[1]);
  // The dimensions' own scale when given (widened if a point lies outside it); otherwise the points' extent.
  const pad = content.ranges ? 0.5 : 2;
  const r = content.ranges;
  const [x0, x1, y0, y1] = [Math.min(...xs, ...(r ? [r[0][0] + pad] : [])) - pad, Math.max(...xs, ...(r ? [r[0][1] - pad] : [])) + pad, Math.min(...ys, ...(r?.[1] ? [r[1][0] + pad] : [])) - pad, Math.max(...ys, ...(r?.[1] ? [r[1][1] - pad] : [])) + pad];
  const span = Math.max(x1 - x0, y1 - y0);
  const W = 560;
  // The plot area (one scale on both axes, so indifference circles stay round), with room for ticks and names.
  const PL = 58;
  const PT = 12;
  const PR = 14;
  const PB = 50;
  const plot = W - PL - PR;
  const k = plot / span;
  const X = (x: number) => PL + (x - x0) * k;
  const Y = (y: number) => PT + plot - (y - y0) * k;
  const fromScreen = (px: number, py: number) => [Math.round(((px - PL) / k + x0) * 10) / 10, Math.round(((PT + plot - py) / k + y0) * 10) / 10];
  const xTicks = axisTicks(x0, x0 + span, 6);
  const yTicks = axisTicks(y0, y0 + span, 6);
  const H = PT + plot + PB;

  const edit = (f: (c: Spatial) => Spatial) => {
    setContent(f);
    setDirty(true);
  };
  const moveGroup = (gi: number, to: number[]) => {
    const from = groups[gi].ideal.join(",");
    setContent((c) => ({ ...c, members: c.members.map((m) => (m.ideal.join(",") === from ? { ...m, ideal: to } : m)) }));
    setDirty(true);
  };
  const onPointerMove = (e: React.PointerEvent) => {
    if (dragging.current === null || !svgRef.current) return;
    const r = svgRef.current.getBoundingClientRect();
    const scale = W / r.width;
    moveGroup(dragging.current, fromScreen((e.clientX - r.left) * scale, (e.clientY - r.top) * scale));
  };
  const onKey = (gi: number) => (e: React.KeyboardEvent) => {
    const d: Record<string, [number, number]> = { ArrowLeft: [-STEP, 0], ArrowRight: [STEP, 0], ArrowUp: [0, STEP], ArrowDown: [0, -STEP] };
    const v = d[e.key];
    if (!v) return;
    e.preventDefault();
    const p = groups[gi].ideal;
    moveGroup(gi, [Math.round((p[0] + v[0]) * 10) / 10, Math.round((p[1] + v[1]) * 10) / 10]);
  };
  const save = async () => {
    try {
      // Positions saved by a person are no longer the roster's placeholders.
      const { draft: _placeholder, ...saved } = content;
      void _placeholder;
      await apiCall(z.object({ version: z.number() }), `/api/estimates/${estimateId}/versions`, { method: "POST", body: { basedOn, scope, content: saved, note: content.dimensions.join("\n") === initial.dimensions.join("\n") ? "Positions edited on the plot" : "Dimensions and positions edited" } });
      window.location.reload();
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : "Could not save.");
    }
  };

  if (content.dimensions.length !== 2)
    return (
      <div className="space-y-4">
        <p className="gw-hint">The plot shows estimates in two dimensions; this one has {content.dimensions.length}.</p>
        {canEdit && <PositionsEditor content={content} scope={scope} labels={labels} onChange={edit} />}
        {canEdit && <button className="gw-btn" disabled={!dirty} onClick={() => void save()}>Save these positions as a new version</button>}
        <Alert>{message}</Alert>
      </div>
    );
  const sqIndex = versions.findIndex((v) => v.id === "Q");
  const cycle = model.report.condorcetWinner ? [] : model.report.topCycle;
  const idx = (id: string) => versions.findIndex((v) => v.id === id);
  const blocs = [...new Set(content.members.map((m) => m.bloc || m.member))];
  const colour = (g: (typeof groups)[number]) => BLOC_COLOURS[blocs.indexOf(g.blocs[0] ?? g.members[0]) % BLOC_COLOURS.length];
  const discs = model.win.discs;

  return (
    <div className="space-y-4">
    <div className="grid gap-4 lg:grid-cols-[minmax(0,560px)_1fr]">
      <svg ref={svgRef} viewBox={`0 0 ${W} ${H}`} className="w-full touch-none rounded border border-rule bg-white" role="group" aria-label={`Spatial plot: ${content.dimensions[0]} across, ${content.dimensions[1]} up`} onPointerMove={onPointerMove} onPointerUp={() => (dragging.current = null)} onPointerLeave={() => (dragging.current = null)}>
        <defs>
          {discs.map((d, i) => <clipPath key={i} id={`gw-disc-${i}`}><circle cx={X(d.center[0])} cy={Y(d.center[1])} r={Math.sqrt(d.radiusSquared) * k} /></clipPath>)}
          <clipPath id="gw-plot-area"><rect x={PL} y={PT} width={plot} height={plot} /></clipPath>
          <marker id="gw-cyc" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto"><path d="M0,0 L10,5 L0,10 z" className="fill-brass-text" /></marker>
        </defs>
        <rect x={PL} y={PT} width={plot} height={plot} fill="none" className="stroke-rule" />
        <g data-testid="x-ticks" aria-hidden="true">
          {xTicks.map((t) => (
            <g key={`x${t}`}>
              <line x1={X(t)} y1={PT} x2={X(t)} y2={PT + plot} className="stroke-rule" strokeOpacity="0.6" strokeWidth="1" />
              <line x1={X(t)} y1={PT + plot} x2={X(t)} y2={PT + plot + 5} className="stroke-ink-soft" />
              <text x={X(t)} y={PT + plot + 18} textAnchor="middle" fontSize="12" className="fill-ink">{tickLabel(t)}</text>
            </g>
          ))}
        </g>
        <g data-testid="y-ticks" aria-hidden="true">
          {yTicks.map((t) => (
            <g key={`y${t}`}>
              <line x1={PL} y1={Y(t)} x2={PL + plot} y2={Y(t)} className="stroke-rule" strokeOpacity="0.6" strokeWidth="1" />
              <line x1={PL - 5} y1={Y(t)} x2={PL} y2={Y(t)} className="stroke-ink-soft" />
              <text x={PL - 8} y={Y(t) + 4} textAnchor="end" fontSize="12" className="fill-ink">{tickLabel(t)}</text>
            </g>
          ))}
        </g>
        <text x={PL + plot / 2} y={H - 8} textAnchor="middle" fontSize="13" className="fill-ink font-semibold" data-testid="x-axis-name">{content.dimensions[0]} →</text>
        <text x={16} y={PT + plot / 2} textAnchor="middle" fontSize="13" className="fill-ink font-semibold" transform={`rotate(-90 16 ${PT + plot / 2})`} data-testid="y-axis-name">{content.dimensions[1]} →</text>
        <g clipPath="url(#gw-plot-area)">
        {discs.map((d, i) => <circle key={i} cx={X(d.center[0])} cy={Y(d.center[1])} r={Math.sqrt(d.radiusSquared) * k} fill="none" className="stroke-ink-soft" strokeDasharray="3 4" strokeWidth="0.8" />)}
        <g opacity="0.45" data-testid="win-set">
          {(model.win.coalitions ?? []).map((c, ci) => {
            const [last, ...outer] = [...c].reverse();
            const d = discs[last];
            return outer.reduce<React.ReactNode>((inner, m) => <g clipPath={`url(#gw-disc-${m})`}>{inner}</g>, <circle cx={X(d.center[0])} cy={Y(d.center[1])} r={Math.sqrt(d.radiusSquared) * k} className="fill-chamber" key={ci} />);
          }).map((n, i) => <g key={i}>{n}</g>)}
        </g>
        </g>
        <g clipPath="url(#gw-plot-area)">
        {cycle.map((id, i) => {
          const a = model.positions[idx(id)];
          const b = model.positions[idx(cycle.find((y) => (model.report.margins[id]?.[y] ?? 0) > 0) ?? cycle[(i + 1) % cycle.length])];
          return <line key={id} x1={X(a[0])} y1={Y(a[1])} x2={X(a[0] + (b[0] - a[0]) * 0.85)} y2={Y(a[1] + (b[1] - a[1]) * 0.85)} className="stroke-brass-text" strokeWidth="2" markerEnd="url(#gw-cyc)" />;
        })}
        {versions.map((v, i) => (
          <g key={v.id}>
            <rect x={X(model.positions[i][0]) - 5} y={Y(model.positions[i][1]) - 5} width="10" height="10" className={i === sqIndex ? "fill-verdict-bar" : "fill-brass"} transform={`rotate(45 ${X(model.positions[i][0])} ${Y(model.positions[i][1])})`} />
            <text x={X(model.positions[i][0]) + 9} y={Y(model.positions[i][1]) - 7} fontSize="11" className="fill-ink" paintOrder="stroke" stroke="white" strokeWidth="3">{v.short}</text>
          </g>
        ))}
        </g>
        {groups.map((g, gi) => (
          <g key={gi} tabIndex={0} role="button" aria-label={`${g.blocs.join(", ") || g.members.join(", ")}: ${g.weight} vote${g.weight === 1 ? "" : "s"} at (${g.ideal.join(", ")}). Arrow keys move it.`} onKeyDown={onKey(gi)} onPointerDown={(e) => { dragging.current = gi; (e.target as Element).setPointerCapture?.(e.pointerId); }} className="cursor-grab focus:outline-none [&:focus>circle]:stroke-[4]">
            <circle cx={X(g.ideal[0])} cy={Y(g.ideal[1])} r={6 + Math.sqrt(g.weight) * 2} fill={colour(g)} fillOpacity="0.85" stroke="#111" strokeWidth="1.5" />
            <text x={X(g.ideal[0])} y={Y(g.ideal[1]) + 4} fontSize="11" textAnchor="middle" fill="white" className="pointer-events-none font-semibold">{g.weight}</text>
            <text x={X(g.ideal[0])} y={Y(g.ideal[1]) - (9 + Math.sqrt(g.weight) * 2)} fontSize="12" textAnchor="middle" className="pointer-events-none fill-ink font-semibold" paintOrder="stroke" stroke="white" strokeWidth="3" data-testid="bloc-name">{g.blocs.join(", ") || g.members.join(", ")}</text>
          </g>
        ))}
      </svg>
      <div className="space-y-3 text-sm">
        <p className="gw-advisory">Positions are estimates. The shaded region is the status quo's win set: the points a majority prefers to Q. The presiding officer's rulings, the chamber's own rules and its counsel prevail.</p>
        <ul className="space-y-1">
          {groups.map((g, gi) => <li key={gi}><span className="mr-2 inline-block h-3 w-3 rounded-full align-middle" style={{ background: colour(g) }} />{g.blocs.join(", ") || g.members.join(", ")} — {g.weight} vote{g.weight === 1 ? "" : "s"} at ({g.ideal.join(", ")})</li>)}
        </ul>
        <p><span className="mr-1 inline-block h-3 w-3 rotate-45 bg-verdict-bar align-middle" /> Q (no change) · <span className="mr-1 inline-block h-3 w-3 rotate-45 bg-brass align-middle" /> versions of the measure</p>
        <p>{model.win.coalitions === null ? "The win set is drawn only for up to 16 distinct ideal points; the dashed circles show each member's indifference circle through Q." : model.win.coalitions.length === 0 ? "No coalition can beat the status quo: its win set is empty." : `Win set of Q: union of ${model.win.coalitions.length} coalition lens${model.win.coalitions.length === 1 ? "" : "es"}.`}</p>
        <p>{model.report.condorcetWinner ? `Among the versions, ${versions[idx(model.report.condorcetWinner)].short} beats every other.` : `No version beats all the others: ${cycleSentence(cycle, (id) => versions[idx(id)].short, 6)} (arrows point from a winner to a version it beats).`}</p>
        {canEdit && <button className="gw-btn" disabled={!dirty} onClick={() => void save()}>Save these positions as a new version</button>}
        <Alert>{message}</Alert>
      </div>
    </div>
    {canEdit && <PositionsEditor content={content} scope={scope} labels={labels} onChange={edit} />}
    </div>
  );
}

/** A number box that commits only valid numbers (a half-typed "-" or "" keeps the last value). */
function NumberBox({ value, label, onChange }: { value: number; label: string; onChange: (v: number) => void }) {
  const [text, setText] = useState(String(value));
  const [shown, setShown] = useState(value);
  if (shown !== value) {
    setShown(value);
    if (Number(text) !== value) setText(String(value));
  }
  return (
    <input
      className="gw-input mt-0 w-20"
      aria-label={label}
      inputMode="decimal"
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        const t = e.target.value.trim();
        if (/^[-+]?(\d+(\.\d*)?|\.\d+)$/.test(t) && Math.abs(Number(t)) <= 1e6) onChange(Number(t));
      }}
    />
  );
}

/**
 * Dimensions (names and scales) and the positions of the status quo, the measure and each
 * amendment's effect (a new position, or a shift of the text it amends), edited as numbers; the
 * plot above follows every change.
 */
function PositionsEditor({ content, scope, labels, onChange }: { content: Spatial; scope: string[]; labels: Record<string, string>; onChange: (f: (c: Spatial) => Spatial) => void }) {
  const dims = content.dimensions;
  const ranges = content.ranges ?? dims.map(() => [0, 10] as [number, number]);
  const setAt = (xs: number[], i: number, v: number) => xs.map((x, j) => (j === i ? v : x));
  const setRange = (i: number, end: 0 | 1, v: number) =>
    onChange((c) => {
      const next = ranges.map((r, j) => (j === i ? ((end === 0 ? [v, r[1]] : [r[0], v]) as [number, number]) : r));
      return next.every(([a, b]) => a < b) ? { ...c, ranges: next } : c;
    });
  const [newName, setNewName] = useState("");
  const [addIssue, setAddIssue] = useState<string | null>(null);
  const [confirming, setConfirming] = useState<number | null>(null);
  const add = () => {
    const issue = dims.length >= MAX_DIMENSIONS ? `An estimate has at most ${MAX_DIMENSIONS} dimensions.` : dimensionNameIssue(dims, newName);
    setAddIssue(issue);
    if (issue) return;
    onChange((c) => addDimension(c, newName));
    setNewName("");
  };
  const effect = (k: string) => content.effects[k] ?? {};
  const effectKind = (k: string): "position" | "shift" | "none" => (effect(k).position ? "position" : effect(k).shift ? "shift" : "none");
  const setEffect = (k: string, kind: "position" | "shift" | "none") =>
    onChange((c) => {
      const effects = { ...c.effects };
      if (kind === "none") delete effects[k];
      else effects[k] = kind === "position" ? { position: c.effects[k]?.position ?? [...c.measure] } : { shift: c.effects[k]?.shift ?? dims.map(() => 0) };
      return { ...c, effects };
    });
  return (
    <details className="gw-card" data-testid="positions-editor" open>
      <summary className="cursor-pointer font-semibold">Dimensions and positions</summary>
      <div className="mt-2 grid grid-cols-1 gap-4 lg:grid-cols-2">
        <div>
          <h3 className="font-semibold">Dimensions</h3>
          <div className="relative mt-1 overflow-x-auto" role="region" aria-label="Dimensions" tabIndex={0}>
          <table className="gw-table">
            <thead><tr><th scope="col">#</th><th scope="col">Name</th><th scope="col">Low end</th><th scope="col">High end</th><th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {dims.map((d, i) => (
                <tr key={i}>
                  <td>{i + 1}</td>
                  <td>
                    <input className="gw-input mt-0 min-w-[9rem]" aria-label={`Name of dimension ${i + 1}`} aria-invalid={dimensionNameIssue(dims, d, i) ? true : undefined} value={d} maxLength={80} onChange={(e) => { const v = e.target.value; onChange((c) => ({ ...c, dimensions: c.dimensions.map((x, j) => (j === i ? v : x)) })); }} />
                    {dimensionNameIssue(dims, d, i) && <span className="gw-error block text-xs">{dimensionNameIssue(dims, d, i)}</span>}
                  </td>
                  <td><NumberBox label={`Low end of ${d}`} value={ranges[i][0]} onChange={(v) => setRange(i, 0, v)} /></td>
                  <td><NumberBox label={`High end of ${d}`} value={ranges[i][1]} onChange={(v) => setRange(i, 1, v)} /></td>
                  <td><button type="button" className="gw-btn-quiet px-2 py-0.5" aria-label={`Remove dimension ${i + 1} (${d})`} title={dims.length === 1 ? "An estimate needs at least one dimension" : undefined} disabled={dims.length === 1} onClick={() => setConfirming(i)}>✕</button></td>
                </tr>
              ))}
            </tbody>
          </table>
          </div>
          {confirming !== null && confirming < dims.length && (
            <div className="mt-2 rounded border border-verdict-bar bg-verdict-bar-tint p-3 text-sm" role="group" aria-label="Confirm removing a dimension">
              <p>Remove dimension {confirming + 1}, “{dims[confirming]}”? Its coordinate is deleted from every member's ideal point, from the status quo and the measure, and from each amendment's position or shift. Nothing is saved until you save a new version.</p>
              <div className="mt-2 flex gap-2">
                <button type="button" className="gw-btn-danger" autoFocus onClick={() => { const i = confirming; setConfirming(null); onChange((c) => removeDimension(c, i)); }}>Remove “{dims[confirming]}”</button>
                <button type="button" className="gw-btn-quiet" onClick={() => setConfirming(null)}>Keep it</button>
              </div>
            </div>
          )}
          <div className="mt-2 flex flex-wrap items-end gap-2">
            <label className="gw-label">New dimension
              <input className="gw-input" value={newName} maxLength={80} disabled={dims.length >= MAX_DIMENSIONS} aria-describedby="new-dimension-hint" onChange={(e) => { setNewName(e.target.value); setAddIssue(null); }} onKeyDown={(e) => { if (e.key === "Enter") { e.preventDefault(); add(); } }} />
            </label>
            <button type="button" className="gw-btn-quiet" disabled={dims.length >= MAX_DIMENSIONS} onClick={add}>Add a dimension</button>
          </div>
          <Alert>{addIssue}</Alert>
          <p className="gw-hint" id="new-dimension-hint">{dims.length} of at most {MAX_DIMENSIONS} dimensions. A new dimension starts at 0 for every point, so nothing changes until you place the points on it.</p>
          <p className="gw-hint">The scale frames the plot; a point may lie outside it. Members' points move by dragging, or by the arrow keys.</p>
        </div>
        <div>
          <h3 className="font-semibold">Positions</h3>
          <div className="relative mt-1 overflow-x-auto" role="region" aria-label="Positions" tabIndex={0}>
          <table className="gw-table">
            <thead><tr><th scope="col">Text</th><th scope="col">Given as</th>{dims.map((d, i) => <th key={i} scope="col">{d}</th>)}</tr></thead>
            <tbody>
              <tr>
                <th scope="row">Q (no change)</th><td className="align-middle">position</td>
                {dims.map((d, i) => <td key={i}><NumberBox label={`Status quo on ${d}`} value={content.statusQuo[i]} onChange={(v) => onChange((c) => ({ ...c, statusQuo: setAt(c.statusQuo, i, v) }))} /></td>)}
              </tr>
              <tr>
                <th scope="row">The measure</th><td className="align-middle">position</td>
                {dims.map((d, i) => <td key={i}><NumberBox label={`Measure on ${d}`} value={content.measure[i]} onChange={(v) => onChange((c) => ({ ...c, measure: setAt(c.measure, i, v) }))} /></td>)}
              </tr>
              {scope.map((k) => {
                const kind = effectKind(k);
                const vals = kind === "position" ? effect(k).position! : kind === "shift" ? effect(k).shift! : null;
                return (
                  <tr key={k}>
                    <th scope="row">{labels[k] ?? k}</th>
                    <td>
                      <select className="gw-input mt-0 min-w-[8.5rem]" aria-label={`How ${labels[k] ?? k} moves the text`} value={kind} onChange={(e) => setEffect(k, e.target.value as "position" | "shift" | "none")}>
                        <option value="none">no change</option>
                        <option value="position">new position</option>
                        <option value="shift">shift by</option>
                      </select>
                    </td>
                    {dims.map((d, i) => (
                      <td key={i}>
                        {vals ? <NumberBox label={`${labels[k] ?? k} ${kind === "shift" ? "shift" : "position"} on ${d}`} value={vals[i] ?? 0} onChange={(v) => onChange((c) => ({ ...c, effects: { ...c.effects, [k]: kind === "position" ? { position: setAt(c.effects[k]?.position ?? [...c.measure], i, v) } : { shift: setAt(c.effects[k]?.shift ?? dims.map(() => 0), i, v) } } }))} /> : "—"}
                      </td>
                    ))}
                  </tr>
                );
              })}
            </tbody>
          </table>
          </div>
          <p className="gw-hint">A shift moves the text it amends (the measure, or the amendment it perfects) by that much on each dimension.</p>
        </div>
      </div>
      <details className="mt-4" data-testid="members-editor">
        <summary className="cursor-pointer font-semibold">Members' ideal points ({content.members.length} rows, {content.members.reduce((a, m) => a + m.weight, 0)} votes)</summary>
        <div className="relative mt-2 overflow-x-auto">
          <table className="gw-table">
            <thead><tr><th scope="col">Member or bloc</th><th scope="col">Bloc</th><th scope="col">Weight</th>{dims.map((d, i) => <th key={i} scope="col">{d}</th>)}<th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {content.members.map((m, r) => (
                <tr key={r}>
                  <td><input className="gw-input mt-0 min-w-[9rem]" aria-label={`Row ${r + 1}: member or bloc`} value={m.member} maxLength={200} onChange={(e) => { const v = e.target.value; onChange((c) => ({ ...c, members: c.members.map((x, j) => (j === r ? { ...x, member: v } : x)) })); }} /></td>
                  <td><input className="gw-input mt-0 min-w-[8rem]" aria-label={`Row ${r + 1}: bloc`} value={m.bloc} maxLength={120} onChange={(e) => { const v = e.target.value; onChange((c) => ({ ...c, members: c.members.map((x, j) => (j === r ? { ...x, bloc: v } : x)) })); }} /></td>
                  <td><NumberBox label={`Row ${r + 1}: weight`} value={m.weight} onChange={(v) => { if (Number.isInteger(v) && v >= 1 && v <= 1000) onChange((c) => ({ ...c, members: c.members.map((x, j) => (j === r ? { ...x, weight: v } : x)) })); }} /></td>
                  {dims.map((d, i) => <td key={i}><NumberBox label={`Row ${r + 1}: ${d}`} value={m.ideal[i]} onChange={(v) => onChange((c) => ({ ...c, members: c.members.map((x, j) => (j === r ? { ...x, ideal: setAt(x.ideal, i, v) } : x)) }))} /></td>)}
                  <td><button type="button" className="gw-btn-quiet px-2 py-0.5" aria-label={`Remove row ${r + 1}`} disabled={content.members.length === 1} onClick={() => onChange((c) => ({ ...c, members: c.members.filter((_, j) => j !== r) }))}>✕</button></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <button type="button" className="gw-btn-quiet mt-2" onClick={() => onChange((c) => ({ ...c, members: [...c.members, { member: `Member ${c.members.length + 1}`, bloc: "", weight: 1, ideal: [...c.statusQuo] }] }))}>Add a row</button>
      </details>
    </details>
  );
}
