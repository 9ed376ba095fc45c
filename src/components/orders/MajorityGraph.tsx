/**
 * The majority graph drawn as SVG: versions on a circle, an arrow from winner to loser labelled with
 * the margin. Draws only `shown` (see graphSelection in src/lib/estimates/majority-matrix.ts: beyond
 * eight versions, the top cycle); labels are the versions' names, outside the circle.
 */
import type { Versions } from "./api.ts";

const LINE = 19;

/** A long name on two lines, broken before the " + " nearest its middle. */
function labelLines(name: string): string[] {
  if (name.length <= 16) return [name];
  const cuts = [...name.matchAll(/ \+ /g)].map((m) => m.index ?? 0);
  if (cuts.length === 0) return [name];
  const cut = cuts.reduce((best, c) => (Math.abs(c - name.length / 2) < Math.abs(best - name.length / 2) ? c : best));
  return [name.slice(0, cut), name.slice(cut + 1)];
}

export default function MajorityGraph({ versions, margins, highlight, shown }: { versions: Versions; margins: Record<string, Record<string, number>>; highlight: string[]; shown?: string[] }) {
  const drawn = shown ? versions.filter((v) => shown.includes(v.id)) : versions;
  const n = drawn.length;
  const W = 680;
  const H = 460;
  const R = n <= 1 ? 0 : 150;
  const pos = drawn.map((_, i) => {
    const a = -Math.PI / 2 + (2 * Math.PI * i) / Math.max(1, n);
    return { x: W / 2 + R * Math.cos(a), y: H / 2 + R * Math.sin(a), cos: Math.cos(a), sin: Math.sin(a) };
  });
  const edges: Array<{ from: number; to: number; m: number }> = [];
  drawn.forEach((x, i) => drawn.forEach((y, j) => {
    const m = margins[x.id]?.[y.id] ?? 0;
    if (i !== j && m > 0) edges.push({ from: i, to: j, m });
  }));
  const hi = new Set(highlight);
  // Past a dozen arrows the margins' labels overlap: they are left to the matrix.
  const labelled = edges.length <= 12;
  const described = edges.length ? edges.map((e) => `${drawn[e.from].short} beats ${drawn[e.to].short} by ${e.m}`).join("; ") : "no version beats another";
  return (
    <>
    {!labelled && <p className="gw-hint">Too many arrows to label: the margins are in the matrix.</p>}
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`Majority graph of ${n} version${n === 1 ? "" : "s"}: ${described}`} className="w-full max-w-xl" data-testid="majority-graph">
      <defs>
        <marker id="gw-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerUnits="userSpaceOnUse" markerWidth="11" markerHeight="11" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="currentColor" /></marker>
      </defs>
      {edges.map((e, k) => {
        const a = pos[e.from];
        const b = pos[e.to];
        const dx = b.x - a.x;
        const dy = b.y - a.y;
        const L = Math.hypot(dx, dy) || 1;
        const ux = dx / L;
        const uy = dy / L;
        const s = { x: a.x + ux * 14, y: a.y + uy * 14 };
        const t = { x: b.x - ux * 14, y: b.y - uy * 14 };
        const cyc = hi.has(drawn[e.from].id) && hi.has(drawn[e.to].id);
        return (
          <g key={k} className={cyc ? "text-brass-text" : "text-ink-soft"}>
            <line x1={s.x} y1={s.y} x2={t.x} y2={t.y} stroke="currentColor" strokeWidth={cyc ? 2.5 : 1.4} markerEnd="url(#gw-arrow)" />
            {labelled && <text x={s.x + (t.x - s.x) * 0.4 - uy * 10} y={s.y + (t.y - s.y) * 0.4 + ux * 10 + 4} fontSize="15" textAnchor="middle" fill="currentColor" className="font-semibold" paintOrder="stroke" stroke="white" strokeWidth="3">+{e.m}</text>}
          </g>
        );
      })}
      {drawn.map((v, i) => {
        const p = pos[i];
        const anchor = Math.abs(p.cos) < 0.3 ? "middle" : p.cos > 0 ? "start" : "end";
        const lines = labelLines(v.short);
        const lx = p.x + p.cos * 18;
        const first = p.y + p.sin * 18 + (Math.abs(p.cos) < 0.3 ? (p.sin > 0 ? 14 : -4 - (lines.length - 1) * LINE) : 6 - ((lines.length - 1) * LINE) / 2);
        return (
          <g key={v.id}>
            <circle cx={p.x} cy={p.y} r="9" className={hi.has(v.id) ? "fill-brass-tint stroke-brass" : "fill-white stroke-chamber"} strokeWidth="2.5" />
            <text x={lx} y={first} fontSize="17" textAnchor={anchor} className="fill-ink font-semibold" paintOrder="stroke" stroke="white" strokeWidth="3">
              {lines.map((l, k) => <tspan key={k} x={lx} dy={k === 0 ? 0 : LINE}>{l}</tspan>)}
            </text>
          </g>
        );
      })}
    </svg>
    </>
  );
}
