import { route, requireActor, json } from "../../../../lib/server/http.ts";
import { cancelInvitation } from "../../../../lib/server/services/people.ts";

export const DELETE = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "people:invite");
  await cancelInvitation(actor, request.headers, params.id ?? "");
  return json({ ok: true });
});
