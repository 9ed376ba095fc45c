import { route, requireActor } from "../../../../lib/server/http.ts";
import { listRemoved } from "../../../../lib/server/services/people.ts";

// People removed from the chamber and not back since (the chief clerk may restore them).
export const GET = route(async ({ locals }) => listRemoved(requireActor(locals, "people:assign-role")));
