import { z } from "zod";
import { json, MAX_JSON_BYTES, parseQuery, readJson, requireActor, route } from "../../../../lib/server/http.ts";
import { addScenario, exportScenarios, importModeSchema, importScenarios } from "../../../../lib/server/services/scenarios.ts";

/** The bench as a "gavelwright.scenarios" file (docs/rulebook-format.md, "Scenarios"). */
export const GET = route(async ({ locals, url }) => {
  const file = await exportScenarios(requireActor(locals, "chamber:read"));
  if (url.searchParams.get("download") === null) return file;
  return new Response(JSON.stringify(file, null, 2) + "\n", { headers: { "content-type": "application/json; charset=utf-8", "content-disposition": 'attachment; filename="scenarios.json"', "cache-control": "no-store" } });
});

/** Add one scenario. */
export const POST = route(async ({ locals, request }) => json(await addScenario(requireActor(locals, "rulebook:edit"), await readJson(request, z.unknown(), "scenario")), 201));

/** Import a scenarios file: replaces the bench (?mode=append adds to it). All or nothing. */
export const PUT = route(async ({ locals, request, url }) => {
  const actor = requireActor(locals, "rulebook:edit");
  const { mode } = parseQuery(url, z.object({ mode: importModeSchema }));
  return importScenarios(actor, await readJson(request, z.unknown(), "scenarios file", MAX_JSON_BYTES * 4), mode);
});
