/**
 * The majority matrix: one row and one column per version; a cell gives the row's margin over the
 * column in their head-to-head vote. Rows sort by name, wins, losses, Copeland score or the margin
 * over any one version (buttons in the headers: keyboard and pointer alike); cells on the top cycle
 * are marked. Scrolls inside its own region, so a wide matrix never widens the page.
 */
import { useMemo, useState } from "react";
import type { Versions } from "./api.ts";
import { margin, matrixRows, onCycle, sortRows, type Margins, type Sort, type SortKey } from "../../lib/estimates/majority-matrix.ts";

const COLUMN_NAMES: Record<string, string> = { order: "listed order", name: "version", wins: "wins", losses: "losses", copeland: "wins minus losses" };

export default function MajorityMatrix({ versions, margins, topCycle, condorcetWinner }: { versions: Versions; margins: Margins; topCycle: string[]; condorcetWinner: string | null }) {
  const [sort, setSort] = useState<Sort>({ key: "order", descending: false });
  const short = (id: string) => versions.find((v) => v.id === id)?.short ?? id;
  const rows = useMemo(() => {
    const nameOf = (id: string) => versions.find((v) => v.id === id)?.short ?? id;
    return sortRows(matrixRows(versions.map((v) => v.id), margins), sort, margins, nameOf);
  }, [versions, margins, sort]);
  const cycle = condorcetWinner === null && topCycle.length >= 3;
  const by = (key: SortKey) => setSort((s) => (s.key === key ? { key, descending: !s.descending } : { key, descending: key !== "name" }));
  const ariaSort = (key: SortKey): "ascending" | "descending" | "none" => (sort.key === key ? (sort.descending ? "descending" : "ascending") : "none");
  const sortName = sort.key.startsWith("beats:") ? `margin over ${short(sort.key.slice(6))}` : COLUMN_NAMES[sort.key];
  const header = (key: SortKey, label: string, extra = "") => (
    <button type="button" className={`inline-flex items-start gap-1 text-left font-semibold underline decoration-dotted underline-offset-2 hover:text-chamber ${extra}`} onClick={() => by(key)}>
      {label}
      <span aria-hidden="true">{sort.key === key ? (sort.descending ? "▼" : "▲") : "↕"}</span>
    </button>
  );
  return (
    <div>
      <p className="text-sm">Each cell is the row's margin over the column: votes for the row's version minus votes for the column's.{cycle ? " Shaded rows are the top cycle; ↻ marks a win on the majority cycle." : ""}</p>
      <div className="relative mt-1 overflow-x-auto rounded border border-rule" role="region" aria-labelledby="matrix-caption" tabIndex={0} data-testid="majority-matrix">
        <table className="gw-table text-sm">
          <caption id="matrix-caption" className="sticky left-0 w-max max-w-[calc(100vw-3rem)] px-2 py-1 text-left text-sm">
            <span className="font-semibold">Majority matrix</span> of {versions.length} versions. {sort.key === "order" ? "In the listed order." : `Sorted by ${sortName}, ${sort.descending ? (sort.key === "name" ? "Z to A" : "highest first") : sort.key === "name" ? "A to Z" : "lowest first"}.`}
          </caption>
          <thead>
            <tr>
              <th scope="col" aria-sort={ariaSort("name")} className="min-w-[9rem]">{header("name", "Version", "whitespace-nowrap")}</th>
              <th scope="col" aria-sort={ariaSort("wins")}>{header("wins", "Wins", "whitespace-nowrap")}</th>
              <th scope="col" aria-sort={ariaSort("losses")}>{header("losses", "Losses", "whitespace-nowrap")}</th>
              <th scope="col" aria-sort={ariaSort("copeland")}>{header("copeland", "Wins − losses", "whitespace-nowrap")}</th>
              {versions.map((v) => (
                <th key={v.id} scope="col" aria-sort={ariaSort(`beats:${v.id}`)} className="min-w-[4.5rem] align-bottom text-xs">
                  {header(`beats:${v.id}`, `over ${v.short}`, "font-normal")}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} className={cycle && topCycle.includes(r.id) ? "bg-brass-tint" : undefined}>
                <th scope="row" className="text-left font-semibold">{short(r.id)}{cycle && topCycle.includes(r.id) ? <span className="sr-only"> (on the majority cycle)</span> : null}</th>
                <td className="text-right tabular-nums">{r.wins}</td>
                <td className="text-right tabular-nums">{r.losses}</td>
                <td className="text-right tabular-nums">{r.copeland > 0 ? `+${r.copeland}` : r.copeland}</td>
                {versions.map((v) => {
                  if (v.id === r.id) return <td key={v.id} className="text-center text-ink-soft"><span aria-hidden="true">—</span><span className="sr-only">itself</span></td>;
                  const m = margin(margins, r.id, v.id);
                  const hot = onCycle(r.id, v.id, margins, topCycle, condorcetWinner);
                  return (
                    <td key={v.id} className={`text-right tabular-nums ${hot ? "font-semibold text-brass-text outline outline-2 -outline-offset-2 outline-brass" : m > 0 ? "text-verdict-ok" : m < 0 ? "text-verdict-bar" : "text-ink-soft"}`}>
                      {m > 0 ? `+${m}` : m < 0 ? `−${-m}` : "0"}{hot ? <><span aria-hidden="true"> ↻</span><span className="sr-only"> (on the cycle)</span></> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {sort.key !== "order" && <button type="button" className="gw-btn-quiet mt-2" onClick={() => setSort({ key: "order", descending: false })}>Back to the listed order</button>}
    </div>
  );
}
