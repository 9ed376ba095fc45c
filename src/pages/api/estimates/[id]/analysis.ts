import { requireActor, route } from "../../../../lib/server/http.ts";
import { latestRun } from "../../../../lib/server/services/analysis.ts";

export const GET = route(async ({ locals, params }) => latestRun(requireActor(locals, "chamber:read"), params.id ?? ""));
