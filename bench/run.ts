/**
 * Voting-engine benchmark (`npm run bench`): one core, seeded inputs, each figure beside a plain
 * brute-force baseline where that finishes, as a ratio. Prints a table and writes
 * bench/results/voting.json. Not a test: nothing here fails the build.
 *
 * Targets (issue 5): majority graph of 650 weighted ballots over 64 alternatives < 50 ms; exact sincere
 * and sophisticated outcome counts over all orders of 14 unconstrained alternatives < 5 s; Banks set
 * of a 16-alternative random tournament < 2 s. Tournaments are seeded and drawn again until the top
 * cycle holds every alternative, so no row is an easy Condorcet-winner instance.
 * Targets (issue 13, amendment trees under the order constraints primary-contiguous, perfecting before
 * the substitute's amendments, perfecting-after-rejected-substitute): exact sincere and sophisticated
 * counts for 14 questions (13 amendments and passage) < 5 s; one page of legal orders for a 16-amendment
 * tree < 200 ms. Baselines: enumeration of every legal order where that finishes.
 *
 * `BENCH_ONLY=trees npx tsx bench/run.ts` runs only the amendment-tree rows (also: majority, counts, banks);
 * a filtered run writes bench/results/voting-<filter>.json instead of voting.json.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { shepsleWeingast, sincereAmendment } from "../src/lib/voting/amendment-agenda.ts";
import { sincereCounts, sophisticatedCounts } from "../src/lib/voting/agenda-counts.ts";
import { banksSet } from "../src/lib/voting/banks-set.ts";
import { graphFromMargins, majorityGraph, type MajorityGraph } from "../src/lib/voting/majority-graph.ts";
import { precedence } from "../src/lib/voting/precedence.ts";
import { profileFromRankings, type Profile } from "../src/lib/voting/profile.ts";
import { amendmentTreeModel, type AmendmentTreeModel } from "../src/lib/voting/amendment-versions.ts";
import { countLegalOrders } from "../src/lib/voting/count-orders.ts";
import { legalOrderPage, legalOrders } from "../src/lib/voting/legal-orders.ts";
import { questionPrecedence } from "../src/lib/voting/order-constraints.ts";
import { questionAgenda, sincereQuestionPath, sophisticatedQuestionOutcome } from "../src/lib/voting/question-agenda.ts";
import { sincereQuestionCounts, sophisticatedQuestionCounts } from "../src/lib/voting/question-counts.ts";
import type { OrderConstraint } from "../src/lib/procedure/voting-section.ts";
import { topCycle } from "../src/lib/voting/top-cycle.ts";
import { seededRandom as mulberry32 } from "../src/lib/ideal-points/normal.ts";

function shuffled(n: number, rnd: () => number): number[] {
  const a = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rnd() * (i + 1));
    [a[i], a[j]] = [a[j], a[i]];
  }
  return a;
}

/** The first seeded random tournament from `seed` on whose top cycle is every alternative (no easy instance). */
function randomTournament(n: number, seed: number): MajorityGraph {
  for (let s = seed; ; s++) {
    const g = tournamentFromSeed(n, s);
    if (topCycle(g).length === n) return g;
  }
}

function tournamentFromSeed(n: number, seed: number): MajorityGraph {
  const rnd = mulberry32(seed);
  const m = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      const v = rnd() < 0.5 ? 1 : -1;
      m[i][j] = v;
      m[j][i] = -v;
    }
  return graphFromMargins(Array.from({ length: n }, (_, i) => `x${i}`), m);
}

/** Median wall time in ms over `runs` runs (after one warm-up unless the job is slow). */
function time<T>(fn: () => T, runs = 5): { ms: number; result: T } {
  let result = fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    result = fn();
    t.push(performance.now() - s);
  }
  t.sort((a, b) => a - b);
  return { ms: t[Math.floor(t.length / 2)], result };
}

/** One run: wall-clock ms, and this process's CPU ms (user + system, all threads) beside it for a shared machine. */
function once<T>(fn: () => T): { ms: number; cpuMs: number; result: T } {
  const s = performance.now();
  const c = process.cpuUsage();
  const result = fn();
  const cpu = process.cpuUsage(c);
  return { ms: performance.now() - s, cpuMs: (cpu.user + cpu.system) / 1000, result };
}

