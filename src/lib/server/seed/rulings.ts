/**
 * Demo rulings and distribution lists for Harrowmere (fictional), made with the same service
 * functions the app uses. Idempotent: skipped when the chamber already has rulings / the lists.
 */
import { and, asc, desc, eq, lte } from "drizzle-orm";
import { db } from "../db.ts";
import { member, organization, user } from "../../db/schema/auth.ts";
import { legislators } from "../../db/schema/chamber.ts";
import { measures } from "../../db/schema/measures.ts";
import { rulebookAdoptions, rulebookVersions } from "../../db/schema/rulebooks.ts";
import { rulings } from "../../db/schema/rulings.ts";
import { distributionLists } from "../../db/schema/mail.ts";
import type { Actor } from "../http.ts";
import { rulingContentSchema, type RulingContentInput } from "../../rulings/ruling-content.ts";
import { citableRules, createDraft, issueRuling } from "../services/rulings.ts";
import { createList } from "../services/circulation.ts";
import { DEMO_ACCOUNTS, DEMO_CHAMBERS } from "./demo-data.ts";

async function actorFor(role: "clerk" | "staff"): Promise<Actor | null> {
  const a = DEMO_ACCOUNTS.find((x) => x.chamber === "harrowmere" && x.role === role);
  if (!a) return null;
  const [row] = await db
    .select({ user, chamber: { id: organization.id, name: organization.name, slug: organization.slug, timeZone: organization.timeZone } })
    .from(user)
    .innerJoin(member, eq(member.userId, user.id))
    .innerJoin(organization, eq(member.organizationId, organization.id))
    .where(and(eq(user.email, a.email), eq(organization.slug, DEMO_CHAMBERS.harrowmere.slug)));
  return row ? ({ user: row.user, chamber: row.chamber, role } as Actor) : null;
}

export async function seedRulings(): Promise<void> {
  const clerk = await actorFor("clerk");
  const staff = await actorFor("staff");
  if (!clerk || !staff) return;
  const chamberId = clerk.chamber.id;

  const lists = await db.select({ name: distributionLists.name }).from(distributionLists).where(eq(distributionLists.chamberId, chamberId));
  if (!lists.some((l) => l.name === "Clerks' desk"))
    await createList(staff, { name: "Clerks' desk", description: "The chief clerk and the clerks: rulings and the floor-day digest.", purpose: "clerks", entries: [{ kind: "role", role: "chief-clerk" }, { kind: "role", role: "clerk" }] });
  if (!lists.some((l) => l.name === "Press gallery"))
    await createList(staff, {
      name: "Press gallery",
      description: "Accredited reporters (outside addresses) and the chamber's staff.",
      purpose: null,
      entries: [
        { kind: "address", email: "desk@harrowmere-courier.example.org", name: "Harrowmere Courier" },
        { kind: "address", email: "newsroom@fenland-wire.example.org", name: "Fenland Wire" },
        { kind: "role", role: "staff" },
      ],
    });

  const [any] = await db.select({ id: rulings.id }).from(rulings).where(eq(rulings.chamberId, chamberId)).limit(1);
  if (any) return;
  const roster = await db.select({ id: legislators.id, name: legislators.name }).from(legislators).where(eq(legislators.chamberId, chamberId)).orderBy(asc(legislators.createdAt), asc(legislators.name));
  if (roster.length < 10) return;
  const [measure] = await db.select({ id: measures.id }).from(measures).where(eq(measures.chamberId, chamberId)).orderBy(asc(measures.number)).limit(1);
  const [adopted] = await db
    .select({ id: rulebookVersions.id, document: rulebookVersions.document })
    .from(rulebookAdoptions)
    .innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id))
    .where(and(eq(rulebookAdoptions.chamberId, chamberId), lte(rulebookAdoptions.effectiveFrom, new Date())))
    .orderBy(desc(rulebookAdoptions.effectiveFrom))
    .limit(1);
  const known = new Set(adopted ? citableRules(adopted.document).map((r) => r.ruleId) : []);
  const rule = (ruleId: string, citation: string) => ({ kind: "rule" as const, rulebookVersionId: known.has(ruleId) ? adopted!.id : null, ruleId, citation });

  const demo: RulingContentInput[] = [
    {
      raisedById: roster[4].id,
      target: { kind: "motion", ref: "postpone-indefinitely", label: "Motion to postpone the Harbour Dredging Levy indefinitely" },
      measureId: measure?.id ?? null,
      motion: "postpone-indefinitely",
      question: "Is a motion to postpone indefinitely in order while a primary amendment to the measure is pending?",
      decision: "sustained",
      reasoning:
        "Postponing indefinitely ranks below the motion to amend. While the primary amendment on the levy rate is pending, only motions of higher rank may be made; the motion to postpone indefinitely may be renewed once the amendment is disposed of.\n\nThe chair therefore rules the motion out of order at this stage.",
      citations: [rule("postpone-indefinitely", "RONR (1915) §34"), rule("rank-precedence", "RONR (1915) §§12, 14 and the Order of Precedence of Motions")],
      sitting: "Third sitting of the spring session",
      sittingDate: "2026-03-11",
    },
    {
      raisedById: roster[15].id,
      target: { kind: "amendment", ref: null, label: "Amendment offered to the secondary amendment on the harbour-master's fee schedule" },
      measureId: measure?.id ?? null,
      motion: "amend",
      question: "May a member move to amend the pending secondary amendment?",
      decision: "sustained",
      reasoning:
        "The words offered would amend an amendment of an amendment: a third-degree amendment. The fee schedule may be reached instead by voting down the secondary amendment and offering a new one. The amendment is not received.",
      citations: [rule("amendment-degree", "RONR (1915) §33: an amendment of an amendment of an amendment is not in order")],
      sitting: "Third sitting of the spring session",
      sittingDate: "2026-03-11",
    },
    {
      raisedById: roster[27].id,
      target: { kind: "motion", ref: "previous-question", label: "Previous question on the Moorland Footpaths Order" },
      motion: "previous-question",
      question: "Was the previous question carried when 24 voted in favour and 15 against?",
      decision: "not-sustained",
      reasoning:
        "The previous question needs two-thirds of the votes cast. Twenty-four of thirty-nine is short of two-thirds, but the chair announced the result only after a division in which 26 voted in favour and 13 against, exactly two-thirds. The earlier count was a show of hands, superseded by the division.",
      citations: [rule("previous-question", "RONR (1915) §29"), rule("appeal", "RONR (1915) §21")],
      appeal: { ayes: 19, noes: 19, abstentions: 2, appellant: "The member for Millrace 3" },
      sitting: "Fifth sitting of the spring session",
      sittingDate: "2026-03-25",
    },
  ];
  for (const d of demo) {
    const draft = await createDraft(clerk, rulingContentSchema.parse(d));
    await issueRuling(clerk, draft.id, { version: draft.version, circulateTo: [] });
  }
}
