import { json, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { listRulebooks, MAX_RULEBOOK_BYTES, saveVersion, saveVersionSchema } from "../../../lib/server/services/rulebooks.ts";
import { savedWithBench } from "../../../lib/server/services/scenarios.ts";

export const GET = route(async ({ locals }) => listRulebooks(requireActor(locals, "chamber:read")));

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "rulebook:edit");
  const input = await readJson(request, saveVersionSchema, "rulebook version", MAX_RULEBOOK_BYTES + 16 * 1024);
  return json(await savedWithBench(actor, await saveVersion(actor, input)), 201);
});
