import { requireActor, route } from "../../../lib/server/http.ts";
import { getVersion } from "../../../lib/server/services/rulebooks.ts";

export const GET = route(async ({ locals, params }) => getVersion(requireActor(locals, "chamber:read"), params.id ?? ""));
