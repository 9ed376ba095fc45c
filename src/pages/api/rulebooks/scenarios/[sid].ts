import { requireActor, route } from "../../../../lib/server/http.ts";
import { removeScenario } from "../../../../lib/server/services/scenarios.ts";

export const DELETE = route(async ({ locals, params }) => removeScenario(requireActor(locals, "rulebook:edit"), params.sid ?? ""));
