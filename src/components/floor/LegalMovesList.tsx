import { useState } from "react";
import { VOTE_LABELS, type Verdict } from "./schemas.ts";
import ClauseCitation from "../rulebooks/ClauseCitation.tsx";

const CLASS_LABELS: Record<Verdict["class"], string> = { privileged: "Privileged", subsidiary: "Subsidiary", incidental: "Incidental", main: "Main", restorative: "Restorative" };

function Trait({ on, label }: { on: boolean; label: string }) {
  return <span className={`gw-chip ${on ? "border-chamber text-chamber-dark" : "border-rule text-ink-soft"}`}>{label}: {on ? "yes" : "no"}</span>;
}

/** Every catalogue motion as in order or out of order, with reasons, citations and characteristics. */
export default function LegalMovesList({ moves, caption }: { moves: Verdict[]; caption?: string }) {
  const [onlyInOrder, setOnlyInOrder] = useState(false);
  const shown = onlyInOrder ? moves.filter((m) => m.inOrder) : moves;
  const count = moves.filter((m) => m.inOrder).length;
  return (
    <section aria-label="Legal moves" data-testid="legal-moves">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-step-1">Motions in order now</h2>
        <p className="text-sm text-ink-soft" data-testid="in-order-count">
          {count} of {moves.length} in order{caption ? ` · ${caption}` : ""}
        </p>
      </div>
      <label className="mt-2 flex items-center gap-2 text-sm">
        <input type="checkbox" checked={onlyInOrder} onChange={(e) => setOnlyInOrder(e.target.checked)} /> Show only motions in order
      </label>
      <p className="gw-advisory mt-2">An aid to the chair, computed from the chamber's rulebook. The presiding officer's ruling, the chamber's own rules and its counsel prevail.</p>
      <ul className="mt-3 divide-y divide-rule rounded-md border border-rule bg-white">
        {shown.map((m) => (
          <li key={m.motion} className="px-3 py-2" data-motion={m.motion} data-in-order={m.inOrder ? "yes" : "no"}>
            <div className="flex flex-wrap items-center gap-2">
              <span className={`gw-chip ${m.inOrder ? "border-verdict-ok bg-verdict-ok-tint text-verdict-ok" : "border-verdict-bar bg-verdict-bar-tint text-verdict-bar"}`}>{m.inOrder ? "In order" : "Out of order"}</span>
              <span className="font-semibold">{m.name}</span>
              {m.degree !== undefined && <span className="text-sm text-ink-soft">(would be degree {m.degree})</span>}
              <span className="text-xs text-ink-soft">
                {CLASS_LABELS[m.class]}
                {m.rank !== null ? ` · rank ${m.rank}` : ""}
              </span>
            </div>
            <div className="mt-1 flex flex-wrap gap-1.5">
              <Trait on={m.second} label="Second" />
              <Trait on={m.debatable} label="Debatable" />
              <Trait on={m.amendable} label="Amendable" />
              <Trait on={m.interrupt} label="May interrupt" />
              <span className="gw-chip border-brass bg-brass-tint text-brass-text">Vote: {VOTE_LABELS[m.vote]}</span>
            </div>
            {m.reasons.length > 0 && (
              <ul className="mt-1 list-disc pl-5 text-sm">
                {m.reasons.map((r) => (
                  <li key={r.rule} data-rule={r.rule}>
                    {r.message} <span className="text-ink-soft">— <ClauseCitation citation={r.citation} clause={r.clause} /></span>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
