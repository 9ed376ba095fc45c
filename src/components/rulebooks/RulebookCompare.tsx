import { useEffect, useState } from "react";
import { z } from "zod";
import { useLatestAnswer } from "../shared/useLatestAnswer.ts";
import { apiCall } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import { Alert } from "../shared/Alert.tsx";
import { compareSchema, librarySchema, type Library, type PlainChangeView } from "./schemas.ts";

const SECTION_LABELS: Record<string, string> = { metadata: "Rulebook", chamber: "Chamber", source: "Source", motions: "Motion catalogue", precedence: "Order of precedence", amendments: "Amendments", voting: "Voting", rules: "Rules", rulebook: "Rulebook and chamber" };
const PLAIN_ORDER = ["precedence", "motions", "rules", "amendments", "voting", "rulebook"];
const show = (v: unknown) => (v === null || v === undefined ? "—" : typeof v === "string" ? v : JSON.stringify(v));
const KIND_CHIP: Record<string, string> = { added: "border-verdict-ok text-verdict-ok", removed: "border-verdict-bar text-verdict-bar", changed: "border-brass text-brass-text", "re-ranked": "border-brass text-brass-text" };
const KIND_WORDS: Record<string, string> = { added: "added", removed: "removed", changed: "changed", "re-ranked": "re-ranked" };

/** Without two versions chosen: ask for them. */
function ChooseVersions({ from, to }: { from: string; to: string }) {
  const [lib, setLib] = useState<Library | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    apiCall(librarySchema, "/api/rulebooks").then(setLib, (e) => setError(e instanceof Error ? e.message : "Could not list the versions."));
  }, []);
  if (error) return <Alert>{error}</Alert>;
  if (!lib) return <p className="text-ink-soft">Loading the versions…</p>;
  const versions = [...lib.versions].sort((a, b) => b.number - a.number);
  if (versions.length < 2) return <p className="gw-card">This chamber has {versions.length === 0 ? "no rulebook version" : "only one rulebook version"} yet; there is nothing to compare.</p>;
  const label = (v: (typeof versions)[number]) => `Version ${v.number} — ${when(v.createdAt)}${v.note ? ` — ${v.note}` : ""}`;
  return (
    <form method="get" action="/rulebooks/compare" className="gw-card space-y-3" data-testid="choose-versions">
      <p>Choose the two versions to compare.</p>
      <div className="grid gap-3 md:grid-cols-2">
        {[
          { name: "from", label: "Earlier version", chosen: from || versions[1].id },
          { name: "to", label: "Later version", chosen: to || versions[0].id },
        ].map((side) => (
          <div key={side.name}>
            <label htmlFor={`cmp-${side.name}`} className="gw-label">{side.label}</label>
            <select id={`cmp-${side.name}`} name={side.name} className="gw-input" defaultValue={side.chosen}>
              {versions.map((v) => <option key={v.id} value={v.id}>{label(v)}</option>)}
            </select>
          </div>
        ))}
      </div>
      <button type="submit" className="gw-btn">Compare</button>
    </form>
  );
}

function PlainChange({ c }: { c: PlainChangeView }) {
  return (
    <li className="break-words" data-testid="plain-change">
      <span className={`gw-chip ${KIND_CHIP[c.kind] ?? ""}`}>{KIND_WORDS[c.kind] ?? c.kind}</span>{" "}
      {c.from !== undefined || c.to !== undefined ? (
        <>
          <span className="font-semibold">{c.what}:</span> <span className="text-verdict-bar">{c.from ?? "—"}</span> → <span className="text-verdict-ok">{c.to ?? "—"}</span>
        </>
      ) : (
        <>
          <span className="font-semibold">{c.what}:</span> {c.text}
        </>
      )}
      {c.citation && <span className="text-sm text-ink-soft"> ({c.citation})</span>}
    </li>
  );
}

/** Two versions compared: the changes in plain words, and the field-by-field comparison behind a toggle. */
export default function RulebookCompare({ from, to }: { from: string; to: string }) {
  const [data, setData] = useState<z.output<typeof compareSchema> | null>(null);
  const [error, setError] = useState<string | null>(null);
  const chosen = Boolean(from && to);
  // An answer for an earlier pair arriving late is dropped.
  useLatestAnswer(compareSchema, chosen ? { url: `/api/rulebooks/compare?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}` } : null, setData, (e) => setError(e instanceof Error ? e.message : "Could not compare."));
  if (!chosen) return <ChooseVersions from={from} to={to} />;
  if (error) return <Alert>{error}</Alert>;
  if (!data) return <p className="text-ink-soft">Comparing…</p>;
  const sections = PLAIN_ORDER.map((s) => ({ s, items: data.changes.filter((c) => c.section === s) })).filter((g) => g.items.length);
  return (
    <div className="space-y-4" data-testid="diff">
      <p>
        From <a href={`/rulebooks/${data.from.id}`}>version {data.from.number}</a> ({when(data.from.createdAt)}, {data.from.author ?? "—"}) to <a href={`/rulebooks/${data.to.id}`}>version {data.to.number}</a> ({when(data.to.createdAt)}, {data.to.author ?? "—"}{data.to.note ? `: “${data.to.note}”` : ""}).{" "}
        <a href="/rulebooks/compare">Choose other versions</a>
      </p>
      {data.diff.identical && <p className="gw-card">The two versions are the same in substance.</p>}
      {sections.map(({ s, items }) => (
        <section key={s} className="gw-card" aria-label={SECTION_LABELS[s] ?? s} data-testid={`changes-${s}`}>
          <h2 className="text-step-1">{SECTION_LABELS[s] ?? s}</h2>
          <ul className="mt-2 space-y-2">{items.map((c, i) => <PlainChange key={i} c={c} />)}</ul>
        </section>
      ))}
      {!data.diff.identical && (
        <details className="gw-card">
          <summary className="cursor-pointer font-semibold">Show the field-by-field comparison of the files</summary>
          <div className="mt-2 space-y-4">
            {data.diff.sections.map((s) => (
              <section key={s.section} aria-label={`${SECTION_LABELS[s.section] ?? s.section} (file)`}>
                <h3 className="font-semibold">{SECTION_LABELS[s.section] ?? s.section}</h3>
                <ul className="mt-1 space-y-2">
                  {s.changes.map((c) => (
                    <li key={`${c.kind}-${c.id}`}>
                      <span className={`gw-chip ${KIND_CHIP[c.kind]}`}>{c.kind}</span> <code>{c.id}</code>{c.name ? ` — ${c.name}` : ""}
                      {c.fields.length > 0 && (
                        <div className="relative overflow-x-auto">
                          <table className="gw-table mt-1">
                            <thead><tr><th>Field</th><th>Was</th><th>Now</th></tr></thead>
                            <tbody>
                              {c.fields.map((f) => (
                                <tr key={f.field}>
                                  <td className="font-semibold">{f.field}</td>
                                  <td className="max-w-md break-all font-mono text-xs text-verdict-bar">{show(f.from)}</td>
                                  <td className="max-w-md break-all font-mono text-xs text-verdict-ok">{show(f.to)}</td>
                                </tr>
                              ))}
                            </tbody>
                          </table>
                        </div>
                      )}
                    </li>
                  ))}
                </ul>
              </section>
            ))}
          </div>
        </details>
      )}
    </div>
  );
}
