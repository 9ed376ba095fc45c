import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { startAnalysis, startSchema } from "../../../../lib/server/services/analysis.ts";

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "chamber:read");
  return Response.json(await startAnalysis(actor, await readJson(request, startSchema, "analysis request")), { status: 202 });
});
