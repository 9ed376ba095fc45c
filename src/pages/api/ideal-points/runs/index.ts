import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { startIdealJob } from "../../../../lib/server/ideal-points/jobs.ts";
import { idealPointsInputSchema } from "../../../../lib/ideal-points/ideal-points.ts";

/** Start estimating ideal points in a worker: the input is checked here (400 naming the field), the rest (ids, direction) in the worker. */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "estimate:create");
  const input = await readJson(request, idealPointsInputSchema, "estimate request", 16 * 1024 * 1024);
  return Response.json(startIdealJob({ userId: actor.user.id, chamberId: actor.chamber.id }, input), { status: 202 });
});
