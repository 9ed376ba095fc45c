import { useEffect, useState } from "react";
import { z } from "zod";
import { apiCall } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import { compareSchema } from "./schemas.ts";
import { Alert } from "../shared/Alert.tsx";

const SECTION_LABELS: Record<string, string> = { metadata: "Rulebook", chamber: "Chamber", source: "Source", motions: "Motion catalogue", precedence: "Precedence", amendments: "Amendments", voting: "Voting", rules: "Rules" };
const show = (v: unknown) => (v === null || v === undefined ? "—" : typeof v === "string" ? v : JSON.stringify(v));

/** Two versions side by side, by section, motion and rule. */
export default function RulebookCompare({ from, to }: { from: string; to: string }) {
  const [data, setData] = useState<z.output<typeof compareSchema> | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    apiCall(compareSchema, `/api/rulebooks/compare?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`).then(setData, (e) => setError(e instanceof Error ? e.message : "Could not compare."));
  }, [from, to]);
  if (error) return <Alert>{error}</Alert>;
  if (!data) return <p className="text-ink-soft">Comparing…</p>;
  return (
    <div className="space-y-4" data-testid="diff">
      <p>
        From <a href={`/rulebooks/${data.from.id}`}>version {data.from.number}</a> ({when(data.from.createdAt)}, {data.from.author ?? "—"}) to <a href={`/rulebooks/${data.to.id}`}>version {data.to.number}</a> ({when(data.to.createdAt)}, {data.to.author ?? "—"}{data.to.note ? `: “${data.to.note}”` : ""}).
      </p>
      {data.diff.identical && <p className="gw-card">The two versions are the same in substance.</p>}
      {data.diff.sections.map((s) => (
        <section key={s.section} className="gw-card" aria-label={SECTION_LABELS[s.section] ?? s.section}>
          <h2 className="text-step-1">{SECTION_LABELS[s.section] ?? s.section}</h2>
          <ul className="mt-2 space-y-2">
            {s.changes.map((c) => (
              <li key={`${c.kind}-${c.id}`}>
                <span className={`gw-chip ${c.kind === "added" ? "border-verdict-ok text-verdict-ok" : c.kind === "removed" ? "border-verdict-bar text-verdict-bar" : "border-brass text-brass-text"}`}>{c.kind}</span>{" "}
                <code>{c.id}</code>{c.name ? ` — ${c.name}` : ""}
                {c.fields.length > 0 && (
                  <table className="gw-table mt-1">
                    <thead><tr><th>Field</th><th>Was</th><th>Now</th></tr></thead>
                    <tbody>
                      {c.fields.map((f) => (
                        <tr key={f.field}>
                          <td className="font-semibold">{f.field}</td>
                          <td className="max-w-md break-words font-mono text-xs text-verdict-bar">{show(f.from)}</td>
                          <td className="max-w-md break-words font-mono text-xs text-verdict-ok">{show(f.to)}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                )}
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
