import { readJson, requireActor, route } from "../../lib/server/http.ts";
import { legalMovesFor, movesRequestSchema } from "../../lib/server/services/floor.ts";

export const POST = route(async ({ locals, request }) => {
  const actor = requireActor(locals, "chamber:read");
  return legalMovesFor(actor, await readJson(request, movesRequestSchema, "legal-moves question", 256 * 1024));
});
