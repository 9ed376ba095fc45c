// Circulation through the transactional outbox: distribution lists, sending a ruling, what the
// fake SMTP server receives, SMTP outages (queued, then delivered exactly once), abandoned
// sends, unsubscribes, the floor-day digest, and every route's role / anonymous /
// other-chamber checks. Product contract (common practice, no source) unless named.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { eq, sql as dsql } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { deliverOutbox, enqueueMail } from "../../../src/lib/server/mail.ts";
import { outbox, caughtMail, distributionLists } from "../../../src/lib/db/schema/mail.ts";
import { rulings } from "../../../src/lib/db/schema/rulings.ts";
import { startMailCatcher, type CaughtMessage, type MailCatcher } from "../../../src/lib/server/dev/mail-catcher.ts";
import { DEMO_ACCOUNTS } from "../../../src/lib/server/seed/demo-data.ts";
import * as rulingIndex from "../../../src/pages/api/rulings/index.ts";
import * as rulingOne from "../../../src/pages/api/rulings/[id].ts";
import * as issue from "../../../src/pages/api/rulings/[id]/issue.ts";
import * as lists from "../../../src/pages/api/circulation/lists/index.ts";
import * as listOne from "../../../src/pages/api/circulation/lists/[id].ts";
import * as send from "../../../src/pages/api/circulation/index.ts";
import * as circulationOne from "../../../src/pages/api/circulation/[id].ts";
import * as retry from "../../../src/pages/api/circulation/messages/[id]/retry.ts";
import * as digest from "../../../src/pages/api/circulation/digest.ts";
import * as unsubscribe from "../../../src/pages/api/circulation/unsubscribe.ts";
import * as devMail from "../../../src/pages/api/dev/mail.ts";
import { call, type Session } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { harrowmereLegislators, rulingBody } from "../rulings/helpers.ts";

const PORT = Number(process.env.SMTP_PORT);
let catcher: MailCatcher | null = null;
const inbox: CaughtMessage[] = [];
let s: Seeded;
let raiserId: string;

async function openCatcher() {
  catcher = await startMailCatcher({ port: PORT, onMessage: (m) => void inbox.push(m) });
}
async function closeCatcher() {
  await catcher?.close();
  catcher = null;
}
const emailOf = (role: string) => DEMO_ACCOUNTS.find((a) => a.chamber === "harrowmere" && a.role === role)!.email;
const addresses = (ms: CaughtMessage[]) => ms.map((m) => /<([^>]+)>/.exec(m.to)?.[1] ?? m.to).sort();

/** Deliver until nothing is due (a few rounds; each stops at the first transient failure). */
async function drain() {
  for (let i = 0; i < 10; i++) {
    const r = await deliverOutbox(50);
    if (r.sent === 0 && r.failed === 0) return;
  }
}

async function issuedRuling(over: Record<string, unknown> = {}) {
  const d = await call(rulingIndex.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiserId, over) });
  expect(d.status).toBe(201);
  const r = await call(issue.POST, "POST", `/api/rulings/${d.body.id}/issue`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version } });
  expect(r.status).toBe(200);
  return r.body.ruling as { id: string; number: number; version: number };
}

async function makeList(as: Session, body: Record<string, unknown>) {
  const r = await call(lists.POST, "POST", "/api/circulation/lists", { as, body });
  expect(r.status).toBe(201);
  return r.body as { id: string; version: number; name: string };
}

beforeAll(async () => {
  await openCatcher();
  s = await seedChambers();
  [{ id: raiserId }] = await harrowmereLegislators(s.chambers.harrowmere);
});
afterAll(async () => {
  await closeCatcher();
});
beforeEach(async () => {
  if (!catcher) await openCatcher();
  await drain();
  inbox.length = 0;
});

