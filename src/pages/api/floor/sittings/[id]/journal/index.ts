import { json, parseQuery, readJson, requireActor, route } from "../../../../../../lib/server/http.ts";
import { approveJournal, approveSchema, getJournal, journalFile, journalQuerySchema } from "../../../../../../lib/server/services/journal.ts";
import { GavelError } from "../../../../../../lib/errors.ts";
import { sittingExists } from "../../../../../../lib/server/services/floor.ts";

/** The journal (JSON: the approved record and the draft from the floor record), or a file: ?format=pdf|docx|md. */
export const GET = route(async ({ locals, params, url }) => {
  const actor = requireActor(locals, "chamber:read");
  const q = parseQuery(url, journalQuerySchema);
  return q.format === "json" ? getJournal(actor, params.id ?? "") : journalFile(actor, params.id ?? "", q.format);
});

/** Approve the journal as generated from the floor record at `revision`. */
export const POST = route(async ({ locals, request, params }) => {
  const actor = requireActor(locals, "floor:record");
  return json(await approveJournal(actor, params.id ?? "", await readJson(request, approveSchema, "approval")), 201);
});

const notEdited = () => {
  throw new GavelError("conflict", "A journal is never edited. Once approved it is changed only by a correction, with the reason (POST …/journal/corrections).", { issues: [{ path: "journal", message: "not editable" }] });
};
export const PUT = route(async ({ locals, params }) => {
  await sittingExists(requireActor(locals, "floor:record"), params.id ?? "");
  notEdited();
});
