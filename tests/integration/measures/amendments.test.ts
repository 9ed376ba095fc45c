// Amendments and trees through the API: filing (numbers, receipts), drafts, edits with versions,
// the validated tree with overrides, and chamber isolation. Product contract (common practice,
// no source) unless a test names a rule.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { deliverOutbox } from "../../../src/lib/server/mail.ts";
import { outbox } from "../../../src/lib/db/schema/mail.ts";
import { amendments } from "../../../src/lib/db/schema/measures.ts";
import { legislators } from "../../../src/lib/db/schema/chamber.ts";
import { startMailCatcher, type CaughtMessage, type MailCatcher } from "../../../src/lib/server/dev/mail-catcher.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import * as measuresRoute from "../../../src/pages/api/measures/index.ts";
import * as filing from "../../../src/pages/api/measures/[id]/amendments.ts";
import * as treeRoute from "../../../src/pages/api/measures/[id]/tree.ts";
import * as overrides from "../../../src/pages/api/measures/[id]/overrides/index.ts";
import * as overrideOne from "../../../src/pages/api/measures/[id]/overrides/[oid].ts";
import * as auditRoute from "../../../src/pages/api/measures/[id]/audit.ts";
import * as amendment from "../../../src/pages/api/amendments/[id]/index.ts";
import * as fileDraft from "../../../src/pages/api/amendments/[id]/file.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { legislatorIds, multipart, multipartBody, pdfBytes } from "./helpers.ts";

let s: Seeded;
let L: string[];
let catcher: MailCatcher;
const inbox: CaughtMessage[] = [];
const ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;

async function newMeasure(number: string, extra: Record<string, unknown> = {}) {
  const r = await call(measuresRoute.POST, "POST", "/api/measures", { as: s.as.clerk, body: { number, title: `Measure ${number}`, subjects: ["harbour"], text: "## Section 1\nSubjects: lighting\nOne.\nTwo.\nThree.\n## Section 2\nSubjects: finance\nFour.", ...extra } });
  expect(r.status).toBe(201);
  return r.body as { id: string; version: number };
}

function file(measureId: string, body: Record<string, unknown>, as = s.as.member) {
  return call(filing.POST, "POST", `/api/measures/${measureId}/amendments`, { as, params: { id: measureId }, body: { form: "insert", target: "s1", sponsors: [L[0], L[1]], subjects: ["lighting"], text: "Add a line.", ...body } });
}

beforeAll(async () => {
  catcher = await startMailCatcher({ port: Number(process.env.SMTP_PORT), onMessage: (m) => void inbox.push(m) });
  s = await seedChambers();
  L = await legislatorIds(s.chambers.harrowmere);
});
afterAll(async () => {
  await catcher.close();
});

