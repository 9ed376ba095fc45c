/**
 * The chamber's bench of scenarios, run against this version: which pass, which fail (expected vs what
 * this version says, in words), and which change verdict against the version in force (adoption then
 * asks for a note). Clerks add a floor scenario, remove one (with a confirmation naming it), import
 * and export the bench as JSON.
 */
import { useCallback, useEffect, useState } from "react";
import { z } from "zod";
import { apiCall, ApiError, type Issue } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

const resultSchema = z.object({ id: z.string(), title: z.string(), source: z.string(), kind: z.string(), passed: z.boolean(), failures: z.array(z.object({ path: z.string(), expected: z.unknown(), got: z.unknown() })), error: z.string().optional() });
const reportSchema = z.object({
  passed: z.number(),
  failed: z.number(),
  results: z.array(resultSchema),
  version: z.object({ id: z.string(), number: z.number() }),
  inForce: z.object({ id: z.string(), number: z.number(), passed: z.number(), failed: z.number() }).nullable(),
  changed: z.array(z.object({ id: z.string(), title: z.string(), source: z.string(), changes: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })), passedBefore: z.boolean(), passedAfter: z.boolean() })),
});
type Report = z.output<typeof reportSchema>;
const versionDocSchema = z.object({ document: z.object({ motions: z.array(z.object({ id: z.string(), name: z.string() })) }) });

const THRESHOLDS: Record<string, string> = { majority: "a majority", "two-thirds": "two-thirds", "majority-of-members": "a majority of the members", none: "no vote", "two-thirds-of-members": "two-thirds of the members", "three-fifths-of-members": "three-fifths of the members", "two-thirds-of-present": "two-thirds of those present" };

/** One expectation's value in words: "in order", "not debatable", "adopted by two-thirds", "2 findings". */
function valueWords(path: string, v: unknown, name: (id: string) => string): string {
  const key = path.split(".").at(-1)!;
  if (path.startsWith("findings.")) return Array.isArray(v) ? (v.length === 0 ? "no finding" : `${v.length} finding${v.length === 1 ? "" : "s"}`) : String(v);
  if (typeof v === "string" && v.startsWith("(")) return "not in the catalogue";
  switch (key) {
    case "inOrder":
      return v ? "in order" : "out of order";
    case "debatable":
    case "amendable":
      return v ? key : `not ${key}`;
    case "second":
      return v ? "needs a second" : "needs no second";
    case "interrupt":
      return v ? "may interrupt a speaker" : "may not interrupt";
    case "vote":
      return `adopted by ${THRESHOLDS[String(v)] ?? String(v)}`;
    case "degree":
      return `of degree ${String(v)}`;
    case "appliesTo":
      return v ? `applies to ${name(String(v))}` : "applies to nothing";
    case "reasons":
      return Array.isArray(v) ? (v.length === 0 ? "no rule against it" : `${v.length} rule${v.length === 1 ? "" : "s"} against it`) : String(v);
    case "reconsiderable":
      return `reconsiderable: ${String(v)}`;
    default:
      return String(v);
  }
}

function subject(path: string, name: (id: string) => string): string {
  const [kind, id] = path.split(".");
  if (kind === "motions") return name(id!);
  if (kind === "findings") return `Amendment ${id}`;
  return "The scenario";
}

const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "scenario";

