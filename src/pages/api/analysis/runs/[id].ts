import { requireActor, route } from "../../../../lib/server/http.ts";
import { cancelRun, getRun } from "../../../../lib/server/services/analysis.ts";

export const GET = route(async ({ locals, params }) => getRun(requireActor(locals, "chamber:read"), params.id ?? ""));
export const DELETE = route(async ({ locals, params }) => cancelRun(requireActor(locals, "chamber:read"), params.id ?? ""));
