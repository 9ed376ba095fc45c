import { requireActor, route } from "../../../../lib/server/http.ts";
import { getMeasureAudit } from "../../../../lib/server/services/measures.ts";

export const GET = route(async ({ locals, params }) => getMeasureAudit(requireActor(locals, "chamber:read"), params.id ?? ""));
