// npm run db:backup / db:restore round trip (pg_dump and pg_restore, custom format).
// The product's own contract (common practice, no source).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import postgres from "postgres";
import { ensureTestDatabase, tableCounts } from "../../support/db.ts";
import { seedChambers } from "../../support/fixtures.ts";

const dir = mkdtempSync(join(tmpdir(), "gw-backup-"));
const restoreUrl = (() => {
  const u = new URL(process.env.DATABASE_URL!);
  u.pathname = `${u.pathname}_restore`;
  return u.toString();
})();

function db(cmd: string[], url: string) {
  return spawnSync(process.execPath, ["scripts/db.mjs", ...cmd], { encoding: "utf8", env: { ...process.env, DATABASE_URL: url } });
}

beforeAll(async () => {
  await seedChambers();
  await ensureTestDatabase(restoreUrl);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("backup and restore", () => {
  it("restores a backup into another database with every row", async () => {
    const file = join(dir, "round-trip.dump");
    const b = db(["backup", file], process.env.DATABASE_URL!);
    expect(b.status, b.stderr).toBe(0);
    const refused = db(["restore", file], restoreUrl);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toContain("--yes");
    const r = db(["restore", file, "--yes"], restoreUrl);
    expect(r.status, r.stderr).toBe(0);
    const before = await tableCounts();
    const other = postgres(restoreUrl, { max: 1, onnotice: () => {} });
    try {
      for (const [table, n] of Object.entries(before)) {
        const [row] = await other.unsafe(`SELECT count(*)::int AS n FROM "${table}"`);
        expect(row.n, table).toBe(n);
      }
      const [u] = await other`SELECT email FROM "user" WHERE email = 'clerk@harrowmere.example'`;
      expect(u.email).toBe("clerk@harrowmere.example");
    } finally {
      await other.end();
    }
  });

  it("refuses a file that is not a backup and leaves the database as it was", async () => {
    const junk = join(dir, "junk.dump");
    writeFileSync(junk, "this is not a dump");
    const other = postgres(restoreUrl, { max: 1, onnotice: () => {} });
    const [before] = await other`SELECT count(*)::int AS n FROM "user"`;
    const r = db(["restore", junk, "--yes"], restoreUrl);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain("not a pg_dump");
    const [after] = await other`SELECT count(*)::int AS n FROM "user"`;
    await other.end();
    expect(after.n).toBe(before.n);
  });
});