function* permutations(n: number): Generator<number[]> {
  const a = Array.from({ length: n }, (_, i) => i);
  const c = new Array<number>(n).fill(0);
  yield a.slice();
  let i = 0;
  while (i < n) {
    if (c[i] < i) {
      const j = i % 2 === 0 ? 0 : c[i];
      [a[j], a[i]] = [a[i], a[j]];
      yield a;
      c[i]++;
      i = 0;
    } else {
      c[i] = 0;
      i++;
    }
  }
}

interface Row {
  task: string;
  size: string;
  engineMs: number;
  baselineMs: number | null;
  ratio: number | null;
  target?: string;
  meetsTarget?: boolean;
  /** Process CPU ms of the engine run (tree counts), which a loaded machine inflates less than the wall clock. */
  engineCpuMs?: number;
  note?: string;
}
const rows: Row[] = [];
const round = (x: number) => Math.round(x * 100) / 100;
const only = process.env.BENCH_ONLY;
const want = (group: "majority" | "counts" | "banks" | "trees") => !only || only === group;

// 1. Majority graph: 650 weighted ballots over 64 alternatives.
if (want("majority")) {
  const rnd = mulberry32(650);
  const names = Array.from({ length: 64 }, (_, i) => `v${i}`);
  const ballots = Array.from({ length: 650 }, () => ({ ranking: shuffled(64, rnd), weight: 1 + Math.floor(rnd() * 5) }));
  const engine = time(() => majorityGraph(profileFromRankings(names, ballots, "abstain")), 9);
  // Baseline: for each ordered pair, scan every ballot and look both alternatives up in the ranking.
  const base = time(() => {
    const m: number[][] = names.map(() => new Array<number>(64).fill(0));
    for (let x = 0; x < 64; x++)
      for (let y = 0; y < 64; y++) if (x !== y) for (const b of ballots) m[x][y] += b.ranking.indexOf(x) < b.ranking.indexOf(y) ? b.weight : -b.weight;
    return m;
  }, 3);
  const agree = engine.result.margins.every((row, x) => row.every((v, y) => x === y || v === base.result[x][y]));
  if (!agree) throw new Error("majority graph disagrees with the baseline");
  rows.push({ task: "majority graph", size: "650 weighted ballots × 64 alternatives", engineMs: round(engine.ms), baselineMs: round(base.ms), ratio: round(base.ms / engine.ms), target: "< 50 ms", meetsTarget: engine.ms < 50 });
}

// 2. Exact sincere + sophisticated outcome counts over all orders (amendment procedure), random tournaments.
for (const n of want("counts") ? [8, 9, 10, 14] : []) {
  const g = randomTournament(n, 1400 + n);
  const prec = precedence(n, []);
  const engine = n >= 14 ? once(() => [sincereCounts(g, prec, "amendment", null), sophisticatedCounts(g, prec, "amendment")]) : time(() => [sincereCounts(g, prec, "amendment", null), sophisticatedCounts(g, prec, "amendment")], 3);
  let baselineMs: number | null = null;
  let note: string | undefined;
  if (n <= 10) {
    const b = once(() => {
      const s = new Array<number>(n).fill(0);
      const o = new Array<number>(n).fill(0);
      for (const p of permutations(n)) {
        s[sincereAmendment(g, p)]++;
        o[shepsleWeingast(g, p).outcome]++;
      }
      return [s, o];
    });
    baselineMs = b.ms;
    if (JSON.stringify(b.result) !== JSON.stringify(engine.result.map((c) => c.map(Number)))) throw new Error(`counts disagree with enumeration at n=${n}`);
  } else note = `enumeration of ${n}! orders not run (extrapolated from n=10: ~${Math.round((rows.at(-1)!.baselineMs! * 11 * 12 * 13 * 14) / 1000 / 60)} min)`;
  rows.push({
    task: "outcome counts, all orders",
    size: `${n} alternatives, unconstrained`,
    engineMs: round(engine.ms),
    baselineMs: baselineMs === null ? null : round(baselineMs),
    ratio: baselineMs === null ? null : round(baselineMs / engine.ms),
    ...(n === 14 ? { target: "< 5000 ms", meetsTarget: engine.ms < 5000 } : {}),
    ...(note ? { note } : {}),
  });
}

