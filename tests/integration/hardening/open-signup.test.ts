// Issue 17, item 3 (the deployment setting): whether anyone who signs up may register a chamber.
// The probe found `/api/auth/organization/create` open to every signed-in user, so a stranger
// could create a chamber (and then hold the analysis workers). GAVELWRIGHT_OPEN_SIGNUP is off by
// default: chambers are then created by the operator (`npm run chamber:create`, a system action)
// and people join by invitation; the demo seed keeps working. Common practice, no source.
import { spawnSync } from "node:child_process";
import { join } from "node:path";
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import { ALL } from "../../../src/pages/api/auth/[...all].ts";
import { sql } from "../../../src/lib/server/db.ts";
import { createChamber } from "../../../src/lib/server/services/chambers.ts";
import { call, signUp, type Session } from "../../support/app.ts";
import { seedChambers } from "../../support/fixtures.ts";

let stranger: Session;
const before = process.env.GAVELWRIGHT_OPEN_SIGNUP;

beforeAll(async () => {
  const seeded = await seedChambers(); // the demo seed, with the setting off
  expect(Object.keys(seeded.chambers).sort()).toEqual(["harrowmere", "saltreach"]);
  stranger = await signUp("stranger-chamber@example.org", "stranger-password-1");
});
afterEach(() => {
  if (before === undefined) delete process.env.GAVELWRIGHT_OPEN_SIGNUP;
  else process.env.GAVELWRIGHT_OPEN_SIGNUP = before;
});

const create = (slug: string) => call(ALL, "POST", "/api/auth/organization/create", { as: stranger, body: { name: `Chamber ${slug}`, slug } });
const chamberCount = async (slug: string) => (await sql<{ n: number }[]>`SELECT count(*)::int AS n FROM organization WHERE slug = ${slug}`)[0]!.n;

describe("registering a chamber from the app", () => {
  it("is refused by default (403), and nothing is created", async () => {
    delete process.env.GAVELWRIGHT_OPEN_SIGNUP;
    const r = await create("stranger-hall");
    expect(r.status).toBe(403);
    expect(await chamberCount("stranger-hall")).toBe(0);
    process.env.GAVELWRIGHT_OPEN_SIGNUP = "off";
    expect((await create("stranger-hall")).status).toBe(403);
    expect(await chamberCount("stranger-hall")).toBe(0);
  });

  it("is allowed with GAVELWRIGHT_OPEN_SIGNUP=on, and the creator is the chief clerk", async () => {
    process.env.GAVELWRIGHT_OPEN_SIGNUP = "on";
    const r = await create("open-hall");
    expect(r.status).toBe(200);
    const [m] = await sql`SELECT m.role FROM member m JOIN organization o ON o.id = m.organization_id WHERE o.slug = 'open-hall'`;
    expect(m!.role).toBe("chief-clerk");
  });
});

describe("the operator's command", () => {
  it("validates every argument and names each bad one", async () => {
    await expect(createChamber({ name: "x", timeZone: "Mars/Olympus", chiefClerk: "not-an-address" })).rejects.toMatchObject({
      code: "invalid-input",
      issues: expect.arrayContaining([expect.objectContaining({ path: "name" }), expect.objectContaining({ path: "timeZone" }), expect.objectContaining({ path: "chiefClerk" })]),
    });
    await expect(createChamber({ name: "North Vale Council", slug: "Bad Slug", timeZone: "UTC", chiefClerk: "stranger-chamber@example.org" })).rejects.toMatchObject({ code: "invalid-input", issues: [expect.objectContaining({ path: "slug" })] });
    await expect(createChamber({ name: "North\u0000Vale", timeZone: "UTC", chiefClerk: "stranger-chamber@example.org" })).rejects.toMatchObject({ code: "invalid-input" });
  });

  it("needs the chief clerk's account to exist, and a free short name", async () => {
    await expect(createChamber({ name: "North Vale Council", timeZone: "Europe/London", chiefClerk: "nobody-yet@example.org" })).rejects.toMatchObject({ code: "unprocessable", issues: [expect.objectContaining({ path: "chiefClerk" })] });
    await expect(createChamber({ name: "Harrowmere again", slug: "harrowmere", timeZone: "Europe/London", chiefClerk: "stranger-chamber@example.org" })).rejects.toMatchObject({ code: "conflict", issues: [expect.objectContaining({ path: "slug" })] });
  });

  it("creates the chamber with the setting off; the named person is its chief clerk", async () => {
    delete process.env.GAVELWRIGHT_OPEN_SIGNUP;
    const c = await createChamber({ name: "North Vale Council", timeZone: "Europe/London", chiefClerk: "Stranger-Chamber@example.org" });
    expect(c).toMatchObject({ slug: "north-vale-council", timeZone: "Europe/London", chiefClerk: { userId: stranger.userId } });
    const [row] = await sql`SELECT o.time_zone, m.role, m.user_id FROM organization o JOIN member m ON m.organization_id = o.id WHERE o.id = ${c.id}`;
    expect(row!.role).toBe("chief-clerk");
    expect(row!.time_zone).toBe("Europe/London");
  });

  it("runs as `npm run chamber:create` (exit 2 naming the bad argument, 0 with the chamber as JSON)", () => {
    const run = (...args: string[]) =>
      spawnSync(process.execPath, [join(process.cwd(), "node_modules", "tsx", "dist", "cli.mjs"), "scripts/chamber-create.ts", ...args], { env: { ...process.env, GAVELWRIGHT_OPEN_SIGNUP: "" }, encoding: "utf8" });
    const bad = run("--name", "South Vale Council", "--time-zone", "Nowhere/Atlantis", "--chief-clerk", "stranger-chamber@example.org");
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain("--time-zone");
    const good = run("--name", "South Vale Council", "--time-zone", "UTC", "--chief-clerk", "stranger-chamber@example.org");
    expect(good.status, good.stderr).toBe(0);
    expect(JSON.parse(good.stdout)).toMatchObject({ slug: "south-vale-council", timeZone: "UTC" });
  });
});
