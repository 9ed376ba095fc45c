import { json, readJson, requireActor, route } from "../../../../../../lib/server/http.ts";
import { correctJournal, correctJournalSchema } from "../../../../../../lib/server/services/journal.ts";

/** A correction of the approved journal: regenerated from the floor record as it now stands, with the reason. */
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "floor:record");
  return json(await correctJournal(actor, params.id ?? "", await readJson(request, correctJournalSchema, "correction")), 201);
});
