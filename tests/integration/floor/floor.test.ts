// The live floor and legal moves through the API: sittings, recording events, the board with
// its legal moves, hypothetical questions, roles, anonymous and the other chamber; and the
// LISTEN/NOTIFY fan-out. Legal-moves verdicts come from the demo rulebook's own rules; the
// expectations follow Robert's Rules of Order Revised (1915): with a main motion pending a
// second main motion is out of order (§11) and amend is in order (§33); with a main motion
// and a primary and secondary amendment pending, a third-degree amendment is out of order (§33).
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as moves from "../../../src/pages/api/moves.ts";
import * as sittingsRoute from "../../../src/pages/api/floor/sittings/index.ts";
import * as sittingRoute from "../../../src/pages/api/floor/sittings/[id].ts";
import * as eventsRoute from "../../../src/pages/api/floor/sittings/[id]/events.ts";
import * as streamRoute from "../../../src/pages/api/floor/sittings/[id]/stream.ts";
import { FLOOR_CHANNEL, subscribeFloor, type FloorNotice } from "../../../src/lib/server/floor-bus.ts";
import { DEMO_SITTING_TITLE, seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

const ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;
let s: Seeded;
let sittingId: string;

type Verdict = { motion: string; inOrder: boolean; reasons: Array<{ rule: string; citation: string }>; second: boolean; debatable: boolean; amendable: boolean; vote: string; degree?: number };
const verdict = (list: Verdict[], id: string) => list.find((v) => v.motion === id)!;

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
  const r = await call(sittingsRoute.GET, "GET", "/api/floor/sittings", { as: s.as.member });
  sittingId = r.body.sittings.find((x: { title: string }) => x.title === DEMO_SITTING_TITLE).id;
});

describe("POST /api/moves", () => {
  it("answers every role from the rulebook in force, with reasons, citations and characteristics", async () => {
    for (const role of ROLES) {
      const r = await call(moves.POST, "POST", "/api/moves", { as: s.as[role], body: { state: { pending: [{ motion: "main" }] } } });
      expect(r.status, role).toBe(200);
      const main = verdict(r.body.moves, "main");
      expect(main.inOrder).toBe(false);
      expect(main.reasons[0].citation.length).toBeGreaterThan(0);
      expect(verdict(r.body.moves, "amend")).toMatchObject({ inOrder: true, degree: 1 });
      expect(typeof main.second).toBe("boolean");
    }
  });
  it("poses hypothetical states: a third-degree amendment is out of order", async () => {
    const r = await call(moves.POST, "POST", "/api/moves", { as: s.as.observer, body: { state: { pending: [{ motion: "main" }, { motion: "amend", degree: 1 }, { motion: "amend", degree: 2 }] } } });
    expect(r.status).toBe(200);
    expect(verdict(r.body.moves, "amend")).toMatchObject({ inOrder: false, degree: 3 });
  });
  it("refuses bad states with paths, and chambers without a rulebook (roles and anonymous: tests/access)", async () => {
    const bad = await call(moves.POST, "POST", "/api/moves", { as: s.as.member, body: { state: { pending: [{ motion: "filibuster" }] } } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe("pending.0.motion");
    const deg = await call(moves.POST, "POST", "/api/moves", { as: s.as.member, body: { state: { pending: [{ motion: "main" }, { motion: "amend", degree: 2 }] } } });
    expect(deg.status).toBe(400);
    expect((await call(moves.POST, "POST", "/api/moves", { as: s.outsider, body: { state: {} } })).status).toBe(404);
    expect((await call(moves.POST, "POST", "/api/moves", { as: s.as.member, body: { state: {}, version: "00000000-0000-4000-8000-000000000000" } })).status).toBe(404);
  });
});

describe("sittings", () => {
  it("lists the seeded sitting with a main motion pending, to every role", async () => {
    for (const role of ROLES) {
      const r = await call(sittingRoute.GET, "GET", `/api/floor/sittings/${sittingId}`, { as: s.as[role], params: { id: sittingId } });
      expect(r.status, role).toBe(200);
      expect(r.body.board.pending.map((p: { motion: string; stage: string }) => [p.motion, p.stage])).toEqual([["main", "stated"]]);
      expect(verdict(r.body.moves, "main").inOrder).toBe(false);
      expect(r.body.history.length).toBe(3);
    }
    expect((await call(sittingRoute.GET, "GET", `/api/floor/sittings/${sittingId}`, { as: s.outsider, params: { id: sittingId } })).status).toBe(404);
    expect((await call(sittingsRoute.GET, "GET", "/api/floor/sittings", { as: s.outsider })).body.sittings).toEqual([]);
  });
  it("opens sittings with a title; another chamber cannot (roles and anonymous: tests/access)", async () => {
    const before = await tableCounts();
    expect((await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: "" } })).status).toBe(400);
    expect((await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.outsider, body: { title: "Saltreach sitting" } })).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
    const ok = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: "Special sitting" } });
    expect(ok.status).toBe(201);
  });
});

