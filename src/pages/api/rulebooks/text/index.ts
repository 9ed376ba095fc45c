import { z } from "zod";
import { json, parseQuery, requireActor, route } from "../../../../lib/server/http.ts";
import { getChamberText, listChamberTexts, uploadChamberText } from "../../../../lib/server/services/chamber-text.ts";

const querySchema = z.object({ id: z.uuid({ message: "must be the id of an upload of the chamber's rules" }).optional() });

/** Every upload of the chamber's rules, and one of them (`?id=`, else the latest) with its clauses; `text` is null before any upload. */
export const GET = route(async ({ locals, url }) => {
  const actor = requireActor(locals, "chamber:read");
  const q = parseQuery(url, querySchema);
  return { texts: await listChamberTexts(actor), text: await getChamberText(actor, q.id ?? null) };
});

export const POST = route(async ({ locals, request }) => json(await uploadChamberText(requireActor(locals, "rulebook:edit"), request), 201));
