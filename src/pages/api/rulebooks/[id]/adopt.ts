import { json, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { adoptSchema, adoptVersion } from "../../../../lib/server/services/rulebooks.ts";

export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "rulebook:adopt");
  const input = await readJson(request, adoptSchema, "adoption");
  return json(await adoptVersion(actor, params.id ?? "", input), 201);
});
