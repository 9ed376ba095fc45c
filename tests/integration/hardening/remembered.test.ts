// What a server keeps in memory between requests — who is signed in and their role
// (context.ts contextFor), a chamber's rulebook adoptions and roster (chamber-memory.ts) — is
// never answered once it is out of date: a change made by anyone, here through a separate
// PostgreSQL connection as another server or a clerk at psql would, is seen within moments
// (NOTIFY from the triggers of drizzle/0006_change_notices.sql), and nothing is kept while the
// LISTEN connection is down. Common practice for cache invalidation (notify on write), no source.
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { contextFor } from "../../../src/lib/server/context.ts";
import { caughtUp, isListening, NOTICES_APPLICATION_NAME } from "../../../src/lib/server/notices.ts";
import { loadRulebook } from "../../../src/lib/server/services/rulebooks.ts";
import { legislatorNames } from "../../../src/lib/server/services/measures.ts";
import { seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { seedMeasures } from "../../../src/lib/server/seed/measures.ts";
import * as treeRoute from "../../../src/pages/api/measures/[id]/tree.ts";
import * as amendmentRoute from "../../../src/pages/api/amendments/[id]/index.ts";
import * as overridesRoute from "../../../src/pages/api/measures/[id]/overrides/index.ts";
import * as overrideRoute from "../../../src/pages/api/measures/[id]/overrides/[oid].ts";
import { call } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let seeded: Seeded;
let other: postgres.Sql; // "another server"
const headersOf = (cookie: string) => new Headers({ cookie });

/** Wait on the event itself (vitest polls `ok` until it holds), never on a clock. */
async function until(what: string, ok: () => Promise<boolean>, timeout = 5000): Promise<void> {
  await vi.waitFor(async () => expect(await ok(), what).toBe(true), { timeout, interval: 25 });
}

beforeAll(async () => {
  seeded = await seedChambers();
  other = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
});

afterAll(async () => {
  await other.unsafe(`ALTER TABLE "member" ENABLE TRIGGER gw_access_member`);
  await other.unsafe(`ALTER TABLE legislators ENABLE TRIGGER gw_chamber_legislators`);
  await other.unsafe(`ALTER TABLE amendments ENABLE TRIGGER gw_measure_amendments`);
  await other.end();
});

describe("who is signed in, remembered per session", () => {
  it("is remembered (a change that sends no notice is not seen), and forgotten on a notice", async () => {
    const h = headersOf(seeded.as.member.cookie);
    expect((await contextFor(h)).role).toBe("member");
    await until("LISTEN to be in place", async () => isListening());
    // The first request of a new session records its active chamber, and that write sends a notice
    // of its own: hear it (and every other notice already committed) before proving anything is kept.
    expect(await caughtUp()).toBe(true);
    expect((await contextFor(h)).role).toBe("member"); // now remembered

    // Change the role with the trigger off: no notice, so the remembered answer stands — proof it is remembered.
    await other.unsafe(`ALTER TABLE "member" DISABLE TRIGGER gw_access_member`);
    await other`UPDATE "member" SET role = 'staff' WHERE user_id = ${seeded.as.member.userId}`;
    await other.unsafe(`ALTER TABLE "member" ENABLE TRIGGER gw_access_member`);
    expect((await contextFor(h)).role).toBe("member");

    // The same change with the trigger on: every server hears of it and asks again.
    await other`UPDATE "member" SET role = 'observer' WHERE user_id = ${seeded.as.member.userId}`;
    await until("the new role to be seen", async () => (await contextFor(h)).role === "observer");
  });

  it("a session deleted elsewhere (signed out on another server) is refused at once", async () => {
    const h = headersOf(seeded.as.clerk.cookie);
    expect((await contextFor(h)).user?.id).toBe(seeded.as.clerk.userId);
    expect((await contextFor(h)).user?.id).toBe(seeded.as.clerk.userId);
    await other`DELETE FROM "session" WHERE user_id = ${seeded.as.clerk.userId}`;
    await until("the deleted session to be refused", async () => (await contextFor(h)).user === null);
  });

  it("keeps nothing while the LISTEN connection is down, and forgets all it had", async () => {
    const h = headersOf(seeded.as.staff.cookie);
    await until("LISTEN to be in place", async () => isListening());
    expect((await contextFor(h)).role).toBe("staff");
    await other.unsafe(`ALTER TABLE "member" DISABLE TRIGGER gw_access_member`);
    await other`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = current_database() AND application_name = ${NOTICES_APPLICATION_NAME}`;
    await until("the lost LISTEN to be noticed", async () => !isListening());
    // A change that sends no notice, while the server could not have heard one anyway.
    await other`UPDATE "member" SET role = 'clerk' WHERE user_id = ${seeded.as.staff.userId}`;
    await other.unsafe(`ALTER TABLE "member" ENABLE TRIGGER gw_access_member`);
    expect((await contextFor(h)).role).toBe("clerk");
    await until("LISTEN to be back by itself", async () => isListening(), 15_000);
    expect((await contextFor(h)).role).toBe("clerk");
  });
});

describe("a chamber's rulebook adoptions and roster, remembered per chamber", () => {
  it("an adoption recorded elsewhere is the rulebook in force at once", async () => {
    await seedRulebooks();
    const chamber = seeded.chambers.harrowmere;
    const first = await loadRulebook(chamber);
    const [v] = await other`INSERT INTO rulebook_versions (chamber_id, number, based_on, title, document, note) SELECT chamber_id, number + 100, id, title, document, 'saved on another server' FROM rulebook_versions WHERE id = ${first.versionId} RETURNING id`;
    await other`INSERT INTO rulebook_adoptions (chamber_id, version_id, effective_from, note) VALUES (${chamber}, ${v.id}, now(), 'adopted on another server')`;
    await until("the new adoption to be in force", async () => (await loadRulebook(chamber)).versionId === v.id);
  });

  it("a legislator renamed elsewhere is named anew", async () => {
    const chamber = seeded.chambers.harrowmere;
    const [l] = await other`SELECT id, name FROM legislators WHERE chamber_id = ${chamber} ORDER BY name LIMIT 1`;
    expect((await legislatorNames(chamber)).get(l.id)).toBe(l.name);
    // With the trigger off no notice is sent, and the remembered roster stands — proof it is remembered.
    await other.unsafe(`ALTER TABLE legislators DISABLE TRIGGER gw_chamber_legislators`);
    await other`UPDATE legislators SET name = ${l.name + " (unheard)"} WHERE id = ${l.id}`;
    await other.unsafe(`ALTER TABLE legislators ENABLE TRIGGER gw_chamber_legislators`);
    expect((await legislatorNames(chamber)).get(l.id)).toBe(l.name);
    await other`UPDATE legislators SET name = ${l.name + " (renamed)"} WHERE id = ${l.id}`;
    await until("the new name", async () => (await legislatorNames(chamber)).get(l.id) === `${l.name} (renamed)`);
  });
});

describe("a measure's tree, remembered per measure", () => {
  it("is remembered, forgotten when an amendment changes elsewhere, and never shown to another chamber", async () => {
    const made = await seedMeasures();
    const measureId = made!.measureId;
    const read = async (as = seeded.as.member) => call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as, params: { id: measureId } });
    const titleOf = (t: any, id: string) => t.body.nodes.find((n: any) => n.id === id)?.title;
    const first = await read();
    expect(first.status).toBe(200);
    const a = first.body.nodes.find((n: any) => n.kind === "amendment");

    // With the trigger off no notice is sent, and the remembered tree stands — proof it is remembered.
    await other.unsafe(`ALTER TABLE amendments DISABLE TRIGGER gw_measure_amendments`);
    await other`UPDATE amendments SET title = 'unheard' WHERE id = ${a.id}`;
    await other.unsafe(`ALTER TABLE amendments ENABLE TRIGGER gw_measure_amendments`);
    expect(titleOf(await read(), a.id)).toBe(a.title);

    await other`UPDATE amendments SET title = 'changed on another server' WHERE id = ${a.id}`;
    await until("the changed amendment in the tree", async () => titleOf(await read(), a.id) === "changed on another server");

    // Remembered for Harrowmere; the other chamber still gets 404, not the remembered tree.
    expect((await read(seeded.outsider)).status).toBe(404);
  });

  it("whoever writes reads their write on the very next request (a read first hears every earlier notice)", async () => {
    // (The clerk's session was deleted above: the chief clerk writes here.)
    const [{ id: measureId }] = await other`SELECT id FROM measures WHERE chamber_id = ${seeded.chambers.harrowmere} ORDER BY number LIMIT 1`;
    const before = await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as["chief-clerk"], params: { id: measureId } });
    const a = before.body.nodes.find((n: any) => n.kind === "amendment" && n.status === "filed");
    expect(a, "the demo tree has a filed amendment").toBeTruthy();
    let version = a.version;
    for (let i = 0; i < 5; i++) {
      const saved = await call(amendmentRoute.PATCH, "PATCH", `/api/amendments/${a.id}`, { as: seeded.as["chief-clerk"], params: { id: a.id }, body: { version, title: `Retitled ${i}` } });
      expect(saved.status).toBe(200);
      version = saved.body.version;
      const after = await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as["chief-clerk"], params: { id: measureId } });
      expect(after.body.nodes.find((n: any) => n.id === a.id).title).toBe(`Retitled ${i}`);
    }
    // An override recorded and revoked: the revocation's last act is its commit.
    const tree = (await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as["chief-clerk"], params: { id: measureId } })).body;
    const f = tree.findings.find((x: any) => x.amendmentId && !x.overridden);
    expect(f, "the demo tree has a finding to override").toBeTruthy();
    const target = tree.nodes.find((n: any) => n.id === f.amendmentId);
    for (let i = 0; i < 5; i++) {
      const o = await call(overridesRoute.POST, "POST", `/api/measures/${measureId}/overrides`, { as: seeded.as["chief-clerk"], params: { id: measureId }, body: { amendmentId: f.amendmentId, code: f.code, version: target.version, rulingRef: `Ruling ${i}` } });
      expect(o.status).toBe(201);
      const on = (await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as["chief-clerk"], params: { id: measureId } })).body;
      expect(on.findings.find((x: any) => x.amendmentId === f.amendmentId && x.code === f.code).overrideId).toBe(o.body.id);
      expect((await call(overrideRoute.DELETE, "DELETE", `/api/measures/${measureId}/overrides/${o.body.id}`, { as: seeded.as["chief-clerk"], params: { id: measureId, oid: o.body.id } })).status).toBe(200);
      const off = (await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as["chief-clerk"], params: { id: measureId } })).body;
      expect(off.findings.find((x: any) => x.amendmentId === f.amendmentId && x.code === f.code).overrideId).toBeNull();
    }
  });

  it("a rulebook adopted for a later moment governs the remembered tree from that moment, with no write in between", async () => {
    const chamber = seeded.chambers.harrowmere;
    const [{ id: measureId }] = await other`SELECT id FROM measures WHERE chamber_id = ${chamber} ORDER BY number LIMIT 1`;
    const read = async () => (await call(treeRoute.GET, "GET", `/api/measures/${measureId}/tree`, { as: seeded.as.member, params: { id: measureId } })).body;
    const inForce = await loadRulebook(chamber);
    const [v] = await other`INSERT INTO rulebook_versions (chamber_id, number, based_on, title, document, note) SELECT chamber_id, number + 200, id, title, document, 'effective shortly' FROM rulebook_versions WHERE id = ${inForce.versionId} RETURNING id, number`;
    await other`INSERT INTO rulebook_adoptions (chamber_id, version_id, effective_from, note) VALUES (${chamber}, ${v.id}, now() + interval '1500 milliseconds', 'in force shortly')`;
    await until("the adoption to be heard", async () => (await read()).rulebook.source === `adopted version ${inForce.number}`);
    expect((await read()).rulebook.source).toBe(`adopted version ${inForce.number}`); // remembered, still the old one
    await until("the later adoption to govern the tree", async () => (await read()).rulebook.source === `adopted version ${v.number}`, 5000);
  });
});
