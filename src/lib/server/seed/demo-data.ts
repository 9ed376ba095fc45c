/**
 * The demo scenario: a fictional county assembly, Harrowmere, and a second fictional
 * chamber (Saltreach Borough Council) used to show that chambers are kept apart.
 * Every name here is invented.
 */
import type { ChamberRole } from "../../permissions.ts";
import demoAccounts from "./demo-accounts.json";

export interface DemoAccount {
  email: string;
  name: string;
  password: string;
  chamber: "harrowmere" | "saltreach";
  role: ChamberRole;
}

/** The demo sign-ins, one per role (plus a second chamber's chief clerk). Printed by `npm start`. */
export const DEMO_ACCOUNTS = demoAccounts as DemoAccount[];

export const DEMO_CHAMBERS = {
  harrowmere: { name: "Harrowmere County Assembly", slug: "harrowmere" },
  saltreach: { name: "Saltreach Borough Council", slug: "saltreach" },
} as const;

export const BLOCS = [
  { name: "Moorland Union", seats: 14 },
  { name: "Harbour Progressives", seats: 12 },
  { name: "Civic Reform", seats: 9 },
  { name: "Independents", seats: 5 },
] as const;

const GIVEN = ["Ada", "Bertil", "Cora", "Dunstan", "Elspeth", "Fionn", "Greer", "Hale", "Isolde", "Jory", "Kestrel", "Linnea", "Mungo", "Nell", "Osric", "Petra", "Quill", "Rowan", "Sabine", "Tobin"];
const FAMILY = ["Ashdown", "Brackley", "Colvenor", "Dunmere", "Estover", "Farrowby", "Gillimore", "Hartsell", "Inchcombe", "Jessop", "Kilbride", "Lowther", "Maddox", "Netherby", "Orrin", "Penhallow", "Quayle", "Rooksby", "Stavely", "Thorne"];
const WARDS = ["Bramble Vale", "Cinder Hill", "Dockside", "East Fen", "Gorse Common", "High Harrow", "Lantern Quay", "Millrace", "North Weald", "Old Tannery"];
const OFFICES: Record<number, string> = { 0: "Presiding Officer", 1: "Leader of the Moorland Union", 14: "Leader of the Harbour Progressives", 26: "Leader of Civic Reform", 2: "Deputy Presiding Officer" };

/** The 40 legislators of Harrowmere, deterministic so tests and screenshots are stable. */
export function harrowmereRoster(): Array<{ name: string; bloc: string; constituency: string; office: string | null }> {
  const out: Array<{ name: string; bloc: string; constituency: string; office: string | null }> = [];
  let i = 0;
  for (const b of BLOCS)
    for (let s = 0; s < b.seats; s++, i++)
      // The family index shifts for the second pass through the given names, so all 40 names differ.
      out.push({ name: `${GIVEN[i % GIVEN.length]} ${FAMILY[(i * 7 + Math.floor(i / GIVEN.length) * 3) % FAMILY.length]}`, bloc: b.name, constituency: `${WARDS[i % WARDS.length]} ${Math.floor(i / WARDS.length) + 1}`, office: OFFICES[i] ?? null });
  return out;
}
