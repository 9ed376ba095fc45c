import { z } from "zod";
import { parseQuery, readJson, requireActor, route } from "../../../lib/server/http.ts";
import { createEstimate, createEstimateSchema, listEstimates } from "../../../lib/server/services/estimates.ts";

export const GET = route(async ({ locals, url }) => listEstimates(requireActor(locals, "chamber:read"), parseQuery(url, z.object({ measureId: z.uuid("must be a measure id").optional() })).measureId));
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "estimate:create");
  return Response.json(await createEstimate(actor, await readJson(request, createEstimateSchema, "estimate")), { status: 201 });
});
