import { route, requireActor } from "../../../lib/server/http.ts";
import { peopleLog } from "../../../lib/server/services/people.ts";

// The people log: role changes, removals and restorations, newest first.
export const GET = route(async ({ locals }) => peopleLog(requireActor(locals, "people:assign-role")));
