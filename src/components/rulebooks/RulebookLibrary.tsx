import { useEffect, useState, type SubmitEvent } from "react";
import { apiCall, ApiError, type Issue } from "../shared/api.ts";
import { day, when } from "../shared/dates.ts";
import { librarySchema, savedSchema, type Library, type TemplateMeta } from "./schemas.ts";
import { Alert } from "../shared/Alert.tsx";
import { TableHead } from "../shared/TableHead.tsx";

/** "from the template …" in the clerk's words: the template's title, never its file id. */
export function originLabel(origin: string, templates: TemplateMeta[]): string | null {
  if (!origin.startsWith("template:")) return origin === "edit" ? null : origin;
  const id = origin.slice("template:".length);
  const t = templates.find((x) => x.id === id || x.aliases.includes(id));
  return t ? `from the template “${t.title}”` : "from a template";
}

/** One template: what it follows, the date of that text, its licence, and what to verify before use. */
export function TemplateEntry({ t }: { t: TemplateMeta }) {
  const s = t.source;
  const when = [s?.edition, s?.date].filter(Boolean).join("; ");
  return (
    <li className="rounded-md border border-rule p-3" data-testid="template">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <span><span className="font-semibold">{t.title}</span> <span className="text-sm text-ink-soft">— {t.chamber}</span></span>
        <a className="gw-btn-quiet no-underline" href={`/rulebooks/new?template=${encodeURIComponent(t.id)}`}>Start from this</a>
      </div>
      {s && (
        <p className="mt-1 text-sm" data-testid="template-source">
          Follows: {s.url ? <a href={s.url}>{s.title}</a> : s.title}
          {when && <>, {when}</>}
          {s.license && <span className="text-ink-soft"> ({s.license})</span>}
        </p>
      )}
      {t.verify.length > 0 && (
        <details className="mt-1 text-sm" data-testid="template-verify">
          <summary>Verify before use ({t.verify.length})</summary>
          <ul className="mt-1 list-disc pl-5">{t.verify.map((v, i) => <li key={i}>{v}</li>)}</ul>
        </details>
      )}
      {s?.note && (
        <details className="mt-1 text-sm" data-testid="template-note">
          <summary>{t.verify.length > 0 ? "How this template was read" : "Notes on the source"}</summary>
          <p className="mt-1">{s.note}</p>
        </details>
      )}
    </li>
  );
}

