// One record of every kind a page of the route inventory names, found in the seeded Harrowmere
// chamber (a finished analysis run is started for the run's pages). Shared by the browser tests
// that walk the route inventory (access.test.ts, phone.test.ts).
import type postgres from "postgres";
import { vi } from "vitest";
import { BASE_URL } from "./browser.ts";
import type { Samples } from "../access/route-inventory.ts";

/** A GET (no body) or POST (body) to the app's API as the holder of `cookie`; throws unless 2xx. */
export async function api(path: string, cookie: string, body?: unknown) {
  const r = await fetch(`${BASE_URL}${path}`, body === undefined ? { headers: { cookie } } : { method: "POST", headers: { cookie, origin: BASE_URL, "content-type": "application/json" }, body: JSON.stringify(body) });
  const json = await r.json();
  if (!r.ok) throw new Error(`${path}: ${r.status} ${JSON.stringify(json)}`);
  return json;
}

/** The seeded records the inventory's pages name; `clerkCookie` starts the sample analysis. */
export async function pageSamples(sql: postgres.Sql, clerkCookie: string): Promise<{ chamberId: string; samples: Samples }> {
  const [h] = await sql`SELECT id FROM organization WHERE slug LIKE 'harrowmere%'`;
  const one = async (q: Promise<postgres.RowList<postgres.Row[]>>) => String((await q)[0]?.id ?? "");
  const adopted = await one(sql`SELECT v.id FROM rulebook_adoptions a JOIN rulebook_versions v ON v.id = a.version_id WHERE a.chamber_id = ${h.id} ORDER BY a.effective_from DESC LIMIT 1`);
  const latest = await one(sql`SELECT id FROM rulebook_versions WHERE chamber_id = ${h.id} ORDER BY number DESC LIMIT 1`);
  const estimate = await one(sql`SELECT id FROM estimates WHERE chamber_id = ${h.id} AND kind = 'ballots' ORDER BY created_at LIMIT 1`);
  const started = await api("/api/analysis/runs", clerkCookie, { estimateId: estimate });
  await vi.waitFor(
    async () => {
      const status = (await api(`/api/analysis/runs/${started.runId}`, clerkCookie)).run.status;
      if (status !== "done") throw new Error(`the sample analysis is ${status}`);
    },
    { timeout: 60_000, interval: 200 },
  );
  const orders = await api(`/api/analysis/runs/${started.runId}/orders`, clerkCookie);
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
  return { chamberId: String(h.id), samples };
}
