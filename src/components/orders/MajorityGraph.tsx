/** The majority graph drawn as SVG: versions on a circle, an arrow from winner to loser labelled with the margin. */
import type { Versions } from "./api.ts";

export default function MajorityGraph({ versions, margins, highlight }: { versions: Versions; margins: Record<string, Record<string, number>>; highlight: string[] }) {
  const n = versions.length;
  const W = 520;
  const H = 360;
  const R = Math.min(W, H) / 2 - 60;
  const pos = versions.map((_, i) => {
    const a = -Math.PI / 2 + (2 * Math.PI * i) / n;
    return { x: W / 2 + R * Math.cos(a), y: H / 2 + R * Math.sin(a) };
  });
  const edges: Array<{ from: number; to: number; m: number }> = [];
  versions.forEach((x, i) => versions.forEach((y, j) => {
    const m = margins[x.id]?.[y.id] ?? 0;
    if (i !== j && m > 0) edges.push({ from: i, to: j, m });
  }));
  const hi = new Set(highlight);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`Majority graph: ${edges.map((e) => `${versions[e.from].short} beats ${versions[e.to].short} by ${e.m}`).join("; ")}`} className="w-full max-w-xl">
      <defs>
        <marker id="gw-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="currentColor" /></marker>
      </defs>
      {edges.map((e, k) => {
        const a = pos[e.from];
        const b = pos[e.to];
        const dx = b.x - a.x;
        const dy = b.y - a.y;
        const L = Math.hypot(dx, dy) || 1;
        const ux = dx / L;
        const uy = dy / L;
        const s = { x: a.x + ux * 34, y: a.y + uy * 34 };
        const t = { x: b.x - ux * 34, y: b.y - uy * 34 };
        const cyc = hi.has(versions[e.from].id) && hi.has(versions[e.to].id);
        return (
          <g key={k} className={cyc ? "text-brass-text" : "text-ink-soft"}>
            <line x1={s.x} y1={s.y} x2={t.x} y2={t.y} stroke="currentColor" strokeWidth={cyc ? 2.5 : 1.4} markerEnd="url(#gw-arrow)" />
            <text x={(s.x + t.x) / 2 - uy * 10} y={(s.y + t.y) / 2 + ux * 10} fontSize="12" textAnchor="middle" fill="currentColor" className="font-semibold">+{e.m}</text>
          </g>
        );
      })}
      {versions.map((v, i) => (
        <g key={v.id}>
          <circle cx={pos[i].x} cy={pos[i].y} r="30" className={hi.has(v.id) ? "fill-brass-tint stroke-brass" : "fill-white stroke-chamber"} strokeWidth="2" />
          <text x={pos[i].x} y={pos[i].y + 4} fontSize="11" textAnchor="middle" className="fill-ink font-semibold">{v.id === "Q" ? "Q" : v.id.replace(/^measure/, "M")}</text>
          <text x={pos[i].x} y={pos[i].y + (pos[i].y > H / 2 ? 46 : -38)} fontSize="11" textAnchor="middle" className="fill-ink-soft">{v.short}</text>
        </g>
      ))}
    </svg>
  );
}