describe("distribution lists", () => {
  it("validates entries path by path and writes nothing on bad input", async () => {
    const before = await tableCounts();
    const bad = await call(lists.POST, "POST", "/api/circulation/lists", { as: s.as.staff, body: { name: "", entries: [{ kind: "address", email: "not-mail" }, { kind: "role", role: "speaker" }] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["entries.0.email", "entries.1.role", "name"]);
    const stranger = await call(lists.POST, "POST", "/api/circulation/lists", { as: s.as.staff, body: { name: "Odd", entries: [{ kind: "user", userId: s.outsider.userId }] } });
    expect(stranger.status).toBe(422);
    expect(stranger.body.error.issues[0].path).toBe("entries.0.userId");
    expect(await tableCounts()).toEqual(before);
  });

  it("lets staff and clerks keep lists; the other chamber gets 404 (roles and anonymous: tests/access)", async () => {
    const l = await makeList(s.as.staff, { name: "Whips", entries: [{ kind: "role", role: "member" }, { kind: "user", userId: s.as.observer.userId }] });
    const dup = await call(lists.POST, "POST", "/api/circulation/lists", { as: s.as.clerk, body: { name: "Whips" } });
    expect(dup.status).toBe(409);
    const p = { id: l.id };
    const got = await call(listOne.GET, "GET", `/api/circulation/lists/${l.id}`, { as: s.as.clerk, params: p });
    expect(got.body.recipients.map((r: { email: string }) => r.email).sort()).toEqual([emailOf("member"), emailOf("observer")].sort());
    const upd = await call(listOne.PUT, "PUT", `/api/circulation/lists/${l.id}`, { as: s.as["chief-clerk"], params: p, body: { version: l.version, name: "Whips' office", entries: [] } });
    expect(upd.status).toBe(200);
    expect((await call(listOne.PUT, "PUT", `/api/circulation/lists/${l.id}`, { as: s.as.staff, params: p, body: { version: l.version, name: "Stale", entries: [] } })).status).toBe(409);
    expect((await call(listOne.GET, "GET", `/api/circulation/lists/${l.id}`, { as: s.outsider, params: p })).status).toBe(404);
    expect((await call(listOne.PUT, "PUT", `/api/circulation/lists/${l.id}`, { as: s.outsider, params: p, body: { version: 2, name: "Mine", entries: [] } })).status).toBe(404);
    expect((await call(listOne.DELETE, "DELETE", `/api/circulation/lists/${l.id}`, { as: s.outsider, params: p })).status).toBe(404);
    expect((await call(lists.GET, "GET", "/api/circulation/lists", { as: s.outsider })).body.lists).toEqual([]);
    expect((await call(listOne.DELETE, "DELETE", `/api/circulation/lists/${l.id}`, { as: s.as.staff, params: p })).status).toBe(200);
    expect((await call(listOne.GET, "GET", `/api/circulation/lists/${l.id}`, { as: s.as.staff, params: p })).status).toBe(404);
  });
});

describe("sending a ruling", () => {
  let clerksDesk: { id: string };
  let press: { id: string };
  beforeAll(async () => {
    clerksDesk = await makeList(s.as.clerk, { name: "Clerks' desk", purpose: "clerks", entries: [{ kind: "role", role: "chief-clerk" }, { kind: "role", role: "clerk" }] });
    press = await makeList(s.as.staff, { name: "Press gallery", entries: [{ kind: "address", email: "desk@courier.example.org", name: "Courier" }, { kind: "address", email: "wire@fenland.example.org" }, { kind: "role", role: "staff" }] });
  });

  it("staff and clerks send; the other chamber gets 404; drafts are not sent (roles and anonymous: tests/access)", async () => {
    const r = await issuedRuling();
    const before = await tableCounts();
    expect((await call(send.POST, "POST", "/api/circulation", { as: s.outsider, body: { rulingId: r.id, listId: press.id } })).status).toBe(404);
    const draft = await call(rulingIndex.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiserId) });
    const afterDraft = await tableCounts();
    expect((await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: draft.body.id, listId: press.id } })).status).toBe(409);
    expect((await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: "9d3a3a52-58f3-4c1e-9a53-3f2b2c3c8d11" } })).status).toBe(404);
    expect(await tableCounts()).toEqual(afterDraft);
    expect(afterDraft.rulings).toBe(before.rulings + 1);
    for (const role of ["staff", "clerk", "chief-clerk"] as const) {
      const other = await issuedRuling();
      expect((await call(send.POST, "POST", "/api/circulation", { as: s.as[role], body: { rulingId: other.id, listId: clerksDesk.id } })).status, role).toBe(201);
    }
  });

  it("asks before sending a ruling to a list that already received it, queueing nothing until confirmed (common practice, no source)", async () => {
    const r = await issuedRuling();
    expect((await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: press.id } })).status).toBe(201);
    const before = await tableCounts();
    const again = await call(send.POST, "POST", "/api/circulation", { as: s.as.clerk, body: { rulingId: r.id, listId: press.id } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("needs-confirmation");
    expect(again.body.error.details).toMatchObject({ reason: "already-circulated", list: "Press gallery" });
    expect(again.body.error.message).toContain("Press gallery");
    expect(again.body.error.message).not.toMatch(/\d{4}-\d{2}-\d{2}T/);
    expect(again.body.error.message).toMatch(/^Ruling \d+ already went to “Press gallery” on .+ \(sent by .+\)\. Its recipients would get it twice\. Send it again anyway\?$/);
    expect(await tableCounts()).toEqual(before);
    // Another list has not had it: no question.
    expect((await call(send.POST, "POST", "/api/circulation", { as: s.as.clerk, body: { rulingId: r.id, listId: clerksDesk.id } })).status).toBe(201);
    const confirmed = await call(send.POST, "POST", "/api/circulation", { as: s.as.clerk, body: { rulingId: r.id, listId: press.id, confirm: true } });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.queued).toBe(3);
  });

  it("refuses to send to a list whose stored entries are damaged (a logged 500), queueing nothing, never sending to nobody", async () => {
    // Common practice, no source: a stored value that fails its schema is a server fault, not an empty list.
    const r = await issuedRuling();
    const broken = await makeList(s.as.staff, { name: "Damaged list", entries: [{ kind: "role", role: "staff" }] });
    await db.update(distributionLists).set({ entries: dsql`'[{"kind":"role","role":"speaker"}]'::jsonb` }).where(eq(distributionLists.id, broken.id));
    try {
      const before = await tableCounts();
      const res = await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: broken.id } });
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe("internal");
      expect(await tableCounts()).toEqual(before);
      expect((await call(listOne.GET, "GET", `/api/circulation/lists/${broken.id}`, { as: s.as.staff, params: { id: broken.id } })).status).toBe(500);
    } finally {
      await db.delete(distributionLists).where(eq(distributionLists.id, broken.id));
    }
  });

  it("delivers HTML and plain text to exactly the list's recipients, user text escaped", async () => {
    const r = await issuedRuling({ question: 'Is <script>alert("x")</script> & co. in order?', reasoning: "The chair finds the <b>bold</b> words out of order." });
    const sent = await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: press.id } });
    expect(sent.status).toBe(201);
    expect(sent.body.queued).toBe(3);
    await drain();
    const mine = inbox.filter((m) => m.subject.includes(`Ruling ${r.number}`));
    expect(addresses(mine)).toEqual(["desk@courier.example.org", emailOf("staff"), "wire@fenland.example.org"].sort());
    for (const m of mine) {
      expect(m.subject).toContain("Harrowmere County Assembly");
      expect(m.text).toContain('Is <script>alert("x")</script> & co. in order?');
      expect(m.text).toContain("RONR (1915) §29");
      expect(m.html).not.toContain("<script>");
      expect(m.html).toContain("&lt;script&gt;");
      expect(m.html).toContain("&lt;b&gt;bold&lt;/b&gt;");
      expect(m.text).toMatch(/\/unsubscribe\?token=/);
      expect(m.parsed.headerLines.find((h) => h.key === "list-unsubscribe")?.line).toMatch(/unsubscribe\?token=/);
    }
    const status = await call(circulationOne.GET, "GET", `/api/circulation/${sent.body.id}`, { as: s.as.clerk, params: { id: sent.body.id } });
    expect(status.body.messages.map((m: { status: string }) => m.status)).toEqual(["sent", "sent", "sent"]);
    const page = await call(rulingOne.GET, "GET", `/api/rulings/${r.id}`, { as: s.as.staff, params: { id: r.id } });
    expect(page.body.circulations[0].messages).toHaveLength(3);
    const asMember = await call(rulingOne.GET, "GET", `/api/rulings/${r.id}`, { as: s.as.member, params: { id: r.id } });
    expect(asMember.body.circulations).toEqual([]);
    expect((await call(circulationOne.GET, "GET", `/api/circulation/${sent.body.id}`, { as: s.outsider, params: { id: sent.body.id } })).status).toBe(404);
    const recent = await call(send.GET, "GET", "/api/circulation", { as: s.as.staff });
    expect(recent.body.circulations[0]).toMatchObject({ id: sent.body.id, status: { sent: 3 } });
    expect((await call(send.GET, "GET", "/api/circulation", { as: s.outsider })).body.circulations).toEqual([]);
  });

  it("issues and queues together: a bad list leaves the ruling a draft and queues nothing", async () => {
    const d = await call(rulingIndex.POST, "POST", "/api/rulings", { as: s.as.clerk, body: rulingBody(raiserId) });
    const before = await tableCounts();
    const bad = await call(issue.POST, "POST", `/api/rulings/${d.body.id}/issue`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version, circulateTo: [press.id, "9d3a3a52-58f3-4c1e-9a53-3f2b2c3c8d11"] } });
    expect(bad.status).toBe(404);
    expect(await tableCounts()).toEqual(before);
    const [row] = await db.select().from(rulings).where(eq(rulings.id, d.body.id));
    expect(row.status).toBe("draft");
    const ok = await call(issue.POST, "POST", `/api/rulings/${d.body.id}/issue`, { as: s.as.clerk, params: { id: d.body.id }, body: { version: d.body.version, circulateTo: [press.id] } });
    expect(ok.status).toBe(200);
    expect(ok.body.circulations[0].queued).toBe(3);
  });

  it("with SMTP down keeps every message queued, then delivers each exactly once when it is back", async () => {
    await closeCatcher();
    const r = await issuedRuling();
    const sent = await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: press.id } });
    const attempted = Date.now();
    const first = await deliverOutbox(50);
    expect(first.sent).toBe(0);
    expect(first.failed).toBe(1);
    const rows = await db.select().from(outbox).where(eq(outbox.circulationId, sent.body.id));
    expect(rows.map((m) => m.status)).toEqual(["queued", "queued", "queued"]);
    expect(rows.some((m) => m.attempts === 1 && m.lastError)).toBe(true);
    // The failed attempt put its message off by the first back-off step (5 s in src/lib/server/mail.ts), counted from the attempt.
    for (const m of rows.filter((r) => r.attempts === 1)) expect(m.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(attempted + 5000);
    // Backoff: nothing is due yet, so another round sends nothing even with SMTP back.
    await openCatcher();
    const early = await deliverOutbox(50);
    expect(early.sent).toBe(rows.filter((m) => m.attempts === 0).length);
    // Time passes: make everything due, deliver, then try again — nothing more is sent.
    await db.update(outbox).set({ nextAttemptAt: new Date(Date.now() - 1000) }).where(eq(outbox.circulationId, sent.body.id));
    await drain();
    await drain();
    const mine = inbox.filter((m) => m.subject.includes(`Ruling ${r.number}`));
    expect(addresses(mine)).toEqual(["desk@courier.example.org", emailOf("staff"), "wire@fenland.example.org"].sort());
    const ids = mine.map((m) => m.messageId);
    expect(new Set(ids).size).toBe(3);
    const after = await db.select().from(outbox).where(eq(outbox.circulationId, sent.body.id));
    expect(after.map((m) => m.status)).toEqual(["sent", "sent", "sent"]);
    expect(after.map((m) => m.messageId).sort()).toEqual(ids.sort());
  });

  it("never resends blindly after a crash between send and record: the message becomes uncertain until a person requeues it", async () => {
    const r = await issuedRuling();
    const sent = await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r.id, listId: clerksDesk.id } });
    const [victim] = await db.select().from(outbox).where(eq(outbox.circulationId, sent.body.id)).limit(1);
    // Simulate a worker that claimed the message and died: status sending, lease already expired.
    await db.update(outbox).set({ status: "sending", claimToken: "00000000-0000-4000-8000-000000000001", leaseUntil: dsql`now() - interval '1 second'`, attempts: 1 }).where(eq(outbox.id, victim.id));
    const round = await deliverOutbox(50);
    expect(round.uncertain).toBe(1);
    await drain();
    const [u] = await db.select().from(outbox).where(eq(outbox.id, victim.id));
    expect(u.status).toBe("uncertain");
    expect(inbox.filter((m) => m.messageId === victim.messageId)).toHaveLength(0);
    expect((await call(retry.POST, "POST", `/api/circulation/messages/${victim.id}/retry`, { as: s.outsider, params: { id: victim.id } })).status).toBe(404);
    const ok = await call(retry.POST, "POST", `/api/circulation/messages/${victim.id}/retry`, { as: s.as.staff, params: { id: victim.id } });
    expect(ok.status).toBe(200);
    await drain();
    expect(inbox.filter((m) => m.messageId === victim.messageId)).toHaveLength(1);
    const again = await call(retry.POST, "POST", `/api/circulation/messages/${victim.id}/retry`, { as: s.as.staff, params: { id: victim.id } });
    expect(again.status).toBe(409);
  });

  it("honours an unsubscribe link for later sends to that list", async () => {
    const r1 = await issuedRuling();
    await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r1.id, listId: press.id } });
    await drain();
    const mail = inbox.find((m) => m.to.includes("wire@fenland.example.org"))!;
    const token = decodeURIComponent(/unsubscribe\?token=([^\s"&]+)/.exec(mail.text!)![1]);
    const bad = await call(unsubscribe.POST, "POST", "/api/circulation/unsubscribe", { as: null, body: { token: token.slice(0, -3) + "AAA" } });
    expect(bad.status).toBe(400);
    const info = await call(unsubscribe.GET, "GET", "/api/circulation/unsubscribe", { as: null, query: { token } });
    expect(info.body).toMatchObject({ email: "wire@fenland.example.org", listName: "Press gallery", unsubscribed: false });
    const done = await call(unsubscribe.POST, "POST", "/api/circulation/unsubscribe", { as: null, body: { token } });
    expect(done.status).toBe(200);
    expect((await call(unsubscribe.POST, "POST", "/api/circulation/unsubscribe", { as: null, body: { token } })).status).toBe(200);
    inbox.length = 0;
    const r2 = await issuedRuling();
    const second = await call(send.POST, "POST", "/api/circulation", { as: s.as.staff, body: { rulingId: r2.id, listId: press.id } });
    expect(second.body.queued).toBe(2);
    expect(second.body.skipped).toEqual([{ email: "wire@fenland.example.org", reason: "unsubscribed" }]);
    await drain();
    expect(addresses(inbox)).toEqual(["desk@courier.example.org", emailOf("staff")].sort());
    const list = await call(listOne.GET, "GET", `/api/circulation/lists/${press.id}`, { as: s.as.staff, params: { id: press.id } });
    expect(list.body.recipients.find((x: { email: string }) => x.email === "wire@fenland.example.org").unsubscribed).toBe(true);
  });
});

