// The seeded Harrowmere records that the pages of the route inventory are opened with
// (tests/access/route-inventory.ts): looked up in the app's database, plus one finished analysis
// started as the clerk (a run and its first legal order).
import type postgres from "postgres";
import { vi } from "vitest";
import { BASE_URL } from "./browser.ts";
import type { Samples } from "../access/route-inventory.ts";

/** GET (no body) or POST (JSON body) as the person whose cookie is given; throws on a refusal. */
export async function apiAs(path: string, cookie: string, body?: unknown) {
  const r = await fetch(`${BASE_URL}${path}`, body === undefined ? { headers: { cookie } } : { method: "POST", headers: { cookie, origin: BASE_URL, "content-type": "application/json" }, body: JSON.stringify(body) });
  const json = await r.json();
  if (!r.ok) throw new Error(`${path}: ${r.status} ${JSON.stringify(json)}`);
  return json;
}

/** Samples for every page of the inventory (the API-only keys are left empty). */
export async function pageSamples(sql: postgres.Sql, clerkCookie: string): Promise<Samples> {
  const [h] = await sql`SELECT id FROM organization WHERE slug LIKE 'harrowmere%'`;
  const one = async (q: Promise<postgres.RowList<postgres.Row[]>>) => String((await q)[0]?.id ?? "");
  const adopted = await one(sql`SELECT v.id FROM rulebook_adoptions a JOIN rulebook_versions v ON v.id = a.version_id WHERE a.chamber_id = ${h.id} ORDER BY a.effective_from DESC LIMIT 1`);
  const latest = await one(sql`SELECT id FROM rulebook_versions WHERE chamber_id = ${h.id} ORDER BY number DESC LIMIT 1`);
  const estimate = await one(sql`SELECT id FROM estimates WHERE chamber_id = ${h.id} AND kind = 'ballots' ORDER BY created_at LIMIT 1`);
  const started = await apiAs("/api/analysis/runs", clerkCookie, { estimateId: estimate });
  await vi.waitFor(
    async () => {
      const status = (await apiAs(`/api/analysis/runs/${started.runId}`, clerkCookie)).run.status;
      if (status !== "done") throw new Error(`the sample analysis is ${status}`);
    },
    { timeout: 60_000, interval: 200 },
  );
  const orders = await apiAs(`/api/analysis/runs/${started.runId}/orders`, clerkCookie);
  const samples = {
    measure: await one(sql`SELECT id FROM measures WHERE chamber_id = ${h.id} ORDER BY number LIMIT 1`),
    sitting: await one(sql`SELECT id FROM sittings WHERE chamber_id = ${h.id} ORDER BY opened_at LIMIT 1`),
    estimate,
    run: started.runId,
    runOrder: orders.orders[0].questions.join(","),
    rulebookVersion: adopted,
    rulebookVersion2: latest,
    issuedRuling: await one(sql`SELECT id FROM rulings WHERE chamber_id = ${h.id} AND status = 'issued' ORDER BY created_at LIMIT 1`),
  } as Samples;
  for (const [k, v] of Object.entries(samples)) if (!v) throw new Error(`no sample ${k} in the seeded database`);
  return samples;
}
