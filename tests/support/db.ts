/**
 * Integration-test database helpers: the database named by DATABASE_URL (a test database,
 * see vitest.config.ts) is created if missing, migrated from drizzle/, and emptied between tests.
 */
import postgres from "postgres";

export async function ensureTestDatabase(url = process.env.DATABASE_URL!): Promise<void> {
  const u = new URL(url);
  const name = u.pathname.slice(1);
  if (!/^[a-z0-9_]+$/.test(name)) throw new Error(`unexpected test database name ${name}`);
  u.pathname = "/postgres";
  const admin = postgres(u.toString(), { max: 1, onnotice: () => {} });
  try {
    const rows = await admin`SELECT 1 FROM pg_database WHERE datname = ${name}`;
    if (rows.length === 0) await admin.unsafe(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
}

/** Empty every application table (keeps the schema and the migration record). */
export async function truncateAll(): Promise<void> {
  const { sql } = await import("../../src/lib/server/db.ts");
  const tables = await sql<{ tablename: string }[]>`SELECT tablename FROM pg_tables WHERE schemaname = 'public'`;
  if (tables.length) await sql.unsafe(`TRUNCATE ${tables.map((t) => `"${t.tablename}"`).join(", ")} RESTART IDENTITY CASCADE`);
}

/** Row counts of every table: used to assert that a refused request changed nothing. */
export async function tableCounts(): Promise<Record<string, number>> {
  const { sql } = await import("../../src/lib/server/db.ts");
  const tables = await sql<{ tablename: string }[]>`SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`;
  const out: Record<string, number> = {};
  for (const t of tables) {
    if (t.tablename === "session" || t.tablename === "verification" || t.tablename === "rate_limit") continue;
    const [r] = await sql.unsafe(`SELECT count(*)::int AS n FROM "${t.tablename}"`);
    out[t.tablename] = r.n as number;
  }
  return out;
}