describe("floor-day digest", () => {
  it("goes to the clerks' list with the findings and the proposed order", async () => {
    const body = {
      sitting: "Sixth sitting",
      date: "2026-04-08",
      measure: "HB 7 — Harbour Dredging Levy",
      findings: [{ severity: "error", code: "degree-exceeded", subject: "Amendment 4", message: "A third-degree amendment is out of order <per §33>." }],
      proposedOrder: [{ label: "Amendment 2 to Amendment 1" }, { label: "Amendment 1 as amended" }, { label: "Passage" }],
    };
    const before = await tableCounts();
    const bad = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.clerk, body: { ...body, date: "soon", findings: [{ severity: "fatal", message: "" }] } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(["date", "findings.0.message", "findings.0.severity"]);
    expect(await tableCounts()).toEqual(before);
    const ok = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body });
    expect(ok.status).toBe(201);
    expect(ok.body.listName).toBe("Clerks' desk");
    await drain();
    const got = inbox.filter((m) => m.subject.includes("floor-day digest"));
    expect(addresses(got)).toEqual([emailOf("chief-clerk"), emailOf("clerk")].sort());
    expect(got[0].text).toContain("1. Amendment 2 to Amendment 1");
    expect(got[0].text).toContain("[degree-exceeded] Amendment 4");
    expect(got[0].html).toContain("&lt;per §33&gt;");
    const other = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.outsider, body });
    expect(other.status).toBe(201);
    expect(other.body.listName).toBe("Clerks (chief clerk and clerks)");
    await drain();
    expect(addresses(inbox.filter((m) => m.subject.includes("Saltreach")))).toEqual(["chief.clerk@saltreach.example"]);
  });
});

