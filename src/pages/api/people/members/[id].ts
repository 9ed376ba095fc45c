import { readJson, route, requireActor } from "../../../../lib/server/http.ts";
import { changeRole, removeMember, roleChangeSchema } from "../../../../lib/server/services/people.ts";

// The chief clerk changes a member's role or removes them from the chamber; each goes in the people log.
export const PATCH = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "people:assign-role");
  const { role } = await readJson(request, roleChangeSchema, "role change");
  return changeRole(actor, params.id ?? "", role);
});

export const DELETE = route(async ({ locals, params }) => removeMember(requireActor(locals, "people:assign-role"), params.id ?? ""));
