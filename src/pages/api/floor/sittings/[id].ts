import { requireActor, route } from "../../../../lib/server/http.ts";
import { getSitting } from "../../../../lib/server/services/floor.ts";

export const GET = route(async ({ locals, params }) => getSitting(requireActor(locals, "chamber:read"), params.id ?? ""));