// 3. Banks set of seeded random tournaments.
function bruteBanks(g: MajorityGraph): number[] {
  const n = g.alternatives.length;
  const out = new Array<number>(n).fill(0);
  const into = new Array<number>(n).fill(0);
  for (let x = 0; x < n; x++) for (let y = 0; y < n; y++) if (g.beats[x][y]) {
      out[x] |= 1 << y;
      into[y] |= 1 << x;
    }
  const tops = new Set<number>();
  for (let mask = 1; mask < 1 << n; mask++) {
    // A transitive chain: its members' out-degrees within it are 0..k−1.
    const seen = new Set<number>();
    let top = -1;
    let k = 0;
    for (let m = mask; m; m &= m - 1) k++;
    let ok = true;
    for (let m = mask; m && ok; m &= m - 1) {
      const x = 31 - Math.clz32(m & -m);
      let d = 0;
      for (let w = out[x] & mask; w; w &= w - 1) d++;
      if (seen.has(d)) ok = false;
      seen.add(d);
      if (d === k - 1) top = x;
    }
    if (!ok) continue;
    let maximal = true;
    for (let z = 0; z < n && maximal; z++) if (!(mask & (1 << z)) && (mask & ~out[z]) === 0) maximal = false;
    if (maximal) tops.add(top);
  }
  return [...tops].sort((a, b) => a - b);
}
for (const n of want("banks") ? [10, 12, 14, 16] : []) {
  const g = randomTournament(n, 1985 + n);
  const engine = time(() => banksSet(g), 5);
  const base = once(() => bruteBanks(g));
  if (JSON.stringify(engine.result.members) !== JSON.stringify(base.result) || !engine.result.complete) throw new Error(`Banks set disagrees with brute force at n=${n}`);
  rows.push({ task: "Banks set", size: `${n}-alternative random tournament (|BA| = ${engine.result.members.length})`, engineMs: round(engine.ms), baselineMs: round(base.ms), ratio: round(base.ms / engine.ms), ...(n === 16 ? { target: "< 2000 ms", meetsTarget: engine.ms < 2000 } : {}) });
}

// 4. Amendment trees: exact counts over every legal question order, and one page of legal orders.
const HOUSE: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last", "primary-contiguous"];
const HOUSE_F5: OrderConstraint[] = [...HOUSE, "perfecting-after-rejected-substitute"];
const OLD_DEFAULT: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last"];
type TreeAmendment = { id: string; target: string; form: string; lines?: [number, number] };
/**
 * A fictional bill with `sections` sections and a tree mixing every shape: first-degree amendments to
 * sections, second-degree amendments, a House substitute for an amendment with its own amendment, and a
 * substitute for the whole bill with an amendment; `size` amendments in all.
 */
