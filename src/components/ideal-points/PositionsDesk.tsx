/**
 * Members' positions estimated from a session's recorded votes (issue 19, items 3–4): read a CSV of
 * recorded votes (either layout), estimate in a worker with progress and cancel, see members on the
 * dimension(s) with their uncertainty, coloured by bloc, with the cutting line of a chosen roll call,
 * a table sortable by position, and save the result as a spatial estimate of a measure (members,
 * and the versions placed by the clerk) so the voting-order analysis runs on it.
 */
import { useEffect, useMemo, useRef, useState } from "react";
import { z } from "zod";
import { useLatestAnswer } from "../shared/useLatestAnswer.ts";
import { ApiError, apiCall, type Issue } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

const importSchema = z.object({
  layout: z.enum(["long", "matrix"]),
  members: z.array(z.string()),
  blocs: z.record(z.string(), z.string()),
  votes: z.array(z.object({ id: z.string(), yea: z.array(z.string()), nay: z.array(z.string()), notCounted: z.number() })),
});
type Imported = z.output<typeof importSchema>;
const resultSchema = z.object({
  dimensions: z.union([z.literal(1), z.literal(2)]),
  members: z.array(z.object({ id: z.string(), ideal: z.array(z.number()), se: z.array(z.number()).optional(), votes: z.number(), correct: z.number() })),
  votes: z.array(z.object({ id: z.string(), used: z.boolean(), reason: z.string().optional(), yea: z.number(), nay: z.number(), cut: z.object({ normal: z.array(z.number()), at: z.number() }).optional(), errors: z.number().optional() })),
  fit: z.object({ classification: z.number(), apre: z.number(), votesClassified: z.number(), converged: z.boolean() }),
  excluded: z.object({ lopsidedVotes: z.number(), members: z.array(z.object({ id: z.string(), votes: z.number() })) }),
  settings: z.object({ lopsided: z.number(), minVotes: z.number(), bootstrap: z.number() }),
});
type Result = z.output<typeof resultSchema>;
const jobSchema = z.object({
  id: z.string(),
  status: z.enum(["running", "done", "failed", "cancelled"]),
  phase: z.string(),
  progress: z.number(),
  result: resultSchema.nullable(),
  error: z.object({ code: z.string(), message: z.string(), issues: z.array(z.object({ path: z.string(), message: z.string() })) }).nullable(),
});
const optionsSchema = z.object({ measures: z.array(z.object({ id: z.string(), number: z.string(), title: z.string() })) });
const versionsSchema = z.object({ pending: z.array(z.object({ key: z.string(), title: z.string().nullable() })) });

const PALETTE = ["#1f5f8b", "#b5472b", "#2f7d4a", "#7a4a9c", "#a67c00", "#2b7f87", "#8b2f5f", "#555555"];
const pct = (v: number) => `${(v * 100).toFixed(1)}%`;
const num = (v: number) => (Math.round(v * 100) / 100).toFixed(2);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

type Problem = { message: string; issues: Issue[] };
function problem(e: unknown, fallback: string): Problem {
  if (e instanceof ApiError) return { message: e.message, issues: e.issues };
  return { message: fallback, issues: [] };
}

