import { z } from "zod";
import { readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { startIdealJob } from "../../../../lib/server/ideal-points/jobs.ts";

/** Start estimating ideal points in a worker; the core validates the input (errors come back on the job). */
export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "estimate:create");
  const input = await readJson(request, z.record(z.string(), z.unknown()), "estimate request", 16 * 1024 * 1024);
  return Response.json(startIdealJob({ userId: actor.user.id, chamberId: actor.chamber.id }, input), { status: 202 });
});
