import { requireActor, route } from "../../../../lib/server/http.ts";
import { templateDocument } from "../../../../lib/server/services/rulebooks.ts";

export const GET = route(async ({ locals, params }) => {
  requireActor(locals, "chamber:read");
  return templateDocument(params.id ?? "");
});
