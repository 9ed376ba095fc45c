import { DEGREE_STYLE } from "./TreeNodeCard.tsx";

/** Our legend: what each shape, bar colour and badge on the drawing means. */
export default function TreeLegend() {
  return (
    <section aria-labelledby="legend-h" className="gw-card text-sm" data-testid="tree-legend">
      <h3 id="legend-h" className="text-step-0">Legend</h3>
      <ul className="mt-2 space-y-1.5">
        <li className="flex items-center gap-2">
          <span className="inline-block h-4 w-8 rounded bg-chamber" aria-hidden="true" /> The measure (root)
        </li>
        <li className="flex items-center gap-2">
          <span className="inline-block h-4 w-8 rounded-sm border border-dashed border-ink-soft bg-vellum" aria-hidden="true" /> A section of its text
        </li>
        {Object.values(DEGREE_STYLE).map((d) => (
          <li key={d.label} className="flex items-center gap-2">
            <span className="inline-flex h-4 w-8 overflow-hidden rounded border-2 border-rule bg-white" aria-hidden="true">
              <span className={`w-1.5 ${d.bar}`} />
            </span>
            {d.label} (bar at the left; 1° / 2° beside the number)
          </li>
        ))}
        <li className="flex items-center gap-2">
          <span className="inline-block h-4 w-8 rounded border-4 border-double border-rule bg-white" aria-hidden="true" /> Substitute (double border)
        </li>
        <li className="text-ink-soft">
          The degree is counted as the chamber's rulebook counts it: where a substitute for an amendment is allowed it is of the first degree, drawn beside the amendment it would replace; where the text is perfected while a substitute is pending, those amendments are of the second degree (marked "under" the substitute).
        </li>
        <li className="flex items-center gap-2">
          <span className="inline-block h-4 w-8 rounded border-2 border-rule bg-white opacity-60" aria-hidden="true" /> Withdrawn, fell, rejected or ruled out (faded, struck)
        </li>
        <li className="flex flex-wrap items-center gap-1.5">
          <span className="rounded-full bg-verdict-bar px-1.5 text-[11px] font-bold text-white">✕ n</span> errors
          <span className="rounded-full bg-verdict-query px-1.5 text-[11px] font-bold text-white">? n</span> warnings / needs a ruling
          <span className="rounded-full border border-chamber bg-white px-1.5 text-[11px] font-bold text-chamber">i n</span> notes
          <span className="rounded-full bg-verdict-ok px-1.5 text-[11px] font-bold text-white">⚖ n</span> overridden by a ruling
        </li>
      </ul>
      <p className="gw-hint">Keyboard: Tab into the drawing, then ← parent, → first amendment below, ↑ ↓ siblings, Home the measure.</p>
    </section>
  );
}
