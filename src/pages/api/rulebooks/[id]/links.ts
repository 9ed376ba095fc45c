import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { linksSchema, saveClauseLinks } from "../../../../lib/server/services/chamber-text.ts";
import { savedWithBench } from "../../../../lib/server/services/scenarios.ts";

/** Link items of this version to clauses of the chamber's rules: saved as a new version based on it. */
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "rulebook:edit");
  const input = await readJson(request, linksSchema, "clause links");
  return json(await savedWithBench(actor, await saveClauseLinks(actor, params.id ?? "", input)), 201);
});
