import { requireActor, route } from "../../../lib/server/http.ts";
import { estimateOptions } from "../../../lib/server/services/estimates.ts";

export const GET = route(async ({ locals }) => estimateOptions(requireActor(locals, "chamber:read")));