describe("filing amendments", () => {
  it("lets chief clerk, clerk and member file; refuses the other chamber (404), changing nothing (other roles and anonymous: tests/access)", async () => {
    const m = await newMeasure("HCA 100");
    for (const role of ["chief-clerk", "clerk", "member"] as const) expect((await file(m.id, {}, s.as[role])).status, role).toBe(201);
    const before = await tableCounts();
    expect((await file(m.id, {}, s.outsider)).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
    for (const role of ROLES) expect((await call(filing.GET, "GET", "/x", { as: s.as[role], params: { id: m.id } })).body.amendments.map((a: { key: string }) => a.key), role).toEqual(["A1", "A2", "A3"]);
    expect((await call(filing.GET, "GET", "/x", { as: s.outsider, params: { id: m.id } })).status).toBe(404);
  });

  it("rejects bad filings with path-precise issues and writes nothing", async () => {
    const m = await newMeasure("HCA 101");
    const before = await tableCounts();
    const bad = await file(m.id, { form: "rewrite", target: "", sponsors: ["x"] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["form", "sponsors.0", "target"]);
    expect((await file(m.id, { target: "s9" })).body.error.issues[0].path).toBe("target");
    expect((await file(m.id, { target: "A77" })).status).toBe(422);
    expect((await file(m.id, { target: "measure", lines: [1, 2] })).body.error.issues[0].path).toBe("lines");
    expect((await file(m.id, { target: "s1", lines: [2, 9] })).body.error.issues[0].path).toBe("lines");
    expect((await file(m.id, { sponsors: ["00000000-0000-4000-8000-000000000000"] })).body.error.issues[0].path).toBe("sponsors.0");
    expect((await file(m.id, { sponsors: [L[0], L[0]] })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("numbers twenty concurrent filings 1..20 with no gaps or repeats", async () => {
    const m = await newMeasure("HCA 102");
    const results = await Promise.all(Array.from({ length: 20 }, (_, i) => file(m.id, { title: `Concurrent ${i}` }, i % 2 ? s.as.member : s.as.clerk)));
    expect(results.map((r) => r.status)).toEqual(Array(20).fill(201));
    expect(results.map((r) => r.body.number).sort((a: number, b: number) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    const failed = await file(m.id, { target: "nowhere" });
    expect(failed.status).toBe(422);
    expect((await file(m.id, {})).body.number).toBe(21);
  });

  it("queues the receipt in the same transaction to each sponsor with an account, the filer in copy; it reads like a clerk's receipt", async () => {
    const m = await newMeasure("HCA 103");
    const [linked] = await db.select({ id: legislators.id }).from(legislators).where(and(eq(legislators.chamberId, s.chambers.harrowmere), eq(legislators.userId, s.as.member.userId)));
    const other = L.find((id) => id !== linked.id)!;
    // The clerk files for the member: the member (a sponsor) gets the receipt, the clerk a copy.
    const r = await file(m.id, { title: "Receipt please", sponsors: [linked.id, other] }, s.as.clerk);
    expect(r.status).toBe(201);
    const queued = await db.select().from(outbox).where(and(eq(outbox.ref, r.body.id), eq(outbox.kind, "amendment-receipt")));
    expect(queued.map((q) => [q.to, q.subject]).sort()).toEqual([
      ["clerk@harrowmere.example", "Filing receipt: Amendment A1 to HCA 103"],
      ["member@harrowmere.example", "Filing receipt: Amendment A1 to HCA 103"],
    ]);
    const before = (await db.select().from(outbox)).length;
    expect((await file(m.id, { target: "s7" })).status).toBe(422);
    expect((await db.select().from(outbox)).length).toBe(before);
    await deliverOutbox(100);
    const mail = inbox.find((x) => x.subject === "Filing receipt: Amendment A1 to HCA 103" && x.to.includes("member@harrowmere.example"));
    expect(mail?.to).toContain("member@harrowmere.example");
    expect(mail?.text).toContain("Amendment A1 to section 1 of HCA 103");
    expect(mail?.text).not.toContain("this copy");
    const copy = inbox.find((x) => x.subject === "Filing receipt: Amendment A1 to HCA 103" && x.to.includes("clerk@harrowmere.example"));
    expect(copy?.text).toContain("You receive this copy because you filed the amendment");
    // No internal id, no ISO 8601 time (the chamber's format instead).
    expect(mail?.text).not.toContain(r.body.id);
    expect(mail?.text).not.toMatch(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
    expect(mail?.text).toMatch(/filed on \d{1,2} [A-Z][a-z]+ \d{4}, \d{2}:\d{2}/);
    // A member who files as a sponsor gets one receipt, no copy.
    const own = await file(m.id, { title: "My own", text: "Another line.", sponsors: [linked.id] });
    expect((await db.select({ to: outbox.to, subject: outbox.subject }).from(outbox).where(eq(outbox.ref, own.body.id)))).toEqual([{ to: "member@harrowmere.example", subject: "Filing receipt: Amendment A2 to HCA 103" }]);
  });

  it("answers a filing with its name in words and the tree check's findings on it", async () => {
    const m = await newMeasure("HCA 109");
    const a1 = await file(m.id, { title: "First" });
    expect(a1.body.name).toBe("Amendment A1 to section 1 of HCA 109");
    expect(a1.body.check.degree).toBe(1);
    const a2 = await file(m.id, { title: "Second", target: "A1", form: "insert" });
    expect(a2.body.name).toBe("Amendment A2 to Amendment A1 to HCA 109");
    expect(a2.body.check.degree).toBe(2);
    const a3 = await file(m.id, { title: "Third", target: "A2", form: "insert" });
    expect(a3.body.check.degree).toBe(3);
    // Beyond the second degree is out of order (Robert's Rules of Order Revised, 1915, §33): an error at once.
    expect(a3.body.check.findings.filter((f: { severity: string }) => f.severity === "error").length).toBeGreaterThan(0);
    const lines = await file(m.id, { title: "Lines", form: "strike", lines: [2, 3], text: "" });
    expect(lines.body.name).toBe("Amendment A4 to section 1, lines 2–3, of HCA 109");
  });

  it("asks before storing a filing identical to one the same person filed within the hour; stores nothing until confirmed", async () => {
    const m = await newMeasure("HCA 190");
    expect((await file(m.id, { title: "Once" })).status).toBe(201);
    const before = await tableCounts();
    const again = await file(m.id, { title: "Once" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("needs-confirmation");
    expect(again.body.error.details).toMatchObject({ reason: "repeated-filing", amendment: "A1" });
    expect(again.body.error.message).toContain("Amendment A1 to section 1 of HCA 190");
    expect(await tableCounts()).toEqual(before);
    // Another person filing the same text is not a repeat; a different text is not either.
    expect((await file(m.id, { title: "Once" }, s.as.clerk)).body.key).toBe("A2");
    expect((await file(m.id, { title: "Once", text: "A different line." })).body.key).toBe("A3");
    // Confirmed, it is stored with the next number (none lost to the refused attempt).
    const confirmed = await file(m.id, { title: "Once", confirm: true });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.key).toBe("A4");
    // A draft is never a repeat; filing it later is, and asks the same question before it takes a number.
    const draft = await file(m.id, { title: "Once", draft: true });
    expect(draft.status).toBe(201);
    const beforeDraft = await tableCounts();
    const asked = await call(fileDraft.POST, "POST", "/x", { as: s.as.member, params: { id: draft.body.id }, body: { version: 1 } });
    expect(asked.status).toBe(409);
    expect(asked.body.error.code).toBe("needs-confirmation");
    expect(asked.body.error.details).toMatchObject({ reason: "repeated-filing", amendment: "A4" });
    expect(await tableCounts()).toEqual(beforeDraft);
    const filedDraft = await call(fileDraft.POST, "POST", "/x", { as: s.as.member, params: { id: draft.body.id }, body: { version: 1, confirm: true } });
    expect(filedDraft.status).toBe(200);
    expect(filedDraft.body.key).toBe("A5");
  });

  it("files from an uploaded document, keeping it and using its text", async () => {
    const m = await newMeasure("HCA 104");
    const body = await multipartBody(multipart({ form: "strike-and-insert", target: "s1", lines: "2-3", sponsors: `${L[2]},${L[3]}`, subjects: "lighting" }, { name: "amendment.pdf", bytes: pdfBytes("Replace lines two and three.") }));
    const r = await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, ...body });
    expect(r.status).toBe(201);
    expect(r.body.text).toContain("Replace lines two and three.");
    expect(r.body.lines).toEqual([2, 3]);
    expect(r.body.attachmentId).toBeTruthy();
    const before = await tableCounts();
    const wrong = await call(filing.POST, "POST", "/x", { as: s.as.member, params: { id: m.id }, ...(await multipartBody(multipart({ form: "insert", target: "s1" }, { name: "a.pdf", bytes: Buffer.from("GIF89a....") }))) });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.issues[0].path).toBe("file");
    expect(await tableCounts()).toEqual(before);
  });

  it("saves a draft without a number or receipt, and files it later with the next number", async () => {
    const m = await newMeasure("HCA 105");
    // On another subject and with no sponsor, so that the tree check has findings on it.
    const d = await file(m.id, { draft: true, subjects: ["fisheries"], sponsors: [] });
    expect(d.body.status).toBe("draft");
    expect(d.body.number).toBeNull();
    // A draft reads as "Draft" wherever a person reads it (list, drawing, findings), never as its internal key.
    expect(d.body.label).toBe("Draft");
    const tree = (await call(treeRoute.GET, "GET", "/x", { as: s.as.member, params: { id: m.id } })).body;
    // The tree is validated under that label: its node, its findings and their messages name it so.
    expect(tree.nodes.find((n: { id: string }) => n.id === d.body.id)).toMatchObject({ key: "Draft", label: "Draft" });
    const onDraft = tree.findings.filter((f: { amendmentId: string }) => f.amendmentId === d.body.id);
    expect(onDraft.length).toBeGreaterThan(0);
    for (const f of onDraft) expect(f).toMatchObject({ amendment: "Draft", message: expect.stringMatching(/^Amendment Draft /) });
    for (const f of tree.findings) expect(f.message).not.toContain(d.body.key);
    // A draft is before no one: an amendment to it is refused until it is filed, and nothing is stored.
    const before = await tableCounts();
    const onIt = await file(m.id, { target: d.body.id, form: "insert", text: "Amending a draft." });
    expect(onIt.status).toBe(422);
    expect(onIt.body.error.issues[0]).toMatchObject({ path: "target", message: expect.stringContaining("still a draft") });
    expect(await tableCounts()).toEqual(before);
    expect(await db.select().from(outbox).where(eq(outbox.ref, d.body.id))).toEqual([]);
    // An override on the draft rests on its row, not its label: a second draft relabels it "Draft-1" and the override holds.
    const finding = onDraft[0];
    const ov = await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: m.id }, body: { amendmentId: d.body.id, code: finding.code, version: d.body.version, rulingRef: "Ruling 9 of the Presiding Officer" } });
    expect(ov.status).toBe(201);
    const second = await file(m.id, { draft: true, subjects: ["fisheries"], sponsors: [], text: "A second draft." });
    expect(second.status).toBe(201);
    const list = (await call(filing.GET, "GET", "/x", { as: s.as.member, params: { id: m.id } })).body.amendments;
    expect(list.map((a: { id: string; label: string }) => [a.id, a.label])).toEqual([[d.body.id, "Draft-1"], [second.body.id, "Draft-2"]]);
    const two = (await call(treeRoute.GET, "GET", "/x", { as: s.as.member, params: { id: m.id } })).body;
    expect(two.nodes.filter((n: { kind: string }) => n.kind === "amendment").map((n: { id: string; key: string }) => [n.id, n.key])).toEqual([[d.body.id, "Draft-1"], [second.body.id, "Draft-2"]]);
    expect(two.findings.find((f: { amendmentId: string; code: string }) => f.amendmentId === d.body.id && f.code === finding.code)).toMatchObject({ amendment: "Draft-1", overridden: true, overrideId: ov.body.id, message: expect.stringMatching(/^Amendment Draft-1 /) });
    expect(two.findings.filter((f: { amendmentId: string }) => f.amendmentId === second.body.id).every((f: { amendment: string; message: string }) => f.amendment === "Draft-2" && !f.message.includes("Draft-1"))).toBe(true);
    await file(m.id, { text: "Another text, filed before the draft." });
    expect((await call(fileDraft.POST, "POST", "/x", { as: s.outsider, params: { id: d.body.id }, body: { version: 1 } })).status).toBe(404);
    const filed = await call(fileDraft.POST, "POST", "/x", { as: s.as.member, params: { id: d.body.id }, body: { version: 1 } });
    expect(filed.status).toBe(200);
    expect(filed.body.key).toBe("A2");
    expect((await db.select().from(outbox).where(eq(outbox.ref, d.body.id))).length).toBe(1);
    expect((await call(fileDraft.POST, "POST", "/x", { as: s.as.member, params: { id: d.body.id }, body: { version: 2 } })).status).toBe(409);
    // Revoking the override names the amendment in the audit as the tree names it now: filed, "A2"; the draft left is "Draft".
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.as.clerk, params: { id: m.id, oid: ov.body.id } })).status).toBe(200);
    const log = (await call(auditRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: m.id } })).body.entries;
    expect(log[0]).toMatchObject({ entity: "override", action: `revoked override of ${finding.code} on A2` });
    const left = (await call(treeRoute.GET, "GET", "/x", { as: s.as.member, params: { id: m.id } })).body.findings.find((f: { amendmentId: string }) => f.amendmentId === second.body.id);
    expect(left.amendment).toBe("Draft");
    const ov2 = await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: m.id }, body: { amendmentId: second.body.id, code: left.code, version: second.body.version, rulingRef: "Ruling 10 of the Presiding Officer" } });
    expect(ov2.status).toBe(201);
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.as.clerk, params: { id: m.id, oid: ov2.body.id } })).status).toBe(200);
    const log2 = (await call(auditRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: m.id } })).body.entries;
    expect(log2[0]).toMatchObject({ entity: "override", action: `revoked override of ${left.code} on Draft` });
  });
});

