// Register a chamber as the operator (the only way when GAVELWRIGHT_OPEN_SIGNUP is off, the default):
//
//   npm run chamber:create -- --name "North Vale Council" --time-zone Europe/London --chief-clerk clerk@north-vale.example [--slug north-vale]
//
// The chief clerk must already have an account (Create an account, /sign-up); they become the
// chamber's chief clerk and invite the others from People. Prints the chamber as JSON.
// Exit codes: 0 created; 2 invalid arguments (each problem named); 1 anything else.
import { parseArgs } from "node:util";
import { ensureMigrated, sql } from "../src/lib/server/db.ts";
import { endNotices } from "../src/lib/server/notices.ts";
import { createChamber } from "../src/lib/server/services/chambers.ts";
import { isGavelError } from "../src/lib/errors.ts";

const USAGE = 'usage: npm run chamber:create -- --name "Full name" --time-zone Area/City --chief-clerk e-mail [--slug short-name]';

let code = 0;
try {
  const { values } = parseArgs({
    options: { name: { type: "string" }, slug: { type: "string" }, "time-zone": { type: "string" }, "chief-clerk": { type: "string" }, help: { type: "boolean" } },
    strict: true,
    allowPositionals: false,
  });
  if (values.help) {
    console.log(USAGE);
  } else {
    await ensureMigrated();
    const chamber = await createChamber({ name: values.name, slug: values.slug, timeZone: values["time-zone"], chiefClerk: values["chief-clerk"] });
    console.log(JSON.stringify(chamber, null, 2));
  }
} catch (e) {
  if (isGavelError(e)) {
    console.error(`[gavelwright] ${e.message}`);
    for (const i of e.issues) console.error(`  ${i.path === "timeZone" ? "--time-zone" : i.path === "chiefClerk" ? "--chief-clerk" : `--${i.path}`}: ${i.message}`);
    code = e.code === "invalid-input" || e.code === "unprocessable" || e.code === "conflict" ? 2 : 1;
  } else if (e instanceof TypeError && "code" in e && String(e.code).startsWith("ERR_PARSE_ARGS")) {
    console.error(`[gavelwright] ${e.message}\n${USAGE}`);
    code = 2;
  } else {
    console.error("[gavelwright] could not create the chamber:", e instanceof Error ? e.message : e);
    code = 1;
  }
} finally {
  await endNotices();
  await sql.end({ timeout: 1 });
}
process.exit(code);
