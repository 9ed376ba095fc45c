import { route, requireActor } from "../../../lib/server/http.ts";
import { listPeople } from "../../../lib/server/services/people.ts";

export const GET = route(async ({ locals }) => listPeople(requireActor(locals, "chamber:read")));
