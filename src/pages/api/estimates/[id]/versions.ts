import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { saveEstimateVersion, saveVersionSchema } from "../../../../lib/server/services/estimates.ts";

export const POST = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return Response.json(await saveEstimateVersion(actor, params.id ?? "", await readJson(request, saveVersionSchema, "estimate version")), { status: 201 });
});