function benchTree(size: number, wide = false): { measure: { id: string; sections: Array<{ id: string }> }; amendments: TreeAmendment[] } {
  const a: TreeAmendment[] = [
    { id: "A1", target: "s1", form: "strike-and-insert", lines: [1, 2] },
    { id: "A1x", target: "A1", form: "insert" },
    { id: "S1", target: "A1", form: "substitute" },
    { id: "S1x", target: "S1", form: "strike" },
    { id: "T", target: "B", form: "substitute" },
    { id: "Tx", target: "T", form: "insert" },
  ];
  // Wide: no substitute for the bill, only independent first-degree amendments after the House tree (most orders).
  if (wide) a.splice(4, 2);
  for (let i = 2; a.length < size; i++) {
    a.push({ id: `A${i}`, target: `s${i}`, form: "insert", lines: [3, 3] });
    if (!wide && i % 3 === 0 && a.length < size) a.push({ id: `A${i}x`, target: `A${i}`, form: "strike" });
  }
  const sections = Math.max(...a.filter((x) => x.target.startsWith("s")).map((x) => Number(x.target.slice(1))));
  return { measure: { id: "B", sections: Array.from({ length: sections }, (_, i) => ({ id: `s${i + 1}` })) }, amendments: a };
}
function treeProfile(model: AmendmentTreeModel, seed: number): Profile {
  const rnd = mulberry32(seed);
  const names = model.versions.map((v) => v.id);
  // 101 members, each ranking a random third of the versions (the rest abstain on pairs with them).
  const ballots = Array.from({ length: 101 }, () => ({ ranking: shuffled(names.length, rnd).slice(0, Math.max(2, Math.ceil(names.length / 3))), weight: 1 }));
  return profileFromRankings(names, ballots, "abstain");
}
/**
 * Structured preferences, as the product's spatial estimates give them: 31 members with ideal points in two
 * dimensions; the measure, Q and every amendment's shift drawn at random; a version sits at the measure plus
 * the shifts of its amendments; members rank versions by distance.
 */
