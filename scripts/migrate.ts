// Apply the SQL migrations in drizzle/ to DATABASE_URL (used by `npm start` and `npm test`).
import { ensureMigrated, sql } from "../src/lib/server/db.ts";

await ensureMigrated();
await sql.end();
console.log("[gavelwright] migrations applied");