describe("floor-day digest to a chosen list", () => {
  const body = { sitting: "Seventh sitting", date: "2026-04-15", proposedOrder: [{ label: "Passage" }] };
  const digests = () => inbox.filter((m) => m.subject.includes("floor-day digest"));

  it("refuses another chamber's list, an unknown id or a malformed one with 422 on listId, queueing nothing", async () => {
    const theirs = await makeList(s.outsider, { name: "Saltreach digest readers", entries: [{ kind: "role", role: "chief-clerk" }] });
    const before = await tableCounts();
    // Whether or not the sender confirmed a repeat: the list is checked first, and once.
    for (const listId of [theirs.id, "00000000-0000-4000-8000-000000000000", "not-a-list"])
      for (const confirm of [false, true]) {
        const r = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.clerk, body: { ...body, listId, confirm } });
        expect(r.status, listId).toBe(422);
        expect(r.body.error.code).toBe("unprocessable");
        expect(r.body.error.issues.map((i: { path: string }) => i.path)).toEqual(["listId"]);
      }
    expect(await tableCounts()).toEqual(before);
    await drain();
    expect(digests()).toEqual([]);
  });

  it("goes to exactly the chosen list's recipients; without listId (or null) to the clerks' list as before", async () => {
    const whips = await makeList(s.as.staff, { name: "Digest whips", entries: [{ kind: "role", role: "member" }, { kind: "address", email: "whip@harrowmere.example.org", name: "Whips' office" }] });
    const ok = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body: { ...body, listId: whips.id } });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ listId: whips.id, listName: "Digest whips" });
    await drain();
    const members = DEMO_ACCOUNTS.filter((a) => a.chamber === "harrowmere" && a.role === "member").map((a) => a.email);
    expect(addresses(digests())).toEqual([...members, "whip@harrowmere.example.org"].sort());
    inbox.length = 0;
    const plain = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.clerk, body: { ...body, listId: null } });
    expect(plain.status).toBe(201);
    expect(plain.body.listName).toBe("Clerks' desk");
    await drain();
    expect(addresses(digests())).toEqual([emailOf("chief-clerk"), emailOf("clerk")].sort());
  });

  it("asks before sending the same sitting's digest to a list that already had it; queues nothing until confirmed", async () => {
    const again = { sitting: "Eighth sitting", date: "2026-04-22", proposedOrder: [{ label: "Passage" }] };
    expect((await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.clerk, body: again })).status).toBe(201);
    await drain();
    inbox.length = 0;
    const before = await tableCounts();
    const asked = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body: again });
    expect(asked.status).toBe(409);
    expect(asked.body.error.code).toBe("needs-confirmation");
    expect(asked.body.error.message).toContain("The digest for Eighth sitting already went to “Clerks' desk”");
    // The same question as a ruling's repeat: who sent it, when, and what a second sending means.
    expect(asked.body.error.message).toMatch(/ on .+ \(sent by .+\)\. Its recipients would get it twice\. Send it again anyway\?$/);
    expect(asked.body.error.details).toMatchObject({ reason: "already-circulated", list: "Clerks' desk" });
    expect(await tableCounts()).toEqual(before);
    // Another sitting, or another list, is not a repeat.
    const other = await makeList(s.as.staff, { name: "Digest readers", entries: [{ kind: "role", role: "chief-clerk" }] });
    expect((await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body: { ...again, listId: other.id } })).status).toBe(201);
    expect((await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body: { ...again, sitting: "Ninth sitting" } })).status).toBe(201);
    // Confirmed, it goes again.
    const confirmed = await call(digest.POST, "POST", "/api/circulation/digest", { as: s.as.staff, body: { ...again, confirm: true } });
    expect(confirmed.status).toBe(201);
    expect(confirmed.body.listName).toBe("Clerks' desk");
  });
});

