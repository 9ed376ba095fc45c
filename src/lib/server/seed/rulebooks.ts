/**
 * Demo rulebook and floor: Harrowmere's own rulebook (rulebooks/demo-chamber.json) saved as
 * version 1 and adopted, and one open sitting with a main motion pending. Idempotent; built
 * with the same service functions the pages use.
 */
import { and, eq } from "drizzle-orm";
import { db } from "../db.ts";
import { rulebookVersions } from "../../db/schema/rulebooks.ts";
import { sittings } from "../../db/schema/floor.ts";
import { rulebookTemplate } from "../rulebook-templates.ts";
import { adoptVersion, rulebookInForce, saveVersion } from "../services/rulebooks.ts";
import { openSitting, recordEvent } from "../services/floor.ts";
import { demoActor } from "./actors.ts";

export const DEMO_SITTING_TITLE = "Sitting of 3 December";
export const DEMO_MAIN_MOTION = "That the Assembly approve the Moorland Footpaths Ordinance as reported by the Lanes and Commons Committee";


export async function seedRulebooks(): Promise<void> {
  const actor = await demoActor("harrowmere", "chief-clerk");
  if (!actor) throw new Error("seed: no chief clerk for harrowmere");
  const [existing] = await db.select({ id: rulebookVersions.id }).from(rulebookVersions).where(eq(rulebookVersions.chamberId, actor.chamber.id)).limit(1);
  if (!existing) {
    const t = await rulebookTemplate("demo-chamber");
    const v = await saveVersion(actor, { basedOn: null, note: "Standing orders as agreed at the organisational sitting.", template: t.id, document: t.document });
    await adoptVersion(actor, v.id, { effectiveFrom: "2025-09-01", note: "Adopted by resolution at the organisational sitting." });
  } else if (!(await rulebookInForce(actor.chamber.id))) {
    return;
  }
  const [sitting] = await db.select({ id: sittings.id }).from(sittings).where(and(eq(sittings.chamberId, actor.chamber.id), eq(sittings.title, DEMO_SITTING_TITLE))).limit(1);
  if (sitting) return;
  const s = await openSitting(actor, { title: DEMO_SITTING_TITLE });
  let revision = s.revision;
  const record = async (event: Parameters<typeof recordEvent>[2]["event"]) => {
    revision = (await recordEvent(actor, s.id, { revision, event })).revision;
  };
  await record({ kind: "made", motion: "main", text: DEMO_MAIN_MOTION, mover: "Dunstan Brackley", ref: "", overrule: false });
  await record({ kind: "seconded" });
  await record({ kind: "stated" });
}
