import { requireActor, route } from "../../../lib/server/http.ts";
import { draftingOptions } from "../../../lib/server/services/rulings.ts";

export const prerender = false;

/** Choices for the drafting form: legislators, measures, amendments, sittings, citable rules, earlier rulings. */
export const GET = route(async ({ locals }) => draftingOptions(requireActor(locals, "ruling:draft")));