describe("recording the floor", () => {
  const rec = (as: Seeded["as"][keyof Seeded["as"]] | null, revision: number, event: unknown) => call(eventsRoute.POST, "POST", `/api/floor/sittings/${sittingId}/events`, { as, params: { id: sittingId }, body: { revision, event } });
  const board = async () => (await call(sittingRoute.GET, "GET", `/api/floor/sittings/${sittingId}`, { as: s.as.member, params: { id: sittingId } })).body;

  it("refuses the other chamber and a bad event; nothing changes (roles and anonymous: tests/access)", async () => {
    const { sitting } = await board();
    const before = await tableCounts();
    expect((await rec(s.outsider, sitting.revision, { kind: "made", motion: "amend" })).status).toBe(404);
    expect((await rec(s.as.clerk, sitting.revision, { kind: "shouted" })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("records an amendment made, seconded and stated; the legal moves follow the stack", async () => {
    let { sitting } = await board();
    const before = await tableCounts();
    const outOfOrder = await rec(s.as.clerk, sitting.revision, { kind: "made", motion: "main", text: "A second main motion" });
    expect(outOfOrder.status).toBe(422);
    expect(outOfOrder.body.error.details.reasons.length).toBeGreaterThan(0);
    expect(await tableCounts()).toEqual(before);
    const made = await rec(s.as.clerk, sitting.revision, { kind: "made", motion: "amend", text: "Strike out 'footpaths' and insert 'bridleways'", mover: "Cora Colvenor" });
    expect(made.status).toBe(201);
    const early = await rec(s.as.clerk, made.body.revision, { kind: "stated" });
    expect(early.status).toBe(422);
    const sec = await rec(s.as["chief-clerk"], made.body.revision, { kind: "seconded" });
    expect(sec.status).toBe(201);
    const st = await rec(s.as.clerk, sec.body.revision, { kind: "stated" });
    expect(st.status).toBe(201);
    const b = await board();
    expect(b.board.pending.map((p: { motion: string; degree: number | null }) => [p.motion, p.degree])).toEqual([["main", null], ["amend", 1]]);
    expect(verdict(b.moves, "amend")).toMatchObject({ inOrder: true, degree: 2 });
    expect(b.history.at(-1).summary).toMatch(/stated/);
    sitting = b.sitting;
    expect(sitting.revision).toBe(st.body.revision);
  });

  it("refuses a stale revision with what was missed (409)", async () => {
    const { sitting } = await board();
    const before = await tableCounts();
    const stale = await rec(s.as.clerk, sitting.revision - 2, { kind: "voted", result: "adopted" });
    expect(stale.status).toBe(409);
    expect(stale.body.error.details.missed.length).toBe(2);
    expect(await tableCounts()).toEqual(before);
  });

  it("records going into and out of a Committee of the Whole as a floor fact (US House Rule XVIII; issue 14 item 2)", async () => {
    const { sitting } = await board();
    expect((await board()).board.committeeOfTheWhole).toBe(false);
    const into = await rec(s.as.clerk, sitting.revision, { kind: "floor", committeeOfTheWhole: true });
    expect(into.status).toBe(201);
    expect(into.body.board.committeeOfTheWhole).toBe(true);
    expect((await board()).history.at(-1).summary).toMatch(/Committee of the Whole/);
    const out = await rec(s.as.clerk, into.body.revision, { kind: "floor", committeeOfTheWhole: false });
    expect(out.body.board.committeeOfTheWhole).toBe(false);
    expect((await rec(s.as.clerk, out.body.revision, { kind: "floor", committeeOfTheWhole: "yes" })).status).toBe(400);
  });

  it("records a vote with its tally, a withdrawal, and closes the sitting; history is kept", async () => {
    const { sitting } = await board();
    const v = await rec(s.as.clerk, sitting.revision, { kind: "voted", result: "adopted", tally: { yes: 22, no: 15, abstain: 3 } });
    expect(v.status).toBe(201);
    expect(v.body.board.pending.map((p: { motion: string }) => p.motion)).toEqual(["main"]);
    expect(v.body.board.lastVote).toMatchObject({ motion: "amend", result: "adopted", tally: { yes: 22, no: 15, abstain: 3 } });
    const key = v.body.board.pending[0].key;
    const w = await rec(s.as.clerk, v.body.revision, { kind: "withdrawn", key });
    expect(w.status).toBe(201);
    expect(w.body.board.pending).toEqual([]);
    const c = await rec(s.as.clerk, w.body.revision, { kind: "close" });
    expect(c.status).toBe(201);
    const after = await rec(s.as.clerk, c.body.revision, { kind: "made", motion: "main" });
    expect(after.status).toBe(409);
    const b = await board();
    expect(b.sitting.status).toBe("closed");
    expect(b.history.map((h: { kind: string }) => h.kind)).toEqual(["made", "seconded", "stated", "made", "seconded", "stated", "floor", "floor", "voted", "withdrawn", "close"]);
  });
});

describe("live updates", () => {
  let listener: postgres.Sql;
  afterAll(async () => {
    await listener?.end();
  });

  it("delivers a change committed through one connection to a LISTEN on another", async () => {
    listener = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
    const got: FloorNotice[] = [];
    let heard!: () => void;
    const arrived = new Promise<void>((resolve) => (heard = resolve));
    // listen() resolves once LISTEN is in place, so the notice below cannot be missed.
    await listener.listen(FLOOR_CHANNEL, (p) => {
      got.push(JSON.parse(p));
      heard();
    });
    const opened = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: "Notify test" } });
    await arrived;
    expect(got[0]).toMatchObject({ sittingId: opened.body.id, kind: "opened" });
  });

  it("sends nothing for a refused change, and relays a recorded one to the in-process subscribers", async () => {
    const opened = await call(sittingsRoute.POST, "POST", "/api/floor/sittings", { as: s.as.clerk, body: { title: "Relay test" } });
    const seen: FloorNotice[] = [];
    const stop = await subscribeFloor((n) => n.sittingId === opened.body.id && seen.push(n));
    const refused = await call(eventsRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: opened.body.id }, body: { revision: 0, event: { kind: "seconded" } } });
    expect(refused.status).toBe(422);
    const ok = await call(eventsRoute.POST, "POST", "/x", { as: s.as.clerk, params: { id: opened.body.id }, body: { revision: 0, event: { kind: "made", motion: "main", text: "That the Assembly do now consider the estimates" } } });
    expect(ok.status).toBe(201);
    for (let i = 0; i < 50 && seen.length === 0; i++) await new Promise((r) => setTimeout(r, 100));
    stop();
    expect(seen.map((n) => [n.revision, n.kind])).toEqual([[1, "made"]]);
  });

  it("streams server-sent events of its own chamber only", async () => {
    expect((await call(streamRoute.GET, "GET", "/x", { as: s.outsider, params: { id: sittingId } })).status).toBe(404);
  });
});