function spatialTreeProfile(model: AmendmentTreeModel, seed: number): Profile {
  const rnd = mulberry32(seed);
  const pt = (): [number, number] => [rnd() * 10 - 5, rnd() * 10 - 5];
  const shift = new Map(model.amendments.map((a) => [a.id, pt().map((c) => c / 3) as [number, number]]));
  const measure = pt();
  const q = pt();
  const pos = model.versions.map((v, i) =>
    i === 0 ? q : v.amendments.reduce<[number, number]>((p, id) => [p[0] + shift.get(id)![0], p[1] + shift.get(id)![1]], [measure[0], measure[1]]),
  );
  const ballots = Array.from({ length: 31 }, () => {
    const ideal = pt();
    const d = pos.map((p) => (p[0] - ideal[0]) ** 2 + (p[1] - ideal[1]) ** 2);
    return { ranking: pos.map((_, i) => i).sort((a, b) => d[a] - d[b]), weight: 1 };
  });
  return profileFromRankings(model.versions.map((v) => v.id), ballots, "abstain");
}
if (want("trees")) {
  const cases = [
    ["House + F5", HOUSE_F5, false],
    ["House", HOUSE, false],
    ["House + textual order", [...HOUSE_F5, "textual-order"] as OrderConstraint[], false],
    ["House + F5, wide (House tree + 9 independent amendments), spatial profile", HOUSE_F5, true],
    ["House + F5, wide (House tree + 9 independent amendments)", HOUSE_F5, true],
  ] as const;
  for (const [label, constraints, wide] of cases) {
    const { measure, amendments } = benchTree(13, wide);
    const model = amendmentTreeModel({ measure, amendments });
    const profile = label.includes("spatial") ? spatialTreeProfile(model, 13) : treeProfile(model, 13);
    const g = majorityGraph(profile);
    const prec = questionPrecedence(model, constraints);
    const total = Number(countLegalOrders(prec));
    for (const procedure of ["amendment", "successive"] as const) {
      const qa = questionAgenda(model, g, profile, procedure);
      process.stderr.write(`tree counts: ${label}, ${procedure}…\n`);
      const started = performance.now();
      let engine: { ms: number; cpuMs: number; result: unknown[][] };
      try {
        engine = once(() => [sincereQuestionCounts(qa, prec), sophisticatedQuestionCounts(qa, prec)]);
      } catch (e) {
        if ((e as { code?: string }).code !== "limit-exceeded") throw e;
        const ms = performance.now() - started;
        rows.push({ task: `tree counts, sincere + sophisticated (${procedure})`, size: `14 questions (13 amendments + passage), ${label}`, engineMs: round(ms), baselineMs: null, ratio: null, target: "< 5000 ms", meetsTarget: false, note: `${total} legal orders, ${model.versions.length} versions; stopped with limit-exceeded: ${(e as Error).message}` });
        continue;
      }
      let baselineMs: number | null = null;
      let note: string | undefined = `${total} legal orders, ${model.versions.length} versions`;
      // Enumeration costs tens of ms per order here; run it only on the smaller cases.
      if (total <= 1000) {
        const b = once(() => {
          const s = new Array<number>(model.versions.length).fill(0);
          const o = new Array<number>(model.versions.length).fill(0);
          for (const order of legalOrders(prec)) {
            s[sincereQuestionPath(qa, order).outcome]++;
            o[sophisticatedQuestionOutcome(qa, order)]++;
          }
          return [s, o];
        });
        baselineMs = b.ms;
        if (JSON.stringify(b.result) !== JSON.stringify(engine.result.map((c) => c.map(Number)))) throw new Error(`tree counts disagree with enumeration (${label}, ${procedure})`);
      } else note += "; enumeration not run";
      note += `; engine CPU ${Math.round(engine.cpuMs)} ms`;
      rows.push({ task: `tree counts, sincere + sophisticated (${procedure})`, size: `14 questions (13 amendments + passage), ${label}`, engineMs: round(engine.ms), engineCpuMs: round(engine.cpuMs), baselineMs: baselineMs === null ? null : round(baselineMs), ratio: baselineMs === null ? null : round(baselineMs / engine.ms), target: "< 5000 ms", meetsTarget: engine.ms < 5000, note });
    }
  }
  for (const [label, constraints] of [["House + F5", HOUSE_F5], ["House", HOUSE], ["old default, no contiguity", OLD_DEFAULT]] as const) {
    const { measure, amendments } = benchTree(16);
    const model = amendmentTreeModel({ measure, amendments });
    const setup = once(() => questionPrecedence(model, constraints));
    const prec = setup.result;
    const total = countLegalOrders(prec);
    // A page of 20 from the middle of the ranks, in a fresh run each time (no memo carried over).
    const page = Number(BigInt(total) / 2n / 20n) + 1;
    const engine = time(() => legalOrderPage(questionPrecedence(model, constraints), page, 20), 5);
    // Baseline: skip from the first order to the page by the successor step alone.
    const skipTo = (BigInt(page) - 1n) * 20n;
    let baselineMs: number | null = null;
    let note = `${total} legal orders; page ${page} of size 20`;
    if (skipTo <= 5_000_000n) {
      const b = once(() => {
        const out: number[][] = [];
        let i = 0n;
        for (const o of legalOrders(prec)) {
          if (i++ < skipTo) continue;
          out.push(o);
          if (out.length === 20) break;
        }
        return out;
      });
      baselineMs = b.ms;
      if (JSON.stringify(b.result) !== JSON.stringify(engine.result)) throw new Error(`legal-orders page disagrees with listing from the start (${label})`);
    } else note += "; listing from the start not run";
    rows.push({ task: "legal-orders page", size: `16-amendment tree (17 questions), ${label}`, engineMs: round(engine.ms), baselineMs: baselineMs === null ? null : round(baselineMs), ratio: baselineMs === null ? null : round(baselineMs / engine.ms), target: "< 200 ms", meetsTarget: engine.ms < 200, note });
  }
}

const header = ["task", "size", "engine ms", "baseline ms", "baseline/engine", "target"];
const lines = rows.map((r) => [r.task, r.size, String(r.engineMs), r.baselineMs === null ? "—" : String(r.baselineMs), r.ratio === null ? "—" : `${r.ratio}×`, r.target ? `${r.target} ${r.meetsTarget ? "met" : "MISSED"}` : ""]);
const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i].length)));
const fmt = (l: string[]) => l.map((c, i) => c.padEnd(widths[i])).join("  ");
console.log(fmt(header));
console.log(widths.map((w) => "-".repeat(w)).join("  "));
for (const l of lines) console.log(fmt(l));
for (const r of rows) if (r.note) console.log(`note: ${r.size}: ${r.note}`);

const out = join(dirname(fileURLToPath(import.meta.url)), "results", only ? `voting-${only}.json` : "voting.json");
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, JSON.stringify({ node: process.version, cpu: cpus()[0]?.model ?? "unknown", date: new Date().toISOString(), rows }, null, 2) + "\n");
console.log(`\nwrote ${out}`);