describe("editing amendments", () => {
  it("lets a clerk change status and the filer edit while filed; refuses others", async () => {
    const m = await newMeasure("HCA 110");
    const a = (await file(m.id, {})).body;
    const params = { id: a.id };
    expect((await call(amendment.GET, "GET", "/x", { as: s.as.observer, params })).body.key).toBe("A1");
    expect((await call(amendment.GET, "GET", "/x", { as: s.outsider, params })).status).toBe(404);
    const before = await tableCounts();
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params, body: { version: 1, status: "adopted" } })).status).toBe(403);
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.outsider, params, body: { version: 1, status: "pending" } })).status).toBe(404);
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params, body: { version: 1, target: a.id } })).status).toBe(422);
    expect(await tableCounts()).toEqual(before);
    const edited = await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params, body: { version: 1, text: "Better words." } });
    expect(edited.status).toBe(200);
    const pending = await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params, body: { version: 2, status: "pending" } });
    expect(pending.body.status).toBe("pending");
    expect((await call(amendment.PATCH, "PATCH", "/x", { as: s.as.member, params, body: { version: 3, status: "withdrawn" } })).status).toBe(403);
  });

  it("answers a stale edit with 409 saying who changed which fields", async () => {
    const m = await newMeasure("HCA 111");
    const a = (await file(m.id, {})).body;
    const params = { id: a.id };
    await call(amendment.PATCH, "PATCH", "/x", { as: s.as.clerk, params, body: { version: 1, text: "Clerk's text", subjects: ["lighting", "safety"] } });
    const before = await tableCounts();
    const stale = await call(amendment.PATCH, "PATCH", "/x", { as: s.as["chief-clerk"], params, body: { version: 1, status: "pending" } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details).toMatchObject({ entity: "amendment", basedOn: 1, current: 2 });
    expect(stale.body.error.details.changes[0]).toMatchObject({ by: "Tamsin Abernethy", fields: ["subjects", "text"] });
    expect(await tableCounts()).toEqual(before);
    const log = await call(auditRoute.GET, "GET", "/x", { as: s.as.member, params: { id: m.id } });
    const entry = log.body.entries.find((e: { action: string }) => e.action === "edited A1");
    expect(entry.before.text).toBe("Add a line.");
    expect(entry.after.text).toBe("Clerk's text");
  });
});

