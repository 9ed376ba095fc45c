/**
 * Demo measures for Harrowmere (all fictional): HCA 12, the Harbour Lighting and Quayside
 * Safety Ordinance, with a tree of eight amendments chosen so the drawing shows findings
 * (second and third degree, a substitute, one not germane, one filed late, one with too few
 * sponsors, two that change the same lines), and a small second measure. Built with the
 * services the app uses; idempotent (skipped when HCA 12 exists).
 */
import { and, asc, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { amendments, measures } from "../../db/schema/measures.ts";
import { fileAmendment } from "../services/amendments.ts";
import { createMeasure } from "../services/measures.ts";
import { demoActor } from "./actors.ts";

const DAY = 86_400_000;


export async function seedMeasures(now = new Date()): Promise<{ measureId: string } | null> {
  const actor = await demoActor("harrowmere", "clerk");
  if (!actor) return null;
  const [existing] = await db.select({ id: measures.id }).from(measures).where(and(eq(measures.chamberId, actor.chamber.id), eq(measures.number, "HCA 12")));
  if (existing) return { measureId: existing.id };
  // The generated roster repeats some names; sponsors are drawn from distinct names so the demo reads clearly.
  const everyone = await db.select({ id: legislators.id, name: legislators.name }).from(legislators).where(eq(legislators.chamberId, actor.chamber.id)).orderBy(asc(legislators.name), asc(legislators.id));
  const roster = everyone.filter((r, i) => i === 0 || everyone[i - 1].name !== r.name);
  const L = (i: number) => roster[i % roster.length].id;
  const sittingAt = new Date(now.getTime() + 4 * DAY);

  const hca12 = await createMeasure(actor, {
    number: "HCA 12",
    title: "Harbour Lighting and Quayside Safety Ordinance",
    committee: "Harbour and Waterfront Committee",
    status: "on-floor",
    subjects: ["harbour", "lighting", "safety"],
    sponsors: [L(15), L(3)],
    sittingAt: sittingAt.toISOString(),
    sections: [
      { id: "s1", heading: "Short title and purpose", text: "This ordinance may be cited as the Harbour Lighting and Quayside Safety Ordinance.\nIts purpose is to keep the quaysides of Harrowmere lit and safe after dark.", subjects: ["harbour", "lighting"], status: "open" },
      { id: "s2", heading: "Quayside lamp standards", text: "Every public quay shall be lit from dusk to dawn.\nLamps shall stand no more than twenty metres apart.\nEach lamp shall give a warm white light of at least 3000 lumens.\nLamps within five metres of the water's edge shall be shielded from the sea.", subjects: ["lighting", "quayside", "safety"], status: "open" },
      { id: "s3", heading: "Inspection and maintenance", text: "The Harbour Master shall inspect every lamp each month.\nA failed lamp shall be repaired within seventy-two hours.\nInspection records shall be open to the public.", subjects: ["maintenance", "safety", "lighting"], status: "open" },
      { id: "s4", heading: "Mooring-line hazards", text: "Mooring lines crossing a public walkway shall be marked with reflective sleeves.\nThe Harbour Master may close a walkway where lines cannot be marked.", subjects: ["quayside", "mooring", "safety"], status: "open" },
      { id: "s5", heading: "Funding from harbour dues", text: "The cost of this ordinance shall be met from harbour dues.\nNo new levy is imposed by this ordinance.", subjects: ["harbour dues", "finance"], status: "open" },
      { id: "s6", heading: "Commencement", text: "This ordinance comes into force on the first day of the month after its adoption.", subjects: ["commencement"], status: "open" },
    ],
  });

  const file = (input: Parameters<typeof fileAmendment>[2]) => fileAmendment(actor, hca12.id, input);
  const base = { title: null, committee: null, draft: false, lines: null } as const;
  const a1 = await file({ ...base, form: "strike-and-insert", target: "s2", lines: [2, 3], title: "Closer lamp spacing", text: "Lamps shall stand no more than fifteen metres apart and give at least 3500 lumens.", subjects: ["lighting"], sponsors: [L(16), L(17)] });
  await file({ ...base, form: "insert", target: a1.id, title: "Amber light near nesting sites", text: "Within the Lantern Quay nesting zone lamps shall give amber light.", subjects: ["lighting"], sponsors: [L(18), L(19)] });
  await file({ ...base, form: "substitute", target: "measure", title: "Quayside Safety (Substitute) Ordinance", text: "A shorter ordinance requiring lit quays, monthly inspection and marked mooring lines.", subjects: ["harbour", "lighting", "safety"], sponsors: [L(1), L(4), L(6)] });
  await file({ ...base, form: "insert", target: "s4", title: "Herring quota for the inner harbour", text: "No vessel shall land more than two tonnes of herring a week at the inner harbour.", subjects: ["fisheries", "quotas"], sponsors: [L(27), L(28)] });
  const late = await file({ ...base, form: "strike", target: "s3", lines: [3, 3], title: "Strike public inspection records", text: "", subjects: ["maintenance"], sponsors: [L(2), L(5)] });
  await file({ ...base, form: "insert", target: "s5", title: "Ring-fence harbour dues", text: "Harbour dues raised under this ordinance shall be kept in a separate account.", subjects: ["finance"], sponsors: [L(36)] });
  await file({ ...base, form: "strike-and-insert", target: "s2", lines: [3, 4], title: "Shielded lamps throughout", text: "Every lamp shall be shielded from the sea and give at least 3000 lumens.", subjects: ["lighting", "safety"], sponsors: [L(29), L(30)] });
  const a2 = await db.select({ id: amendments.id }).from(amendments).where(and(eq(amendments.measureId, hca12.id), eq(amendments.number, 2)));
  await file({ ...base, form: "insert", target: a2[0].id, title: "Amber lamps to be dimmable", text: "Amber lamps shall be dimmable between midnight and dawn.", subjects: ["lighting"], sponsors: [L(20), L(21)] });

  // The story needs filing times spread over the week: most filed days ago, A5 the day before the sitting.
  const all = await db.select({ id: amendments.id, number: amendments.number }).from(amendments).where(eq(amendments.measureId, hca12.id));
  for (const a of all) {
    const filedAt = a.id === late.id ? new Date(sittingAt.getTime() - DAY) : new Date(now.getTime() - (9 - (a.number ?? 0)) * 3_600_000 - 2 * DAY);
    await db.update(amendments).set({ filedAt }).where(eq(amendments.id, a.id));
  }

  const hca13 = await createMeasure(actor, {
    number: "HCA 13",
    title: "Lantern Quay Bench Replacement Resolution",
    committee: "Parks and Public Spaces Committee",
    status: "in-committee",
    subjects: ["parks", "seating"],
    sponsors: [L(8), L(22)],
    sittingAt: null,
    text: "## Section 1 — Benches\nSubjects: seating, parks\nThe twelve benches on Lantern Quay shall be replaced with oak benches.\n\n## Section 2 — Plaques\nSubjects: parks, memorials\nExisting memorial plaques shall be moved to the new benches.",
  });
  await fileAmendment(actor, hca13.id, { ...base, form: "strike-and-insert", target: "s1", lines: [1, 1], title: "Larch instead of oak", text: "The twelve benches on Lantern Quay shall be replaced with larch benches.", subjects: ["seating"], sponsors: [L(9), L(23)] });
  return { measureId: hca12.id };
}
