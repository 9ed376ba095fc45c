// The demo accounts, read from the same JSON file the seed uses, so `npm start` can print them.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { ROOT } from "./setup.mjs";

export const DEMO_ACCOUNTS = JSON.parse(readFileSync(join(ROOT, "src/lib/server/seed/demo-accounts.json"), "utf8"));
