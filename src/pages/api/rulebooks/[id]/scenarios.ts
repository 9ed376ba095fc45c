import { requireActor, route } from "../../../../lib/server/http.ts";
import { versionBench } from "../../../../lib/server/services/scenarios.ts";

/** The chamber's scenarios run against this version, and which changed verdict against the version in force. */
export const GET = route(async ({ locals, params }) => versionBench(requireActor(locals, "chamber:read"), params.id ?? ""));
