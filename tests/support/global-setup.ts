// Vitest global setup: make sure the test database exists and is migrated before any test file runs.
import { ensureTestDatabase } from "./db.ts";

export default async function setup(): Promise<void> {
  if (process.env.GAVELWRIGHT_SKIP_DB === "1") return;
  const url = process.env.GAVELWRIGHT_TEST_DATABASE_URL!;
  process.env.DATABASE_URL = url;
  await ensureTestDatabase(url);
  const { ensureMigrated, sql } = await import("../../src/lib/server/db.ts");
  await ensureMigrated();
  await sql.end();
}
