import { route, requireActor } from "../../../../lib/server/http.ts";
import { restoreMember } from "../../../../lib/server/services/people.ts";

// Restore a removed person (by account id) with the role they held.
export const POST = route(async ({ locals, params }) => restoreMember(requireActor(locals, "people:assign-role"), params.id ?? ""));
