// Seed the demo scenario into DATABASE_URL. Idempotent. Each area adds its own seed step.
import { ensureMigrated, sql } from "../src/lib/server/db.ts";
import { endNotices } from "../src/lib/server/notices.ts";
import { seedDemo } from "../src/lib/server/seed/index.ts";

await ensureMigrated();
await seedDemo();
await endNotices();
await sql.end();
console.log("[gavelwright] demo chamber seeded");