describe("the tree", () => {
  let demo: string;
  beforeAll(async () => {
    demo = (await seedMeasures())!.measureId;
  });

  it("validates the demo tree under the chamber's rulebook and links findings to amendments", async () => {
    for (const role of ROLES) expect((await call(treeRoute.GET, "GET", "/x", { as: s.as[role], params: { id: demo } })).status, role).toBe(200);
    expect((await call(treeRoute.GET, "GET", "/x", { as: s.outsider, params: { id: demo } })).status).toBe(404);
    const t = (await call(treeRoute.GET, "GET", "/x", { as: s.as.member, params: { id: demo } })).body;
    const codes = t.findings.map((f: { amendment: string; code: string }) => `${f.amendment}:${f.code}`);
    // Seeded to show each kind of finding the issue lists (demo-chamber rulebook: maxDegree 2, two sponsors, 48 h deadline).
    for (const c of ["A4:not-germane", "A5:filed-late", "A6:sponsors-missing", "A8:degree-exceeded", "A1:conflicts-with", "A7:conflicts-with"]) expect(codes).toContain(c);
    const rows = await db.select({ id: amendments.id, number: amendments.number }).from(amendments).where(eq(amendments.measureId, demo));
    const a4 = t.findings.find((f: { code: string }) => f.code === "not-germane");
    expect(a4.amendmentId).toBe(rows.find((r) => r.number === 4)!.id);
    expect(t.nodes.find((n: { key: string }) => n.key === "A2").degree).toBe(2);
    expect(t.nodes.find((n: { key: string }) => n.key === "A8").degree).toBe(3);
    // Each amendment also says how it counts and its place (Robert's Rules of Order Revised, 1915, §33 p. 135: an
    // amendment of an amendment is of the second degree; its place is the amendment it amends).
    const a2 = t.nodes.find((n: { key: string }) => n.key === "A2");
    expect(a2).toMatchObject({ role: "amendment-to-amendment", slot: a2.parent });
  });

  it("records an override resting on a ruling, refuses stale or unknown findings, and can revoke it", async () => {
    const t = (await call(treeRoute.GET, "GET", "/x", { as: s.as.clerk, params: { id: demo } })).body;
    const f = t.findings.find((x: { code: string }) => x.code === "not-germane");
    const node = t.nodes.find((n: { key: string }) => n.key === f.amendment);
    const body = { amendmentId: f.amendmentId, code: "not-germane", version: node.version, rulingRef: "Ruling 3 of the Presiding Officer" };
    const before = await tableCounts();
    expect((await call(overrides.POST, "POST", "/x", { as: s.outsider, params: { id: demo }, body })).status).toBe(404);
    expect((await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body: { ...body, code: "cycle" } })).status).toBe(422);
    expect((await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body: { ...body, version: node.version + 5 } })).status).toBe(409);
    expect((await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body: { ...body, rulingRef: "" } })).status).toBe(400);
    expect((await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body: { ...body, rulingId: "00000000-0000-4000-8000-000000000000" } })).status).toBe(422);
    expect(await tableCounts()).toEqual(before);
    const ok = await call(overrides.POST, "POST", "/x", { as: s.as["chief-clerk"], params: { id: demo }, body });
    expect(ok.status).toBe(201);
    expect((await call(overrides.POST, "POST", "/x", { as: s.as.clerk, params: { id: demo }, body })).status).toBe(409);
    const after = (await call(treeRoute.GET, "GET", "/x", { as: s.as.observer, params: { id: demo } })).body;
    const same = after.findings.find((x: { code: string; amendment: string }) => x.code === "not-germane" && x.amendment === f.amendment);
    expect(same).toMatchObject({ overridden: true, ruling: "Ruling 3 of the Presiding Officer", overrideId: ok.body.id });
    expect(after.counts.overridden).toBe(t.counts.overridden + 1);
    const log = (await call(auditRoute.GET, "GET", "/x", { as: s.as.observer, params: { id: demo } })).body.entries;
    expect(log[0]).toMatchObject({ entity: "override", action: `overrode not-germane on ${f.amendment}`, actorName: "Odile Fenwright" });
    const p = { id: demo, oid: ok.body.id };
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.outsider, params: p })).status).toBe(404);
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.as.clerk, params: p })).status).toBe(200);
    expect((await call(overrideOne.DELETE, "DELETE", "/x", { as: s.as.clerk, params: p })).status).toBe(404);
  });

  it("re-running the seed changes nothing", async () => {
    const before = await tableCounts();
    await seedMeasures();
    expect(await tableCounts()).toEqual(before);
  });
});
