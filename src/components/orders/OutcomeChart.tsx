/**
 * How many legal orders lead to each outcome: for each version, two bars on one scale — sincere
 * (solid) and sophisticated (hatched) — with the count written beside each bar.
 */
import { num, type Versions } from "./api.ts";

export default function OutcomeChart({ versions, sincere, sophisticated, total }: { versions: Versions; sincere: Record<string, number | string>; sophisticated: Record<string, number | string>; total: number | string }) {
  const rows = versions.filter((v) => num(sincere[v.id] ?? 0) > 0 || num(sophisticated[v.id] ?? 0) > 0 || v.id === "Q");
  const max = Math.max(1, num(total));
  const W = 560;
  const label = 190;
  const barW = W - label - 60;
  const rowH = 44;
  return (
    <svg viewBox={`0 0 ${W} ${rows.length * rowH + 48}`} role="img" aria-label={rows.map((v) => `${v.short}: ${sincere[v.id] ?? 0} orders sincere, ${sophisticated[v.id] ?? 0} sophisticated`).join("; ")} className="w-full max-w-2xl">
      <defs>
        <pattern id="gw-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="6" height="6" className="fill-brass-tint" /><line x1="0" y1="0" x2="0" y2="6" className="stroke-brass" strokeWidth="3" /></pattern>
      </defs>
      {rows.map((v, i) => {
        const y = i * rowH + 4;
        const a = num(sincere[v.id] ?? 0);
        const b = num(sophisticated[v.id] ?? 0);
        return (
          <g key={v.id}>
            <text x={label - 8} y={y + 20} textAnchor="end" fontSize="12" className="fill-ink">{v.short}</text>
            <rect x={label} y={y + 2} width={Math.max(1, (a / max) * barW)} height="16" className="fill-chamber" />
            <text x={label + (a / max) * barW + 6} y={y + 15} fontSize="11" className="fill-ink">{String(sincere[v.id] ?? 0)}</text>
            <rect x={label} y={y + 20} width={Math.max(1, (b / max) * barW)} height="16" fill="url(#gw-hatch)" className="stroke-brass" />
            <text x={label + (b / max) * barW + 6} y={y + 33} fontSize="11" className="fill-ink">{String(sophisticated[v.id] ?? 0)}</text>
          </g>
        );
      })}
      <g transform={`translate(${label}, ${rows.length * rowH + 14})`} fontSize="11">
        <rect width="12" height="10" className="fill-chamber" /><text x="16" y="9" className="fill-ink">sincere voting</text>
        <rect x="120" width="12" height="10" fill="url(#gw-hatch)" /><text x="136" y="9" className="fill-ink">sophisticated voting</text>
        <text x="0" y="26" className="fill-ink-soft">out of {String(total)} legal order{String(total) === "1" ? "" : "s"}</text>
      </g>
    </svg>
  );
}
