import { z } from "zod";
import { safe } from "../../../lib/schema-parts.ts";
import { parseQuery, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { createEstimate, createEstimateSchema, listEstimates } from "../../../lib/server/services/estimates.ts";

export const GET = route(async ({ locals, url }) => listEstimates(requireActor(locals, "chamber:read"), parseQuery(url, z.object({ measureId: safe(z.string().max(100)).optional() })).measureId));
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return Response.json(await createEstimate(actor, await readJson(request, createEstimateSchema, "estimate")), { status: 201 });
});
