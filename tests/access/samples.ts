/**
 * The whole demo scenario plus one record of every kind a route can name, all in Harrowmere,
 * made through the routes themselves as an allowed user. Used by the access and bad-input tests.
 */
import { and, asc, eq } from "drizzle-orm";
import { db, sql } from "../../src/lib/server/db.ts";
import { seedDemo } from "../../src/lib/server/seed/index.ts";
import { runFinished } from "../../src/lib/server/analysis/runner.ts";
import { measures, amendments, measureAttachments } from "../../src/lib/db/schema/measures.ts";
import { rulebookAdoptions, rulebookVersions } from "../../src/lib/db/schema/rulebooks.ts";
import { estimates } from "../../src/lib/db/schema/estimates.ts";
import { sittings } from "../../src/lib/db/schema/floor.ts";
import { rulings } from "../../src/lib/db/schema/rulings.ts";
import { distributionLists, outbox } from "../../src/lib/db/schema/mail.ts";
import { legislators } from "../../src/lib/db/schema/chamber.ts";
import { member, user } from "../../src/lib/db/schema/auth.ts";
import { call } from "../support/app.ts";
import { seedChambers, type Seeded } from "../support/fixtures.ts";
import type { Samples } from "./route-inventory.ts";

const route = (p: string) => import(/* @vite-ignore */ `../../src/pages/${p}`);

function ok<T extends { status: number; body: any }>(r: T, what: string): T {
  if (r.status >= 300) throw new Error(`${what}: ${r.status} ${JSON.stringify(r.body)}`);
  return r;
}

export async function seedSamples(): Promise<{ s: Seeded; samples: Samples }> {
  const s = await seedChambers();
  await seedDemo();
  const h = s.chambers.harrowmere;
  const [measure] = await db.select().from(measures).where(eq(measures.chamberId, h)).orderBy(asc(measures.number)).limit(1);
  const [amendment] = await db.select().from(amendments).where(and(eq(amendments.measureId, measure.id), eq(amendments.status, "filed"))).orderBy(asc(amendments.number)).limit(1);
  const [legislator] = await db.select().from(legislators).where(eq(legislators.chamberId, h)).orderBy(asc(legislators.name)).limit(1);
  const [adopted] = await db.select({ id: rulebookVersions.id, document: rulebookVersions.document }).from(rulebookAdoptions).innerJoin(rulebookVersions, eq(rulebookAdoptions.versionId, rulebookVersions.id)).where(eq(rulebookAdoptions.chamberId, h)).limit(1);
  const [estimate] = await db.select().from(estimates).where(and(eq(estimates.chamberId, h), eq(estimates.kind, "ballots"))).limit(1);
  const [sitting] = await db.select().from(sittings).where(eq(sittings.chamberId, h)).limit(1);
  const [issued] = await db.select().from(rulings).where(and(eq(rulings.chamberId, h), eq(rulings.status, "issued"))).limit(1);
  const [list] = await db.select().from(distributionLists).where(and(eq(distributionLists.chamberId, h), eq(distributionLists.name, "Clerks' desk")));
  const [observer] = await db.select({ id: member.id }).from(member).innerJoin(user, eq(member.userId, user.id)).where(and(eq(member.organizationId, h), eq(user.email, "observer@harrowmere.example")));

  const draftAmendment = ok(await call((await route("api/measures/[id]/amendments.ts")).POST, "POST", "/x", { as: s.as.member, params: { id: measure.id }, body: { form: "insert", target: "measure", text: "A draft kept for the access tests.", draft: true } }), "draft amendment").body;
  const fd = new FormData();
  fd.set("number", "ACC 9");
  fd.set("title", "Attachment sample");
  fd.set("file", new Blob(["Section 1. The harbour lamps are lit at dusk.\n"], { type: "text/plain" }), "sample.txt");
  const req = new Request("http://x/", { method: "POST", body: fd });
  const uploaded = ok(await call((await route("api/measures/upload.ts")).POST, "POST", "/x", { as: s.as.clerk, rawBody: await req.arrayBuffer(), headers: { "content-type": req.headers.get("content-type")! } }), "upload").body;
  const tree = ok(await call((await route("api/measures/[id]/tree.ts")).GET, "GET", "/x", { as: s.as.clerk, params: { id: measure.id } }), "tree").body;
  const finding = tree.findings.find((f: { amendmentId?: string; amendment?: string; code: string }) => f.amendmentId ?? f.amendment);
  const node = tree.nodes.find((n: { id?: string; key: string; label?: string }) => n.key === finding.amendment || n.id === finding.amendmentId || n.label === finding.amendment);
  const override = ok(await call((await route("api/measures/[id]/overrides/index.ts")).POST, "POST", "/x", { as: s.as.clerk, params: { id: measure.id }, body: { amendmentId: node.id, code: finding.code, version: node.version, rulingRef: "Access sample ruling" } }), "override").body;
  const v2 = ok(await call((await route("api/rulebooks/index.ts")).POST, "POST", "/x", { as: s.as.clerk, body: { basedOn: adopted.id, note: "second version for the access tests", document: adopted.document } }), "rulebook v2").body;
  const started = ok(await call((await route("api/analysis/runs/index.ts")).POST, "POST", "/x", { as: s.as.clerk, body: { estimateId: estimate.id } }), "run").body;
  await runFinished(started.runId);
  const orders = ok(await call((await route("api/analysis/runs/[id]/orders.ts")).GET, "GET", "/x", { as: s.as.clerk, params: { id: started.runId } }), "orders").body;
  const draftRuling = ok(await call((await route("api/rulings/index.ts")).POST, "POST", "/x", { as: s.as.clerk, body: rulingBody(legislator.id) }), "draft ruling").body;
  const sent = ok(await call((await route("api/circulation/index.ts")).POST, "POST", "/x", { as: s.as.staff, body: { rulingId: issued.id, listId: list.id } }), "circulation").body;
  const [message] = await db.select({ id: outbox.id }).from(outbox).where(eq(outbox.circulationId, sent.id ?? sent.circulation?.id)).limit(1);
  const invitation = ok(await call((await route("api/people/invitations/index.ts")).POST, "POST", "/x", { as: s.as["chief-clerk"], body: { email: "sample-invitee@harrowmere.example", role: "observer" } }), "invitation").body;
  const firstOrder = orders.orders[0];

  return {
    s,
    samples: {
      measure: measure.id,
      amendment: amendment.id,
      draftAmendment: draftAmendment.id,
      attachment: (await db.select({ id: measureAttachments.id }).from(measureAttachments).where(and(eq(measureAttachments.chamberId, h), eq(measureAttachments.filename, "sample.txt"))))[0].id,
      override: override.id,
      run: started.runId,
      runOrder: (firstOrder.questions as string[]).join(","),
      circulation: sent.id ?? sent.circulation?.id,
      list: list.id,
      message: message.id,
      estimate: estimate.id,
      sitting: sitting.id,
      invitation: invitation.id,
      member: observer.id,
      rulebookVersion: adopted.id,
      rulebookVersion2: v2.id,
      draftRuling: draftRuling.id,
      issuedRuling: issued.id,
      legislator: legislator.id,
      template: "general-parliamentary-law",
      rulebookDocument: adopted.document,
      uploadedMeasure: uploaded.id,
    },
  };
}

