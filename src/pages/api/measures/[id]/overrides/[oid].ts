import { requireActor, route } from "../../../../../lib/server/http.ts";
import { revokeOverride } from "../../../../../lib/server/services/trees.ts";

export const DELETE = route(async ({ locals, params }) => revokeOverride(requireActor(locals, "tree:override"), params.id ?? "", params.oid ?? ""));
