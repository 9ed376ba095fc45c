import { json, requireActor, route } from "../../../lib/server/http.ts";
import { importVersion } from "../../../lib/server/services/rulebooks.ts";
import { savedWithBench } from "../../../lib/server/services/scenarios.ts";
import { readRulebookUpload } from "../../../lib/server/uploads.ts";

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "rulebook:edit");
  return json(await savedWithBench(actor, await importVersion(actor, await readRulebookUpload(request))), 201);
});
