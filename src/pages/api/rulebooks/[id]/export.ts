import { requireActor, route } from "../../../../lib/server/http.ts";
import { exportVersion } from "../../../../lib/server/services/rulebooks.ts";

export const GET = route(async ({ locals, params }) => {
  const { filename, text } = await exportVersion(requireActor(locals, "chamber:read"), params.id ?? "");
  return new Response(text, { headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="${filename}"`, "cache-control": "no-store" } });
});