export default function ScenarioBench({ versionId, canEdit }: { versionId: string; canEdit: boolean }) {
  const [report, setReport] = useState<Report | null>(null);
  const [motions, setMotions] = useState<Array<{ id: string; name: string }>>([]);
  const [error, setError] = useState<string | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string; issues?: Issue[] } | null>(null);
  const [busy, setBusy] = useState(false);
  const [form, setForm] = useState({ title: "", source: "", stack: [] as string[], speaker: false, motion: "", inOrder: "yes" });
  const [adding, setAdding] = useState("");

  const load = useCallback(async () => {
    try {
      const [r, v] = await Promise.all([apiCall(reportSchema, `/api/rulebooks/${versionId}/scenarios`), apiCall(versionDocSchema, `/api/rulebooks/${versionId}`)]);
      setReport(r);
      setMotions(v.document.motions);
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not run the scenarios.");
    }
  }, [versionId]);
  useEffect(() => void load(), [load]);

  if (error) return <Alert>{error}</Alert>;
  if (!report) return <p className="text-ink-soft">Running the scenarios…</p>;
  const names = new Map(motions.map((m) => [m.id, m.name]));
  const name = (id: string) => names.get(id) ?? id;

  const fail = (e: unknown, fallback: string) => setMessage({ tone: "error", text: e instanceof Error ? e.message : fallback, issues: e instanceof ApiError ? e.issues : [] });

  async function add() {
    setBusy(true);
    setMessage(null);
    const scenario = {
      id: `${slug(form.title)}-${Date.now().toString(36)}`,
      kind: "floor",
      title: form.title,
      source: form.source,
      state: { pending: form.stack.map((m) => ({ motion: m })), floor: { speakerHasFloor: form.speaker } },
      expect: { motions: { [form.motion]: { inOrder: form.inOrder === "yes" } } },
    };
    try {
      await apiCall(z.unknown(), "/api/rulebooks/scenarios", { method: "POST", body: scenario });
      setMessage({ tone: "ok", text: `Scenario “${form.title}” added.` });
      setForm({ ...form, title: "", source: "", stack: [], speaker: false, motion: "" });
      await load();
    } catch (e) {
      fail(e, "Scenario not added.");
    } finally {
      setBusy(false);
    }
  }

  async function remove(id: string, title: string) {
    if (!window.confirm(`Remove the scenario “${title}” from the bench?`)) return;
    try {
      await apiCall(z.unknown(), `/api/rulebooks/scenarios/${encodeURIComponent(id)}`, { method: "DELETE" });
      setMessage({ tone: "ok", text: `Scenario “${title}” removed.` });
      await load();
    } catch (e) {
      fail(e, "Scenario not removed.");
    }
  }

  async function importFile(file: File) {
    if (!window.confirm(`Replace the bench of ${report!.results.length} scenarios with the scenarios in “${file.name}”?`)) return;
    setBusy(true);
    try {
      let body: unknown;
      try {
        body = JSON.parse(await file.text());
      } catch {
        throw new Error(`${file.name} is not a JSON file of scenarios.`);
      }
      const r = await apiCall(z.object({ imported: z.number() }), "/api/rulebooks/scenarios", { method: "PUT", body });
      setMessage({ tone: "ok", text: `${r.imported} scenarios imported from ${file.name}.` });
      await load();
    } catch (e) {
      fail(e, "Scenarios not imported.");
    } finally {
      setBusy(false);
    }
  }

  const total = report.results.length;
  return (
    <section id="scenarios" className="gw-card space-y-4" aria-labelledby="scenarios-h" data-testid="scenarios">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 id="scenarios-h" className="text-step-1">Test scenarios</h2>
          <p className="text-sm" data-testid="bench-summary">
            {total === 0 ? "No scenarios yet. Each scenario states a floor situation and the verdict the chamber expects, with its source." : `${report.passed} of ${total} scenarios give the expected verdict on version ${report.version.number}.`}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a className="gw-btn-quiet no-underline" href="/api/rulebooks/scenarios?download" download>Export scenarios</a>
          {canEdit && (
            <label className="gw-btn-quiet cursor-pointer">
              Import scenarios
              <input type="file" accept=".json,application/json" className="sr-only" disabled={busy} onChange={(e) => { const f = e.target.files?.[0]; e.target.value = ""; if (f) void importFile(f); }} />
            </label>
          )}
        </div>
      </div>

      {report.inForce && (
        report.changed.length > 0 ? (
          <div className="gw-advisory" data-testid="changed-verdicts">
            <p className="font-semibold">
              {report.changed.length === 1 ? "One scenario changes" : `${report.changed.length} scenarios change`} verdict against the version in force (version {report.inForce.number}). Adopting this version asks for a note saying why.
            </p>
            <ul className="mt-1 list-disc pl-5 text-sm">
              {report.changed.map((c) => (
                <li key={c.id}>
                  “{c.title}” ({c.source}):{" "}
                  {c.changes.map((x) => `${subject(x.path, name)} ${valueWords(x.path, x.before, name)} → ${valueWords(x.path, x.after, name)}`).join("; ")}
                </li>
              ))}
            </ul>
          </div>
        ) : (
          total > 0 && <p className="text-sm text-verdict-ok" data-testid="no-changed-verdicts">No scenario changes verdict against the version in force (version {report.inForce.number}).</p>
        )
      )}

      {total > 0 && (
        <ul className="divide-y divide-rule" data-testid="scenario-list">
          {report.results.map((r) => (
            <li key={r.id} className="py-2" data-scenario={r.id}>
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div className="min-w-0 flex-1">
                  <span className={`gw-chip mr-2 ${r.passed ? "border-verdict-ok bg-verdict-ok-tint text-verdict-ok" : "border-verdict-bar bg-verdict-bar-tint text-verdict-bar"}`}>{r.passed ? "As expected" : "Differs"}</span>
                  <span className="font-semibold">{r.title}</span>
                  <p className="text-xs text-ink-soft">Source: {r.source}</p>
                  {!r.passed && (
                    <ul className="mt-1 list-disc pl-5 text-sm">
                      {r.error ? <li>This version cannot run it: {r.error}</li> : r.failures.map((f) => <li key={f.path}>{subject(f.path, name)}: expected {valueWords(f.path, f.expected, name)}; this version says {valueWords(f.path, f.got, name)}.</li>)}
                    </ul>
                  )}
                </div>
                {canEdit && <button type="button" className="text-sm underline" onClick={() => void remove(r.id, r.title)}>Remove</button>}
              </div>
            </li>
          ))}
        </ul>
      )}

      {message && <Alert tone={message.tone} testId="scenario-message" issues={message.issues}>{message.text}</Alert>}

      {canEdit && (
        <form className="space-y-3 border-t border-rule pt-3" onSubmit={(e) => { e.preventDefault(); void add(); }} data-testid="add-scenario">
          <h3 className="font-semibold">Add a scenario</h3>
          <div className="grid gap-3 md:grid-cols-2">
            <div className="min-w-0">
              <label htmlFor="sc-title" className="gw-label">Verdict the chamber expects, in words</label>
              <input id="sc-title" className="gw-input w-full" value={form.title} maxLength={500} placeholder="With postpone indefinitely pending, amend is in order" onChange={(e) => setForm({ ...form, title: e.target.value })} />
            </div>
            <div className="min-w-0">
              <label htmlFor="sc-source" className="gw-label">Source (the rule, page or precedent)</label>
              <input id="sc-source" className="gw-input w-full" value={form.source} maxLength={1000} placeholder="SO 20" onChange={(e) => setForm({ ...form, source: e.target.value })} />
            </div>
          </div>
          <div>
            <p className="gw-label">Questions pending, first made first</p>
            <p className="text-sm" data-testid="sc-stack">{form.stack.length === 0 ? "Nothing pending." : form.stack.map((m, i) => <span key={i}>{i > 0 ? " → " : ""}{name(m)}</span>)}</p>
            <div className="mt-1 flex flex-wrap items-end gap-2">
              <div className="min-w-0">
                <label htmlFor="sc-add-pending" className="sr-only">Question to add to the pending questions</label>
                <select id="sc-add-pending" className="gw-input" value={adding} onChange={(e) => setAdding(e.target.value)}>
                  <option value="">Choose a motion…</option>
                  {motions.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
                </select>
              </div>
              <button type="button" className="gw-btn-quiet" disabled={!adding} onClick={() => { setForm({ ...form, stack: [...form.stack, adding] }); setAdding(""); }}>Add to pending</button>
              {form.stack.length > 0 && <button type="button" className="text-sm underline" onClick={() => setForm({ ...form, stack: form.stack.slice(0, -1) })}>Remove the last</button>}
            </div>
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={form.speaker} onChange={(e) => setForm({ ...form, speaker: e.target.checked })} /> A member has the floor (is speaking)
          </label>
          <div className="grid gap-3 md:grid-cols-2">
            <div className="min-w-0">
              <label htmlFor="sc-motion" className="gw-label">Motion to check</label>
              <select id="sc-motion" className="gw-input w-full" value={form.motion} onChange={(e) => setForm({ ...form, motion: e.target.value })}>
                <option value="">Choose a motion…</option>
                {motions.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
              </select>
            </div>
            <div className="min-w-0">
              <label htmlFor="sc-expect" className="gw-label">The chamber expects it to be</label>
              <select id="sc-expect" className="gw-input w-full" value={form.inOrder} onChange={(e) => setForm({ ...form, inOrder: e.target.value })}>
                <option value="yes">in order</option>
                <option value="no">out of order</option>
              </select>
            </div>
          </div>
          <button type="submit" className="gw-btn" disabled={busy || !form.title.trim() || !form.source.trim() || !form.motion}>Add scenario</button>
        </form>
      )}
      <p className="gw-hint">The tool advises; the presiding officer's ruling and the chamber's own rules prevail.</p>
    </section>
  );
}
