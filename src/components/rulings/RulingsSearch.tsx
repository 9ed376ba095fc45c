import { useEffect, useState, type SubmitEvent, type ReactNode } from "react";
import { DECISION_LABELS } from "../../lib/rulings/ruling-content.ts";
import { apiCall } from "../shared/api.ts";
import { searchResults } from "./api.ts";
import type { z } from "zod";
import { Alert } from "../shared/Alert.tsx";
import { day } from "../shared/dates.ts";

interface Props {
  initialQuery: Record<string, string>;
  canSeeDrafts: boolean;
}

const FIELDS = ["q", "rule", "motion", "measure", "from", "to", "status"] as const;
type Query = Partial<Record<(typeof FIELDS)[number], string>>;

/** ts_headline marks matches with ⟦ ⟧; render them as <mark> without trusting any HTML. */
function highlight(snippet: string): ReactNode[] {
  return snippet.split(/(⟦[^⟧]*⟧)/).map((part, i) => (part.startsWith("⟦") ? <mark key={i} className="bg-brass-tint px-0.5 text-ink">{part.slice(1, -1)}</mark> : <span key={i}>{part}</span>));
}

export default function RulingsSearch({ initialQuery, canSeeDrafts }: Props) {
  const [query, setQuery] = useState<Query>(initialQuery);
  const [results, setResults] = useState<z.output<typeof searchResults>["results"] | null>(null);
  const [journals, setJournals] = useState<z.output<typeof searchResults>["journals"]>([]);
  const [error, setError] = useState<string | null>(null);

  async function run(q: Query) {
    const params = new URLSearchParams();
    for (const k of FIELDS) if (q[k]) params.set(k, q[k]!);
    history.replaceState(null, "", params.size ? `?${params}` : location.pathname);
    try {
      setError(null);
      const found = await apiCall(searchResults, `/api/rulings?${params}`);
      setResults(found.results);
      setJournals(found.journals);
    } catch (e) {
      setError((e as Error).message);
      setResults([]);
      setJournals([]);
    }
  }

  useEffect(() => {
    void run(initialQuery);
  }, []);

  function onSubmit(e: SubmitEvent) {
    e.preventDefault();
    void run(query);
  }
  const field = (k: keyof Query, label: string, props: Record<string, string> = {}) => (
    <div>
      <label htmlFor={`s-${k}`} className="gw-label">
        {label}
      </label>
      <input id={`s-${k}`} className="gw-input" value={query[k] ?? ""} onChange={(e) => setQuery({ ...query, [k]: e.target.value })} {...props} />
    </div>
  );

  return (
    <div className="space-y-4">
      <form role="search" onSubmit={onSubmit} className="gw-card grid gap-3 sm:grid-cols-2 lg:grid-cols-4" aria-label="Search precedents">
        <div className="sm:col-span-2 lg:col-span-4">
          <label htmlFor="s-q" className="gw-label">
            Search rulings
          </label>
          <input id="s-q" type="search" className="gw-input" value={query.q ?? ""} onChange={(e) => setQuery({ ...query, q: e.target.value })} placeholder='e.g. third degree amendment, "previous question", germane -tolls' />
          <p className="gw-hint">Words are matched in all their forms; use quotes for a phrase and a minus sign to exclude a word.</p>
        </div>
        {field("rule", "Rule (its citation)", { placeholder: "e.g. SO 31" })}
        {field("motion", "Motion", { placeholder: "e.g. close debate" })}
        {field("measure", "Measure", { placeholder: "number or title" })}
        <div className="grid grid-cols-2 gap-2">
          {field("from", "From", { type: "date" })}
          {field("to", "To", { type: "date" })}
        </div>
        {canSeeDrafts && (
          <div>
            <label htmlFor="s-status" className="gw-label">
              Show
            </label>
            <select id="s-status" className="gw-input" value={query.status ?? "issued"} onChange={(e) => setQuery({ ...query, status: e.target.value })}>
              <option value="issued">Issued rulings</option>
              <option value="draft">Drafts</option>
              <option value="all">Both</option>
            </select>
          </div>
        )}
        <div className="flex items-end gap-2 sm:col-span-2 lg:col-span-4">
          <button type="submit" className="gw-btn">
            Search
          </button>
          <button
            type="button"
            className="gw-btn-quiet"
            onClick={() => {
              setQuery({});
              void run({});
            }}
          >
            Clear
          </button>
        </div>
      </form>
      <Alert>{error}</Alert>
      <section aria-live="polite" aria-label="Results">
        {results === null ? (
          <p className="text-ink-soft">Searching…</p>
        ) : results.length === 0 ? (
          <p className="text-ink-soft">No rulings match.</p>
        ) : (
          <ol className="space-y-3" data-testid="results">
            {results.map((r) => (
              <li key={r.id} className="gw-card">
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <h2 className="text-step-1">
                    <a href={`/rulings/${r.id}`}>
                      Ruling {r.number}: {r.target.label}
                    </a>
                  </h2>
                  <span className="text-sm text-ink-soft">
                    {[r.sitting, day(r.sittingDate)].filter(Boolean).join(", ")}
                    {r.status === "draft" && <span className="gw-chip ml-2 border-brass bg-brass-tint text-brass-text">Draft</span>}
                    {r.revision > 1 && <span className="gw-chip ml-2 border-rule text-ink-soft">rev. {r.revision}</span>}
                  </span>
                </div>
                <p className="mt-1 font-semibold">{r.question}</p>
                <p className="mt-1 text-sm">
                  {r.decision ? DECISION_LABELS[r.decision] : "No decision yet"}
                  {r.appeal && ` · appealed: ${r.appeal.outcome === "chair-sustained" ? "chair sustained" : "chair reversed"}`}
                </p>
                {r.snippet && <p className="mt-1 text-sm text-ink-soft">{highlight(r.snippet)}{/[.!?…]$/.test(r.snippet) ? "" : "…"}</p>}
                {r.citations.length > 0 && (
                  <p className="mt-2 flex flex-wrap gap-1">
                    {r.citations.map((c, i) => (
                      <span key={i} className="gw-chip border-rule text-ink-soft">
                        {c.kind === "rule" ? c.citation : (c.label ?? "earlier ruling")}
                      </span>
                    ))}
                  </p>
                )}
              </li>
            ))}
          </ol>
        )}
        {journals.length > 0 && (
          <>
            <h2 className="mt-6 text-step-1">In the journals of sittings</h2>
            <ol className="mt-2 space-y-3" data-testid="journal-results">
              {journals.map((j) => (
                <li key={j.sittingId} className="gw-card">
                  <a href={`/floor/${j.sittingId}/journal`}>Journal of {j.sitting}</a> <span className="text-sm text-ink-soft">{day(j.openedAt)}</span>
                  <p className="mt-1 text-sm text-ink-soft">{highlight(j.snippet)}</p>
                </li>
              ))}
            </ol>
          </>
        )}
      </section>
    </div>
  );
}
