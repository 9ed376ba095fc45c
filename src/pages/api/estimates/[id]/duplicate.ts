import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { duplicateEstimate, duplicateSchema } from "../../../../lib/server/services/estimates.ts";

export const POST = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return Response.json(await duplicateEstimate(actor, params.id ?? "", await readJson(request, duplicateSchema, "duplicate")), { status: 201 });
});
