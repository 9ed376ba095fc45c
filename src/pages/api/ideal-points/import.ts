import { readBody, requireActor, route } from "../../../lib/server/http.ts";
import { decodeRollCallCsv, MAX_ROLL_CALL_BYTES, parseRollCallCsv } from "../../../lib/ideal-points/roll-call-csv.ts";

/** A session's recorded votes from CSV (either layout) → members, blocs and roll calls, or row-precise errors. Nothing is stored. */
export const POST = route(async ({ locals, request }) => {
  requireActor(locals, "estimate:create");
  return parseRollCallCsv(decodeRollCallCsv(await readBody(request, MAX_ROLL_CALL_BYTES, "CSV file")));
});
