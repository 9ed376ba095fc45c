/**
 * Demo estimates for HCA 12 in Harrowmere (fictional): the clerk's projection of how the four blocs
 * rank the versions under amendments A1, A2 and A7 — chosen so the majority cycles over three
 * versions, the order of questions decides the outcome and sophisticated voting differs from sincere
 * voting in some orders — and a two-dimensional spatial estimate of the same amendments. Both shared
 * with the whole chamber. Built with the estimates service; idempotent (skipped when present).
 */
import { and, asc, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { measures } from "../../db/schema/measures.ts";
import { estimates } from "../../db/schema/estimates.ts";
import { CHAMBER_ROLES } from "../../permissions.ts";
import { createEstimate } from "../services/estimates.ts";
import { demoActor } from "./actors.ts";

export const DEMO_BALLOTS_TITLE = "Bloc rankings before the sitting (clerk's projection)";
export const DEMO_SPATIAL_TITLE = "Lighting and cost: where the blocs stand";
export const DEMO_SCOPE = ["A1", "A2", "A7"];

/** Each bloc's ranking, best first (version ids of the engine). */
const BLOC_RANKINGS: Record<string, string[]> = {
  "Moorland Union": ["measure+A1", "measure+A7", "measure+A1+A2", "Q", "measure"],
  "Harbour Progressives": ["measure+A7", "measure+A1+A2", "measure+A1", "measure", "Q"],
  "Civic Reform": ["measure", "measure+A1+A2", "Q", "measure+A1", "measure+A7"],
  Independents: ["measure", "measure+A1+A2", "measure+A7", "Q", "measure+A1"],
};

/** Ideal points: (lighting standard 0–10, spending from harbour dues 0–10). */
const BLOC_IDEALS: Record<string, [number, number]> = {
  "Moorland Union": [2, 3],
  "Harbour Progressives": [8, 7],
  "Civic Reform": [7, 2],
  Independents: [4, 8],
};


export async function seedEstimates(): Promise<{ ballotsId: string; spatialId: string } | null> {
  const actor = await demoActor("harrowmere", "clerk");
  if (!actor) return null;
  const [m] = await db.select({ id: measures.id }).from(measures).where(and(eq(measures.chamberId, actor.chamber.id), eq(measures.number, "HCA 12")));
  if (!m) return null;
  const have = await db.select({ id: estimates.id, title: estimates.title }).from(estimates).where(and(eq(estimates.chamberId, actor.chamber.id), eq(estimates.measureId, m.id)));
  const roster = await db.select({ name: legislators.name, bloc: legislators.bloc }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id)).orderBy(asc(legislators.createdAt), asc(legislators.name));
  /** The estimate of this title on HCA 12, made (shared with every role) when missing. */
  const ensure = async (title: string, note: string, content: Parameters<typeof createEstimate>[1]["content"]) =>
    have.find((e) => e.title === title)?.id ?? (await createEstimate(actor, { measureId: m.id, title, scope: DEMO_SCOPE, note, content, sharedRoles: [...CHAMBER_ROLES], sharedUsers: [] })).id;
  const ballotsId = await ensure(DEMO_BALLOTS_TITLE, "Each legislator ranked as the bloc whip expects.", {
    kind: "ballots",
    partial: "abstain",
    rows: roster.map((r) => ({ member: r.name, bloc: r.bloc, weight: 1, ranking: BLOC_RANKINGS[r.bloc] ?? ["Q"] })),
  });
  const spatialId = await ensure(DEMO_SPATIAL_TITLE, "Positions on two axes: how strict the lighting standard is, and how much is spent from harbour dues.", {
    kind: "spatial",
    dimensions: ["Lighting standard", "Spending from harbour dues"],
    statusQuo: [3, 5],
    measure: [5, 5],
    effects: { A1: { shift: [2, 1] }, A2: { shift: [0, -2] }, A7: { shift: [0, 2] } },
    members: roster.map((r) => ({ member: r.name, bloc: r.bloc, weight: 1, ideal: BLOC_IDEALS[r.bloc] ?? [5, 5] })),
  });
  return { ballotsId, spatialId };
}
