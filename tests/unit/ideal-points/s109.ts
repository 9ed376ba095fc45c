// Loads the committed pscl fixtures (tests/fixtures/ideal-points/, made by recompute.R) as ideal-points input.
import { readFileSync } from "node:fs";
import { join } from "node:path";

const dir = join(import.meta.dirname, "../../fixtures/ideal-points");

export interface S109 {
  rollcalls: string[];
  members: Array<{ id: string; party: string; votes: string }>;
}
export interface S109Reference {
  usedRollcalls: string[];
  usedMembers: string[];
  ideal: number[];
  classification: number;
  apre: number;
  votesClassified: number;
}

export const s109 = JSON.parse(readFileSync(join(dir, "s109-votes.json"), "utf8")) as S109;
export const reference = JSON.parse(readFileSync(join(dir, "s109-reference.json"), "utf8")) as S109Reference;

/** Every roll call with its yeas and nays ("." = no vote recorded). */
export function s109Votes() {
  return s109.rollcalls.map((id, j) => ({
    id,
    yea: s109.members.filter((m) => m.votes[j] === "1").map((m) => m.id),
    nay: s109.members.filter((m) => m.votes[j] === "0").map((m) => m.id),
  }));
}

export function pearson(a: readonly number[], b: readonly number[]): number {
  const n = a.length;
  const ma = a.reduce((s, v) => s + v, 0) / n;
  const mb = b.reduce((s, v) => s + v, 0) / n;
  let ab = 0, aa = 0, bb = 0;
  for (let i = 0; i < n; i++) {
    ab += (a[i] - ma) * (b[i] - mb);
    aa += (a[i] - ma) ** 2;
    bb += (b[i] - mb) ** 2;
  }
  return ab / Math.sqrt(aa * bb);
}