/** The chamber's rulebook versions, adoptions, templates, import and compare. */
export default function RulebookLibrary({ canEdit }: { canEdit: boolean }) {
  const [lib, setLib] = useState<Library | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [note, setNote] = useState("");
  const [importError, setImportError] = useState<{ message: string; issues: Issue[] } | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    apiCall(librarySchema, "/api/rulebooks").then(
      (l) => {
        setLib(l);
        setTo(l.versions[0]?.id ?? "");
        setFrom(l.versions[1]?.id ?? l.versions[0]?.id ?? "");
      },
      (e) => setError(e instanceof Error ? e.message : "Could not load the rulebooks."),
    );
  }, []);

  if (error) return <Alert>{error}</Alert>;
  if (!lib) return <p className="text-ink-soft">Loading…</p>;
  const adoptedNumbers = new Map<string, string[]>();
  for (const a of lib.adoptions) adoptedNumbers.set(a.versionId, [...(adoptedNumbers.get(a.versionId) ?? []), day(a.effectiveFrom)]);

  async function upload(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    if (!file || !lib) return;
    setBusy(true);
    setImportError(null);
    const form = new FormData();
    form.set("file", file);
    form.set("basedOn", lib.latest?.id ?? "");
    form.set("note", note);
    try {
      const r = await apiCall(savedSchema, "/api/rulebooks/import", { method: "POST", form: form });
      window.location.assign(`/rulebooks/${r.id}?saved=${r.number}`);
    } catch (err) {
      setImportError(err instanceof ApiError ? { message: err.message, issues: err.issues } : { message: "The upload failed.", issues: [] });
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      <section className="gw-card" aria-labelledby="inforce-h">
        <h2 id="inforce-h" className="text-step-1">In force</h2>
        {lib.inForce ? (
          <p className="mt-1" data-testid="in-force">
            <a href={`/rulebooks/${lib.inForce.versionId}`}>Version {lib.inForce.number}: {lib.inForce.title}</a>, in force from {day(lib.inForce.effectiveFrom)}.
          </p>
        ) : (
          <p className="mt-1 text-ink-soft">No rulebook has been adopted yet.{canEdit ? " Start from a template below, save it, then adopt it." : ""}</p>
        )}
      </section>

      <section aria-labelledby="versions-h">
        <h2 id="versions-h" className="text-step-1">Versions</h2>
        {lib.versions.length === 0 ? (
          <p className="mt-1 text-ink-soft">No versions saved yet.</p>
        ) : (
          <div className="relative mt-2 overflow-x-auto rounded-md border border-rule bg-white">
            <table className="gw-table" data-testid="versions">
              <TableHead columns={["No.", "Title", "Note", "Saved", "By", "Adopted"]} actions />
              <tbody>
                {lib.versions.map((v) => (
                  <tr key={v.id}>
                    <td className="font-semibold">{v.number}</td>
                    <td><a href={`/rulebooks/${v.id}`}>{v.title}</a>{originLabel(v.origin, lib.templates) && <span className="ml-1 text-xs text-ink-soft">({originLabel(v.origin, lib.templates)})</span>}</td>
                    <td className="max-w-xs">{v.note}</td>
                    <td className="whitespace-nowrap">{when(v.createdAt)}</td>
                    <td>{v.author ?? "—"}</td>
                    <td>
                      {lib.inForce?.versionId === v.id && <span className="gw-chip border-verdict-ok bg-verdict-ok-tint text-verdict-ok">In force</span>}{" "}
                      {adoptedNumbers.get(v.id)?.map((d) => <span key={d} className="block text-xs text-ink-soft">effective {d}</span>)}
                    </td>
                    <td className="whitespace-nowrap"><a href={`/api/rulebooks/${v.id}/export`} download>Export</a></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {lib.versions.length > 1 && (
          <form className="mt-3 flex flex-wrap items-end gap-2" action="/rulebooks/compare" method="get">
            <label className="text-sm"><span className="gw-label">Compare</span>
              <select name="from" className="gw-input" value={from} onChange={(e) => setFrom(e.target.value)}>{lib.versions.map((v) => <option key={v.id} value={v.id}>Version {v.number}</option>)}</select>
            </label>
            <label className="text-sm"><span className="gw-label">with</span>
              <select name="to" className="gw-input" value={to} onChange={(e) => setTo(e.target.value)}>{lib.versions.map((v) => <option key={v.id} value={v.id}>Version {v.number}</option>)}</select>
            </label>
            <button className="gw-btn-quiet">Compare</button>
          </form>
        )}
      </section>

      {lib.adoptions.length > 0 && (
        <section aria-labelledby="adoptions-h">
          <h2 id="adoptions-h" className="text-step-1">Adoptions</h2>
          <ul className="mt-1 space-y-1 text-sm">
            {lib.adoptions.map((a) => (
              <li key={a.id}>Version {a.number}, effective {day(a.effectiveFrom)} — adopted {when(a.adoptedAt)} by {a.adoptedBy ?? "—"}{a.note ? `: ${a.note}` : ""}</li>
            ))}
          </ul>
        </section>
      )}

      {canEdit && (
        <div className="grid gap-4 lg:grid-cols-2">
          <section className="gw-card" aria-labelledby="tpl-h">
            <h2 id="tpl-h" className="text-step-1">Start from a template</h2>
            <p className="gw-hint">Opens the template in the editor; saving it adds a new version of this chamber's rulebook.</p>
            <p className="gw-hint">Each template follows the published rules named below, as of the date given; the chamber's own rules and the chair's rulings prevail. Check the “verify before use” points against your rules before adopting.</p>
            <ul className="mt-2 space-y-2">
              {lib.templates.map((t) => <TemplateEntry key={t.id} t={t} />)}
            </ul>
            {lib.latest && <p className="mt-3"><a href="/rulebooks/new">Or edit the latest version (no. {lib.latest.number}) →</a></p>}
          </section>
          <section className="gw-card" aria-labelledby="imp-h">
            <h2 id="imp-h" className="text-step-1">Import a rulebook file</h2>
            <form className="mt-2 space-y-2" onSubmit={upload}>
              <label htmlFor="import-file" className="gw-label">Rulebook file (.json, up to 2 MB)</label>
              <input id="import-file" type="file" accept=".json,application/json" className="block text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
              <label htmlFor="import-note" className="gw-label">Note</label>
              <input id="import-note" className="gw-input" value={note} maxLength={1000} onChange={(e) => setNote(e.target.value)} />
              <button className="gw-btn" disabled={!file || busy}>Import as a new version</button>
              {importError && <Alert testId="import-error" issues={importError.issues} showPaths listFrom={1}>{importError.message}</Alert>}
            </form>
          </section>
        </div>
      )}
    </div>
  );
}
