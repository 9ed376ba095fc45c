import { requireActor, route } from "../../../lib/server/http.ts";
import { listLegislators } from "../../../lib/server/services/measures.ts";

// The chamber's legislators: who may sponsor a measure or an amendment.
export const GET = route(async ({ locals }) => ({ legislators: await listLegislators(requireActor(locals, "chamber:read")) }));
