import { requireActor, route } from "../../../../lib/server/http.ts";
import { cancelIdealJob, idealJob } from "../../../../lib/server/ideal-points/jobs.ts";

const owner = (locals: App.Locals) => {
  const a = requireActor(locals, "estimate:create");
  return { userId: a.user.id, chamberId: a.chamber.id };
};
export const GET = route(async ({ locals, params }) => idealJob(params.id ?? "", owner(locals)));
export const DELETE = route(async ({ locals, params }) => cancelIdealJob(params.id ?? "", owner(locals)));
