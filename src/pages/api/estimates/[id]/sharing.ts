import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { setSharing, sharingSchema } from "../../../../lib/server/services/estimates.ts";

export const PUT = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return setSharing(actor, params.id ?? "", await readJson(request, sharingSchema, "sharing"));
});
