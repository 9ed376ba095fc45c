import { requireActor, route } from "../../../../../lib/server/http.ts";
import { getAttachment } from "../../../../../lib/server/services/measures.ts";

// Download an uploaded document. Served as an attachment so the browser never renders it inline.
export const GET = route(async ({ locals, params }) => {
  const a = await getAttachment(requireActor(locals, "chamber:read"), params.id ?? "", params.aid ?? "");
  return new Response(new Uint8Array(a.bytes), {
    headers: { "content-type": a.mediaType, "content-length": String(a.size), "content-disposition": `attachment; filename="${a.filename.replace(/"/g, "")}"`, "cache-control": "private, no-store" },
  });
});