export function rulingBody(raisedById: string, over: Record<string, unknown> = {}) {
  return {
    raisedById,
    target: { kind: "motion", ref: "previous-question", label: "Previous question on the Lantern Quay Lighting Order" },
    motion: "previous-question",
    question: "Was the previous question carried by the show of hands?",
    decision: "not-sustained",
    reasoning: "The division superseded the show of hands; twenty-six of thirty-nine is two-thirds.",
    citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }],
    sitting: "Second sitting",
    sittingDate: "2026-04-02",
    ...over,
  };
}

/** Every id and address of Harrowmere's records: none may appear in an answer to the other chamber. */
export async function harrowmereMarkers(chamberId: string): Promise<string[]> {
  const rows = await sql.unsafe(
    `SELECT id::text AS v FROM measures WHERE chamber_id = $1
     UNION SELECT a.id::text FROM amendments a JOIN measures m ON m.id = a.measure_id WHERE m.chamber_id = $1
     UNION SELECT id::text FROM rulings WHERE chamber_id = $1
     UNION SELECT id::text FROM estimates WHERE chamber_id = $1
     UNION SELECT id::text FROM rulebook_versions WHERE chamber_id = $1
     UNION SELECT id::text FROM sittings WHERE chamber_id = $1
     UNION SELECT id::text FROM distribution_lists WHERE chamber_id = $1
     UNION SELECT id::text FROM legislators WHERE chamber_id = $1
     UNION SELECT u.email FROM "user" u JOIN member m ON m.user_id = u.id WHERE m.organization_id = $1 AND u.email NOT LIKE '%saltreach%'
     UNION SELECT $1`,
    [chamberId],
  );
  return rows.map((r) => String(r.v));
}