export default function PositionsDesk() {
  const [data, setData] = useState<Imported | null>(null);
  const [fileName, setFileName] = useState("");
  const [error, setError] = useState<Problem | null>(null);
  const [dims, setDims] = useState<1 | 2>(1);
  const [left, setLeft] = useState("");
  const [right, setRight] = useState("");
  const [job, setJob] = useState<z.output<typeof jobSchema> | null>(null);
  const [result, setResult] = useState<Result | null>(null);
  const [cutVote, setCutVote] = useState("");
  const [sort, setSort] = useState<{ by: "position" | "name" | "bloc"; dir: 1 | -1 }>({ by: "position", dir: 1 });
  const poll = useRef<number | null>(null);

  useEffect(() => () => { if (poll.current) window.clearTimeout(poll.current); }, []);

  const read = async (file: File | undefined) => {
    setError(null);
    setData(null);
    setResult(null);
    setJob(null);
    if (!file) return;
    setFileName(file.name);
    try {
      const d = await apiCall(importSchema, "/api/ideal-points/import", { method: "POST", raw: file, type: "text/csv" });
      setData(d);
      setLeft(d.members[0] ?? "");
      setRight(d.members[d.members.length - 1] ?? "");
    } catch (e) {
      setError(problem(e, "Could not read the file. Nothing was saved."));
    }
  };

  const follow = (id: string) => {
    apiCall(jobSchema, `/api/ideal-points/runs/${id}`).then(
      (j) => {
        setJob(j);
        if (j.status === "running") poll.current = window.setTimeout(() => follow(id), 400);
        else if (j.status === "done" && j.result) {
          setResult(j.result);
          setCutVote(j.result.votes.find((v) => v.used)?.id ?? "");
        } else if (j.error && j.status === "failed") setError({ message: j.error.message, issues: j.error.issues });
      },
      (e) => setError(problem(e, "Lost track of the estimate. Try again.")),
    );
  };

  const estimate = async () => {
    if (!data) return;
    setError(null);
    setResult(null);
    if (left === right) return setError({ message: "Choose two different members to set the direction.", issues: [] });
    try {
      const votes = data.votes.map(({ id, yea, nay }) => ({ id, yea, nay }));
      const j = await apiCall(jobSchema, "/api/ideal-points/runs", { method: "POST", body: { dimensions: dims, votes, members: data.members, direction: { left, right } } });
      setJob(j);
      follow(j.id);
    } catch (e) {
      setError(problem(e, "Could not start the estimate."));
    }
  };
  const cancel = async () => {
    if (!job) return;
    try {
      setJob(await apiCall(jobSchema, `/api/ideal-points/runs/${job.id}`, { method: "DELETE" }));
    } catch (e) {
      setError(problem(e, "Could not cancel the estimate."));
    }
  };

  const blocs = useMemo(() => {
    const names = [...new Set(Object.values(data?.blocs ?? {}))].sort();
    return new Map(names.map((n, i) => [n, PALETTE[i % PALETTE.length]]));
  }, [data]);
  const blocOf = (m: string) => data?.blocs[m] ?? "";
  const colour = (m: string) => blocs.get(blocOf(m)) ?? "#333333";

  const rows = useMemo(() => {
    if (!result) return [];
    const r = [...result.members];
    r.sort((a, b) => sort.dir * (sort.by === "position" ? a.ideal[0] - b.ideal[0] : sort.by === "name" ? a.id.localeCompare(b.id) : blocOf(a.id).localeCompare(blocOf(b.id)) || a.ideal[0] - b.ideal[0]));
    return r;
  }, [result, sort, data]);
  const sortButton = (by: "position" | "name" | "bloc", label: string) => (
    <button type="button" className="font-semibold underline" onClick={() => setSort((s) => ({ by, dir: s.by === by ? (-s.dir as 1 | -1) : 1 }))} aria-label={`Sort by ${label.toLowerCase()}`}>
      {label}{sort.by === by ? (sort.dir === 1 ? " ▲" : " ▼") : ""}
    </button>
  );
  const sortState = (by: string) => (sort.by === by ? (sort.dir === 1 ? "ascending" : "descending") : "none");

  return (
    <div className="space-y-6">
      <section className="gw-card space-y-3" aria-labelledby="pos-read">
        <h2 id="pos-read" className="text-lg font-semibold">1. Recorded votes</h2>
        <p className="gw-hint">A CSV file of the session's recorded votes, in either layout: one row per member per vote, with the columns <code>member, vote, position</code> (and <code>bloc</code> if you want colours by bloc); or one row per member and one column per roll call, after <code>member</code> and <code>bloc</code>. Write yea or nay (aye, yes, no also do); present, abstain, not voting, absent, recused or a blank cell are not counted. Save the file as CSV UTF-8.</p>
        <label className="gw-label">CSV file of recorded votes
          <input className="gw-input" type="file" accept=".csv,text/csv" onChange={(e) => void read(e.target.files?.[0])} />
        </label>
        {data && (
          <p className="font-semibold" role="status">
            Read {fileName}: {plural(data.members.length, "member")}, {plural(data.votes.length, "roll call")} ({data.layout === "long" ? "one row per member per vote" : "one column per roll call"}){blocs.size ? `, ${plural(blocs.size, "bloc")}` : ""}.
          </p>
        )}
      </section>

      <Alert look="box" issues={error?.issues}>{error?.message}</Alert>

      {data && (
        <section className="gw-card space-y-3" aria-labelledby="pos-est">
          <h2 id="pos-est" className="text-lg font-semibold">2. Estimate positions</h2>
          <p className="gw-hint">Positions are estimated with the item-response model of Clinton, Jackman and Rivers (2004), by the fast EM method of Imai, Lo and Olmsted (2016). Positions have no direction of their own: name a member to place on the left and one on the right. The scale is set so that the members' positions average 0 with a spread (standard deviation) of 1.</p>
          <div className="grid gap-4 md:grid-cols-3">
            <label className="gw-label">Dimensions
              <select className="gw-input" value={dims} onChange={(e) => setDims(Number(e.target.value) as 1 | 2)}>
                <option value={1}>One (left to right)</option>
                <option value={2}>Two</option>
              </select>
            </label>
            <label className="gw-label">Placed on the left
              <select className="gw-input" value={left} onChange={(e) => setLeft(e.target.value)}>
                {data.members.map((m) => <option key={m} value={m}>{m}</option>)}
              </select>
            </label>
            <label className="gw-label">Placed on the right
              <select className="gw-input" value={right} onChange={(e) => setRight(e.target.value)}>
                {data.members.map((m) => <option key={m} value={m}>{m}</option>)}
              </select>
            </label>
          </div>
          <div className="flex flex-wrap items-center gap-3">
            <button className="gw-btn" onClick={() => void estimate()} disabled={job?.status === "running"}>Estimate positions</button>
            {job?.status === "running" && (
              <>
                <progress max={1} value={job.progress} aria-label="Progress of the estimate" className="w-48" />
                <span className="text-sm">{job.phase === "bootstrap" ? "Measuring the uncertainty…" : "Estimating…"} {Math.round(job.progress * 100)}%</span>
                <button className="gw-btn-quiet" onClick={() => void cancel()}>Cancel the estimate</button>
              </>
            )}
            {job?.status === "cancelled" && <span role="status" className="text-sm">The estimate was cancelled. Nothing was saved.</span>}
          </div>
        </section>
      )}

      {result && data && (
        <section className="gw-card space-y-4" aria-labelledby="pos-res">
          <h2 id="pos-res" className="text-lg font-semibold">3. Where members stand</h2>
          <p data-testid="fit">
            The positions account for <strong>{pct(result.fit.classification)}</strong> of the {result.fit.votesClassified.toLocaleString("en")} votes counted (each predicted from the member's position and the roll call's cutting line), and remove <strong>{pct(Math.max(0, result.fit.apre))}</strong> of the errors of predicting that every member votes with the majority.
            {!result.fit.converged && " The estimate stopped before settling: read the positions with care."}
          </p>
          <p data-testid="left-out">
            Left out, as the method's authors advise: {plural(result.excluded.lopsidedVotes, "roll call")} where the losing side had fewer than {pct(result.settings.lopsided)} of the votes, and {plural(result.excluded.members.length, "member")} with fewer than {result.settings.minVotes} votes on the other roll calls{result.excluded.members.length ? ` (${result.excluded.members.slice(0, 12).map((m) => `${m.id}: ${m.votes}`).join("; ")}${result.excluded.members.length > 12 ? "; …" : ""})` : ""}.
          </p>
          <label className="gw-label max-w-md">Roll call whose cutting line is drawn
            <select className="gw-input" value={cutVote} onChange={(e) => setCutVote(e.target.value)}>
              {result.votes.filter((v) => v.used).map((v) => <option key={v.id} value={v.id}>{v.id} ({v.yea} yea, {v.nay} nay)</option>)}
            </select>
          </label>
          <Chart result={result} colour={colour} cut={result.votes.find((v) => v.id === cutVote) ?? null} />
          {blocs.size > 0 && (
            <ul className="flex flex-wrap gap-3 text-sm" aria-label="Blocs">
              {[...blocs].map(([b, c]) => <li key={b} className="inline-flex items-center gap-1"><span aria-hidden className="inline-block h-3 w-3 rounded-full" style={{ background: c }} />{b}</li>)}
            </ul>
          )}
          <p className="gw-hint">Bars show each position's uncertainty: the range of about 95% (two standard errors either side), from {result.settings.bootstrap} re-estimates on votes simulated from the fitted model (parametric bootstrap).</p>
          <div className="relative overflow-x-auto">
            <table className="gw-table" data-testid="positions-table">
              <caption className="sr-only">Members' estimated positions</caption>
              <thead>
                <tr>
                  <th scope="col" aria-sort={sortState("name")}>{sortButton("name", "Member")}</th>
                  <th scope="col" aria-sort={sortState("bloc")}>{sortButton("bloc", "Bloc")}</th>
                  <th scope="col" aria-sort={sortState("position")}>{sortButton("position", result.dimensions === 1 ? "Position" : "First dimension")}</th>
                  {result.dimensions === 2 && <th scope="col">Second dimension</th>}
                  <th scope="col">Votes counted</th>
                  <th scope="col">Predicted correctly</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((m) => (
                  <tr key={m.id}>
                    <td>{m.id}</td>
                    <td>{blocOf(m.id)}</td>
                    {m.ideal.map((x, k) => <td key={k} className="tabular-nums">{num(x)}{m.se ? ` ± ${num(2 * m.se[k])}` : ""}</td>)}
                    <td className="tabular-nums">{m.votes}</td>
                    <td className="tabular-nums">{pct(m.votes ? m.correct / m.votes : 0)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <SaveAsEstimate result={result} blocOf={blocOf} />
        </section>
      )}
    </div>
  );
}

function Chart({ result, colour, cut }: { result: Result; colour: (m: string) => string; cut: Result["votes"][number] | null }) {
  const W = 640;
  const pad = 36;
  const spread = Math.max(2.5, ...result.members.map((m) => Math.max(...m.ideal.map((x, k) => Math.abs(x) + 2 * (m.se?.[k] ?? 0))))) * 1.05;
  const sx = (x: number) => pad + ((x + spread) / (2 * spread)) * (W - 2 * pad);
  if (result.dimensions === 1) {
    const sorted = [...result.members].sort((a, b) => a.ideal[0] - b.ideal[0]);
    const rowH = sorted.length > 60 ? 6 : 12;
    const H = pad * 2 + sorted.length * rowH;
    const cutX = cut?.cut ? cut.cut.at * cut.cut.normal[0] : null;
    return (
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-3xl" role="img" aria-label={`Members' positions from left to right${cut ? `, with the cutting point of ${cut.id}` : ""}`} data-testid="positions-chart">
        <line x1={pad} x2={W - pad} y1={H - pad + 6} y2={H - pad + 6} stroke="#999" />
        {[-2, -1, 0, 1, 2].map((t) => <text key={t} x={sx(t)} y={H - pad + 22} fontSize="11" textAnchor="middle" fill="#555">{t}</text>)}
        <text x={pad} y={H - 4} fontSize="11" fill="#555">left</text>
        <text x={W - pad} y={H - 4} fontSize="11" textAnchor="end" fill="#555">right</text>
        {sorted.map((m, i) => {
          const y = pad + i * rowH + rowH / 2;
          const se = m.se?.[0] ?? 0;
          return (
            <g key={m.id}>
              <title>{`${m.id}: ${num(m.ideal[0])}${se ? ` ± ${num(2 * se)}` : ""}`}</title>
              {se > 0 && <line x1={sx(m.ideal[0] - 2 * se)} x2={sx(m.ideal[0] + 2 * se)} y1={y} y2={y} stroke={colour(m.id)} strokeOpacity={0.5} strokeWidth={rowH > 8 ? 2 : 1} />}
              <circle cx={sx(m.ideal[0])} cy={y} r={rowH > 8 ? 4 : 2.5} fill={colour(m.id)} />
            </g>
          );
        })}
        {cutX !== null && Math.abs(cutX) < spread && (
          <g data-testid="cutting-line">
            <line x1={sx(cutX)} x2={sx(cutX)} y1={pad - 12} y2={H - pad + 6} stroke="#111" strokeDasharray="5 4" />
            <text x={sx(cutX) + (cut!.cut!.normal[0] < 0 ? -4 : 4)} y={pad - 16} fontSize="11" textAnchor={cut!.cut!.normal[0] < 0 ? "end" : "start"}>{cut!.cut!.normal[0] < 0 ? "← yea" : "yea →"}</text>
          </g>
        )}
      </svg>
    );
  }
  const H = W;
  const sy = (y: number) => H - pad - ((y + spread) / (2 * spread)) * (H - 2 * pad);
  let line: [number, number, number, number] | null = null;
  let yeaMark: [number, number] | null = null;
  if (cut?.cut) {
    const [a, b] = cut.cut.normal;
    const at = cut.cut.at;
    const px = a * at, py = b * at; // closest point to the centre
    const L = spread * 3;
    line = [px - b * L, py + a * L, px + b * L, py - a * L];
    const clamp = (v: number) => Math.max(-spread * 0.9, Math.min(spread * 0.9, v));
    yeaMark = [clamp(px + a * spread * 0.15), clamp(py + b * spread * 0.15)];
  }
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-2xl" role="img" aria-label={`Members' positions on two dimensions${cut ? `, with the cutting line of ${cut.id}` : ""}`} data-testid="positions-chart">
      <defs><clipPath id="plot-area"><rect x={pad} y={pad} width={W - 2 * pad} height={H - 2 * pad} /></clipPath></defs>
      <rect x={pad} y={pad} width={W - 2 * pad} height={H - 2 * pad} fill="none" stroke="#bbb" />
      <line x1={sx(0)} x2={sx(0)} y1={pad} y2={H - pad} stroke="#e2e2e2" />
      <line x1={pad} x2={W - pad} y1={sy(0)} y2={sy(0)} stroke="#e2e2e2" />
      <text x={W / 2} y={H - 8} fontSize="11" textAnchor="middle" fill="#555">first dimension (left to right)</text>
      <text x={12} y={H / 2} fontSize="11" textAnchor="middle" fill="#555" transform={`rotate(-90 12 ${H / 2})`}>second dimension</text>
      {result.members.map((m) => {
        const [x, y] = m.ideal;
        const [ex, ey] = m.se ?? [0, 0];
        return (
          <g key={m.id}>
            <title>{`${m.id}: (${num(x)}, ${num(y)})`}</title>
            {ex > 0 && <line x1={sx(x - 2 * ex)} x2={sx(x + 2 * ex)} y1={sy(y)} y2={sy(y)} stroke={colour(m.id)} strokeOpacity={0.4} />}
            {ey > 0 && <line x1={sx(x)} x2={sx(x)} y1={sy(y - 2 * ey)} y2={sy(y + 2 * ey)} stroke={colour(m.id)} strokeOpacity={0.4} />}
            <circle cx={sx(x)} cy={sy(y)} r={3.5} fill={colour(m.id)} />
          </g>
        );
      })}
      {line && (
        <g data-testid="cutting-line" clipPath="url(#plot-area)">
          <line x1={sx(line[0])} y1={sy(line[1])} x2={sx(line[2])} y2={sy(line[3])} stroke="#111" strokeDasharray="5 4" />
          {yeaMark && <text x={sx(yeaMark[0])} y={sy(yeaMark[1])} fontSize="12" textAnchor="middle" fill="#111">yea side</text>}
        </g>
      )}
    </svg>
  );
}

function SaveAsEstimate({ result, blocOf }: { result: Result; blocOf: (m: string) => string }) {
  const [measures, setMeasures] = useState<z.output<typeof optionsSchema>["measures"]>([]);
  const [measureId, setMeasureId] = useState("");
  const [pending, setPending] = useState<z.output<typeof versionsSchema>["pending"]>([]);
  const [scope, setScope] = useState<string[]>([]);
  const [title, setTitle] = useState("");
  const [names, setNames] = useState<string[]>(result.dimensions === 1 ? ["Left to right"] : ["First dimension", "Second dimension"]);
  const [places, setPlaces] = useState<Record<string, string[]>>({});
  const [error, setError] = useState<Problem | null>(null);
  const d = result.dimensions;

  useEffect(() => {
    apiCall(optionsSchema, "/api/estimates/options").then((o) => {
      setMeasures(o.measures);
      if (o.measures[0]) setMeasureId(o.measures[0].id);
    }, () => setError({ message: "Could not load the measures.", issues: [] }));
  }, []);
  // An answer for a measure no longer chosen is dropped.
  useLatestAnswer(
    versionsSchema,
    measureId ? { url: `/api/estimates/versions?measureId=${encodeURIComponent(measureId)}` } : null,
    (t) => {
      setPending(t.pending);
      setScope([]);
    },
    () => setError({ message: "Could not list the measure's amendments.", issues: [] }),
  );

  const place = (key: string) => places[key] ?? Array.from({ length: d }, () => "");
  const setPlace = (key: string, k: number, v: string) => setPlaces((p) => ({ ...p, [key]: place(key).map((x, i) => (i === k ? v : x)) }));
  const measureNumber = measures.find((m) => m.id === measureId)?.number ?? "the measure";
  const placeInputs = (key: string, label: string) => (
    <fieldset key={key} className="flex flex-wrap items-end gap-2">
      <legend className="text-sm font-semibold">{label}</legend>
      {names.map((n, k) => (
        <label key={k} className="gw-label w-40">{n}
          <input className="gw-input" inputMode="decimal" value={place(key)[k]} onChange={(e) => setPlace(key, k, e.target.value)} />
        </label>
      ))}
    </fieldset>
  );

  const save = async () => {
    setError(null);
    const issues: Issue[] = [];
    const read = (key: string, label: string) =>
      place(key).map((v, k) => {
        const x = Number(v.trim());
        if (v.trim() === "" || !Number.isFinite(x)) issues.push({ path: `${key}.${k}`, message: `${label}, ${names[k]}: give a number (a point for decimals)` });
        return x;
      });
    if (!title.trim()) issues.push({ path: "title", message: "Give the estimate a title." });
    const statusQuo = read("Q", "Status quo");
    const measure = read("measure", measureNumber);
    const effects = Object.fromEntries(scope.map((a) => [a, { position: read(a, `Amendment ${a}`) }]));
    if (issues.length) return setError({ message: issues.length === 1 ? issues[0].message : `${issues.length} things to fix before saving.`, issues });
    try {
      // The plot's frame on each dimension: every member and every placed version, with a margin.
      const ranges = names.map((_, k) => {
        const xs = [...result.members.map((m) => m.ideal[k]), statusQuo[k], measure[k], ...Object.values(effects).map((e) => e.position[k])];
        return [Math.floor(Math.min(...xs) * 2 - 1) / 2, Math.ceil(Math.max(...xs) * 2 + 1) / 2];
      });
      const content = {
        kind: "spatial",
        dimensions: names.map((n, k) => n.trim() || `Dimension ${k + 1}`),
        ranges,
        statusQuo,
        measure,
        effects,
        members: result.members.map((m) => ({ member: m.id, bloc: blocOf(m.id), weight: 1, ideal: m.ideal })),
      };
      const note = `Positions estimated from recorded votes: ${pct(result.fit.classification)} of votes predicted correctly; ${result.excluded.lopsidedVotes} one-sided roll calls and ${result.excluded.members.length} members with few votes left out.`;
      const r = await apiCall(z.object({ id: z.string() }), "/api/estimates", { method: "POST", body: { measureId, title: title.trim(), scope, content, note } });
      window.location.href = `/orders/${r.id}`;
    } catch (e) {
      setError(problem(e, "Could not save the estimate. Nothing was saved."));
    }
  };

  return (
    <div className="space-y-3 border-t border-rule pt-4">
      <h3 className="text-lg font-semibold">4. Save as an estimate for a measure</h3>
      <p className="gw-hint">Saved as a spatial estimate (each member with one vote, at the position above) that only you can see until you share it; the voting-order analysis then runs on it. Place the status quo, the measure and each amendment you consider on the same scale as the members.</p>
      <div className="grid gap-4 md:grid-cols-2">
        <label className="gw-label">Measure
          <select className="gw-input" value={measureId} onChange={(e) => setMeasureId(e.target.value)}>
            {measures.map((m) => <option key={m.id} value={m.id}>{m.number} — {m.title}</option>)}
          </select>
        </label>
        <label className="gw-label">Title of the estimate
          <input className="gw-input" value={title} maxLength={200} onChange={(e) => setTitle(e.target.value)} placeholder="e.g. Positions from the spring session" />
        </label>
        {names.map((n, k) => (
          <label key={k} className="gw-label">Name of the {d === 1 ? "dimension" : k === 0 ? "first dimension" : "second dimension"}
            <input className="gw-input" value={n} maxLength={80} onChange={(e) => setNames(names.map((x, i) => (i === k ? e.target.value : x)))} />
          </label>
        ))}
      </div>
      {pending.length > 0 && (
        <fieldset>
          <legend className="gw-label">Pending amendments to consider</legend>
          <div className="mt-1 flex flex-wrap gap-3">
            {pending.map((p) => (
              <label key={p.key} className="inline-flex items-center gap-1 text-sm">
                <input type="checkbox" checked={scope.includes(p.key)} onChange={(e) => setScope(e.target.checked ? [...scope, p.key] : scope.filter((k) => k !== p.key))} />
                {p.key}{p.title ? ` (${p.title})` : ""}
              </label>
            ))}
          </div>
        </fieldset>
      )}
      {placeInputs("Q", "Status quo (the measure rejected)")}
      {placeInputs("measure", `${measureNumber} as introduced`)}
      {scope.map((a) => placeInputs(a, `Where amendment ${a}, if adopted, puts the measure`))}
      <Alert issues={error?.issues}>{error?.message}</Alert>
      <button className="gw-btn" onClick={() => void save()} disabled={!measureId}>Save as estimate</button>
    </div>
  );
}
