/**
 * Test fixtures built with the same seed functions as the demo (one way to make data).
 * `seedChambers()` gives both demo chambers with one signed-in session per demo account.
 */
import { seedFoundation } from "../../src/lib/server/seed/foundation.ts";
import { DEMO_ACCOUNTS } from "../../src/lib/server/seed/demo-data.ts";
import type { ChamberRole } from "../../src/lib/permissions.ts";
import { signIn, type Session } from "./app.ts";
import { truncateAll } from "./db.ts";

export interface Seeded {
  chambers: Record<string, string>;
  as: Record<ChamberRole, Session>;
  /** The chief clerk of the other chamber (Saltreach): must never see Harrowmere's data. */
  outsider: Session;
}

export async function seedChambers(): Promise<Seeded> {
  await truncateAll();
  const { chambers } = await seedFoundation();
  const as = {} as Record<ChamberRole, Session>;
  for (const a of DEMO_ACCOUNTS.filter((x) => x.chamber === "harrowmere")) as[a.role] = await signIn(a.email, a.password);
  const o = DEMO_ACCOUNTS.find((x) => x.chamber === "saltreach")!;
  return { chambers, as, outsider: await signIn(o.email, o.password) };
}
