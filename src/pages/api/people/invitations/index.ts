import { readJson, route, requireActor, json } from "../../../../lib/server/http.ts";
import { invite, inviteSchema } from "../../../../lib/server/services/people.ts";

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "people:invite");
  const input = await readJson(request, inviteSchema, "invitation");
  return json(await invite(actor, request.headers, input), 201);
});
