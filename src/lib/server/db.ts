/**
 * The PostgreSQL connection (postgres.js + Drizzle) and the migration step, applied once per
 * process under an advisory lock so that several app servers can start against one database.
 */
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import path from "node:path";
import postgres from "postgres";
import * as schema from "../db/schema/index.ts";
import { connectTimeout, reconnectBackoff } from "./db-options.ts";

export { connectTimeout, reconnectBackoff };

function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set. Start the app with `npm start`, or set DATABASE_URL (see README.md, Configuration).");
  return url;
}

export const sql = postgres(databaseUrl(), {
  max: Number(process.env.DATABASE_POOL_SIZE ?? 10),
  onnotice: () => {},
  idle_timeout: 30,
  connect_timeout: connectTimeout(),
  backoff: reconnectBackoff,
});
export const db = drizzle(sql, { schema });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

const MIGRATION_LOCK = 7_302_114; // arbitrary, fixed: serialises migrations across processes

let migrated: Promise<void> | null = null;
export function ensureMigrated(): Promise<void> {
  migrated ??= (async () => {
    const conn = postgres(databaseUrl(), { max: 1, onnotice: () => {}, connect_timeout: connectTimeout(), backoff: reconnectBackoff });
    try {
      await conn`SELECT pg_advisory_lock(${MIGRATION_LOCK})`;
      await migrate(drizzle(conn), { migrationsFolder: process.env.MIGRATIONS_DIR ?? path.resolve("drizzle") });
      await conn`SELECT pg_advisory_unlock(${MIGRATION_LOCK})`;
    } finally {
      await conn.end();
    }
  })().catch((e) => {
    migrated = null;
    throw e;
  });
  return migrated;
}
