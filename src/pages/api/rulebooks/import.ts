import { json, requireActor, route } from "../../../lib/server/http.ts";
import { importVersion } from "../../../lib/server/services/rulebooks.ts";

export const POST = route(async ({ locals, request }) => json(await importVersion(requireActor(locals, "rulebook:edit"), request), 201));
