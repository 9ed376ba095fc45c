import { json, requireActor, route } from "../../../../lib/server/http.ts";
import { listChamberTexts, uploadChamberText } from "../../../../lib/server/services/chamber-text.ts";

export const GET = route(async ({ locals }) => ({ texts: await listChamberTexts(requireActor(locals, "chamber:read")) }));

export const POST = route(async ({ locals, request }) => json(await uploadChamberText(requireActor(locals, "rulebook:edit"), request), 201));
