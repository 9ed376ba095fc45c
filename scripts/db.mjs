// npm run db:start | db:stop | db:status — the project-local PostgreSQL cluster.
import { ensureDatabase, loadEnvFile, log, pgStatus, pgStop, SetupError } from "./lib/setup.mjs";

const cmd = process.argv[2];
try {
  loadEnvFile();
  if (cmd === "start") {
    const url = ensureDatabase();
    log(`DATABASE_URL=${url.replace(/:[^:@/]+@/, ":***@")}`);
  } else if (cmd === "stop") pgStop();
  else if (cmd === "status") console.log(JSON.stringify(pgStatus(), null, 2));
  else {
    console.error("usage: node scripts/db.mjs start|stop|status");
    process.exit(2);
  }
} catch (e) {
  console.error(e instanceof SetupError ? `[gavelwright] ${e.message}` : e);
  process.exit(1);
}
