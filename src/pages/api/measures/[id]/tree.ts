import { requireActor, route } from "../../../../lib/server/http.ts";
import { treeOf } from "../../../../lib/server/services/trees.ts";

export const GET = route(async ({ locals, params }) => treeOf(requireActor(locals, "chamber:read"), params.id ?? ""));