describe("caught mail (development view)", () => {
  /** Queue a message as `enqueueMail` does and record it as the catcher would, with the same Message-ID. */
  async function caught(mail: { to: string; subject: string; chamberId?: string }) {
    const id = await enqueueMail({ kind: "test", text: "Hi", ...mail });
    const [row] = await db.select({ messageId: outbox.messageId }).from(outbox).where(eq(outbox.id, id));
    await db.insert(caughtMail).values({ messageId: row.messageId, from: "no-reply@gavelwright.invalid", to: mail.to, subject: mail.subject, text: "Hi" });
    await db.update(outbox).set({ status: "sent", sentAt: new Date() }).where(eq(outbox.id, id));
  }
  const subjectsFor = async (as: Session) => {
    const r = await call(devMail.GET, "GET", "/api/dev/mail", { as });
    expect(r.status).toBe(200);
    return (r.body.messages as Array<{ subject: string }>).map((m) => m.subject).filter((x) => x.startsWith("Scope ")).sort();
  };

  it("is for the chief clerk only, and only with the development mailbox on", async () => {
    await caught({ to: emailOf("member"), subject: "Scope hello" });
    const prev = process.env.GAVELWRIGHT_DEV_MAILBOX;
    try {
      delete process.env.GAVELWRIGHT_DEV_MAILBOX;
      expect((await call(devMail.GET, "GET", "/api/dev/mail", { as: s.as["chief-clerk"] })).status).toBe(404);
      process.env.GAVELWRIGHT_DEV_MAILBOX = "1";
      expect(await subjectsFor(s.as["chief-clerk"])).toContain("Scope hello");
      for (const role of ["clerk", "member", "staff", "observer"] as const) expect((await call(devMail.GET, "GET", "/api/dev/mail", { as: s.as[role] })).status, role).toBe(403);
      expect((await call(devMail.GET, "GET", "/api/dev/mail", { as: null })).status).toBe(401);
    } finally {
      if (prev === undefined) delete process.env.GAVELWRIGHT_DEV_MAILBOX;
      else process.env.GAVELWRIGHT_DEV_MAILBOX = prev;
    }
    await db.delete(caughtMail).where(dsql`${caughtMail.subject} LIKE 'Scope %'`);
  });

  it("shows a chief clerk only their own chamber's mail", async () => {
    const harrowmere = s.chambers.harrowmere;
    const saltreach = s.chambers.saltreach;
    await makeList(s.as.staff, { name: "Scope press", entries: [{ kind: "address", email: "scope-desk@courier.example.org", name: "Courier desk" }] });
    // Sent by the chamber (a circulation): its own, whoever it is addressed to.
    await caught({ to: "someone@elsewhere.example.org", subject: "Scope H sent", chamberId: harrowmere });
    // Sent by the other chamber to an address Harrowmere also knows: not Harrowmere's.
    await caught({ to: `"Press" <scope-desk@courier.example.org>`, subject: "Scope S sent to a shared address", chamberId: saltreach });
    await caught({ to: emailOf("clerk"), subject: "Scope S sent to a Harrowmere clerk", chamberId: saltreach });
    // Sent without a chamber (receipts, resets, invitations): by whom it is addressed to.
    await caught({ to: emailOf("member"), subject: "Scope unstamped to a Harrowmere member" });
    await caught({ to: "Scope-Desk@Courier.example.org", subject: "Scope unstamped to a Harrowmere list address" });
    await caught({ to: "chief.clerk@saltreach.example", subject: "Scope unstamped to Saltreach's chief clerk" });
    await caught({ to: "nobody@stranger.example.org", subject: "Scope unstamped to a stranger" });
    // Caught with no outbox row at all (not sent by this app): nobody's.
    await db.insert(caughtMail).values({ messageId: "<foreign@example.org>", from: "a@example.org", to: emailOf("member"), subject: "Scope foreign", text: "Hi" });
    const prev = process.env.GAVELWRIGHT_DEV_MAILBOX;
    try {
      process.env.GAVELWRIGHT_DEV_MAILBOX = "1";
      expect(await subjectsFor(s.as["chief-clerk"])).toEqual(["Scope H sent", "Scope unstamped to a Harrowmere list address", "Scope unstamped to a Harrowmere member"]);
      expect(await subjectsFor(s.outsider)).toEqual(["Scope S sent to a Harrowmere clerk", "Scope S sent to a shared address", "Scope unstamped to Saltreach's chief clerk"]);
    } finally {
      if (prev === undefined) delete process.env.GAVELWRIGHT_DEV_MAILBOX;
      else process.env.GAVELWRIGHT_DEV_MAILBOX = prev;
    }
    await db.delete(caughtMail).where(dsql`${caughtMail.subject} LIKE 'Scope %'`);
  });
});
