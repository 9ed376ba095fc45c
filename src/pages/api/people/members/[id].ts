import { readJson, route, requireActor } from "../../../../lib/server/http.ts";
import { changeRole, roleChangeSchema } from "../../../../lib/server/services/people.ts";

export const PATCH = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "people:assign-role");
  const { role } = await readJson(request, roleChangeSchema, "role change");
  return changeRole(actor, request.headers, params.id ?? "", role);
});
