import { GavelError } from "../../../../lib/errors.ts";
import { requireActor, route } from "../../../../lib/server/http.ts";
import { getChamberText } from "../../../../lib/server/services/chamber-text.ts";

/** One upload of the chamber's rules with its clauses; "latest" names the newest. */
export const GET = route(async ({ locals, params }) => {
  const id = params.textId ?? "";
  const text = await getChamberText(requireActor(locals, "chamber:read"), id === "latest" ? null : id);
  if (!text) throw new GavelError("not-found", "The chamber's rules have not been uploaded yet.");
  return text;
});
