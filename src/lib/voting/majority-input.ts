/**
 * The majority-graph input shared by the `majority` and `agendas` commands, the API and the pages:
 * alternatives plus exactly one of weighted ballots, edges or margins (DOMAIN §1–2).
 *  - ballots: `{"ranking": ["a", ["b", "c"], "d"], "weight": 2}` — best first; an inner array is a
 *    group ranked equal; weights are positive integers (so every tally is exact);
 *  - edges: `[["winner", "loser"], …]`; pairs not listed are ties;
 *  - margins: `{"x": {"y": n}}` with m(y,x) = −m(x,y) (either or both may be given).
 * `partial` picks the partial-ballot convention; `quota` the threshold (ballots only: edges and
 * margins carry no tallies to apply it to).
 */
import { z } from "zod";
import { GavelError, parseWith, type InputIssue } from "../errors.ts";
import { VOTE_THRESHOLDS } from "../procedure/voting-section.ts";
import { graphFromMargins, majorityGraph, type MajorityGraph } from "./majority-graph.ts";
import { profileFromRankings, type Profile } from "./profile.ts";
import { toThreshold } from "./vote-threshold.ts";

export const MAX_ALTERNATIVES = 256;
export const MAX_BALLOTS = 100_000;

export const alternativeNameSchema = z.string().min(1).max(200);

export const ballotSchema = z.object({
  ranking: z.array(z.union([alternativeNameSchema, z.array(alternativeNameSchema).min(1)])).max(MAX_ALTERNATIVES),
  weight: z.number().int().min(1).max(1_000_000_000).default(1),
  /** The presiding officer's ballot: its preference gives the chair's vote under the rulebook's tie rule (at most one, weight 1). */
  chair: z.boolean().optional(),
});
export type BallotInput = z.input<typeof ballotSchema>;

export const majorityInputSchema = z.object({
  alternatives: z.array(alternativeNameSchema).min(1).max(MAX_ALTERNATIVES),
  ballots: z.array(ballotSchema).max(MAX_BALLOTS).optional(),
  edges: z.array(z.tuple([alternativeNameSchema, alternativeNameSchema])).max(MAX_ALTERNATIVES * MAX_ALTERNATIVES).optional(),
  margins: z.record(alternativeNameSchema, z.record(alternativeNameSchema, z.number())).optional(),
  partial: z.enum(["abstain", "bottom"]).default("abstain"),
  quota: z.enum(VOTE_THRESHOLDS).optional(),
  /** The membership the "…-of-members" quotas count against; absent: the ballots are the whole membership. */
  members: z.number().int().min(1).max(1_000_000_000).optional(),
});
export type MajorityInput = z.input<typeof majorityInputSchema>;

function fail(issues: InputIssue[], what: string): never {
  throw new GavelError("invalid-input", `${what}: ${issues[0].path}: ${issues[0].message}`, { issues });
}

/** Map alternative names to indices, rejecting duplicates. */
export function indexAlternatives(names: readonly string[], path = "alternatives"): Map<string, number> {
  const index = new Map<string, number>();
  names.forEach((a, i) => {
    if (index.has(a)) fail([{ path: `${path}.${i}`, message: `duplicate alternative "${a}"` }], "majority input");
    index.set(a, i);
  });
  return index;
}

/** Rankings over names → rankings over indices, with path-precise errors. */
export function rankingsToIndices(ballots: ReadonlyArray<z.output<typeof ballotSchema>>, index: Map<string, number>, path: string): Array<{ ranking: Array<number | number[]>; weight: number; chair?: boolean }> {
  const chairs = ballots.flatMap((b, i) => (b.chair ? [i] : []));
  if (chairs.length > 1) fail([{ path: `${path}.${chairs[1]}.chair`, message: `only one ballot can be the chair's (ballot ${chairs[0]} already is)` }], "ballots");
  if (chairs.length === 1 && ballots[chairs[0]].weight !== 1) fail([{ path: `${path}.${chairs[0]}.weight`, message: "the chair's ballot has weight 1" }], "ballots");
  return ballots.map((b, i) => {
    const seen = new Set<number>();
    const look = (name: string, p: string): number => {
      const x = index.get(name);
      if (x === undefined) fail([{ path: p, message: `unknown alternative "${name}"` }], "ballots");
      if (seen.has(x)) fail([{ path: p, message: `"${name}" is ranked twice` }], "ballots");
      seen.add(x);
      return x;
    };
    return {
      weight: b.weight,
      ...(b.chair ? { chair: true } : {}),
      ranking: b.ranking.map((e, j) => (typeof e === "string" ? look(e, `${path}.${i}.ranking.${j}`) : e.map((name, k) => look(name, `${path}.${i}.ranking.${j}.${k}`)))),
    };
  });
}

export function parsedMajorityGraph(input: z.output<typeof majorityInputSchema>): { graph: MajorityGraph; profile: Profile | null } {
  const names = input.alternatives;
  const index = indexAlternatives(names);
  const given = (["ballots", "edges", "margins"] as const).filter((k) => input[k] !== undefined);
  if (given.length !== 1) fail([{ path: given[1] ?? "ballots", message: "give exactly one of ballots, edges or margins" }], "majority input");
  const n = names.length;
  if (input.ballots) {
    const profile = profileFromRankings(names, rankingsToIndices(input.ballots, index, "ballots"), input.partial);
    return { graph: majorityGraph(profile, toThreshold(input.quota ?? "majority"), input.members === undefined ? {} : { members: input.members }), profile };
  }
  if (input.quota !== undefined && toThreshold(input.quota) !== "majority") fail([{ path: "quota", message: "a quota needs ballots; edges and margins are read as simple majority" }], "majority input");
  const look = (name: string, path: string): number => {
    const x = index.get(name);
    if (x === undefined) fail([{ path, message: `unknown alternative "${name}"` }], "majority input");
    return x;
  };
  const margins = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const set = Array.from({ length: n }, () => new Array<boolean>(n).fill(false));
  if (input.edges) {
    input.edges.forEach(([w, l], i) => {
      const a = look(w, `edges.${i}.0`);
      const b = look(l, `edges.${i}.1`);
      if (a === b) fail([{ path: `edges.${i}`, message: "an alternative cannot beat itself" }], "edges");
      if (set[b][a]) fail([{ path: `edges.${i}`, message: `"${w}" and "${l}" are each said to beat the other` }], "edges");
      set[a][b] = true;
      margins[a][b] = 1;
      margins[b][a] = -1;
    });
  } else {
    for (const [x, row] of Object.entries(input.margins!)) {
      const a = look(x, `margins.${x}`);
      for (const [y, m] of Object.entries(row)) {
        const b = look(y, `margins.${x}.${y}`);
        if (a === b) {
          if (m !== 0) fail([{ path: `margins.${x}.${y}`, message: "the margin of an alternative over itself must be 0" }], "margins");
          continue;
        }
        if (set[b][a] && margins[b][a] !== -m) fail([{ path: `margins.${x}.${y}`, message: `must be the negative of margins.${y}.${x}` }], "margins");
        set[a][b] = true;
        margins[a][b] = m;
        margins[b][a] = m === 0 ? 0 : -m;
      }
    }
  }
  return { graph: graphFromMargins(names, margins), profile: null };
}

/** Parse raw JSON into a majority graph (and the profile when ballots were given). */
export function majorityFromInput(raw: unknown): { graph: MajorityGraph; profile: Profile | null } {
  return parsedMajorityGraph(parseWith(majorityInputSchema, raw, "majority input"));
}
