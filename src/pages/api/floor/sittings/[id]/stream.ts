/** Server-sent events: one "floor" event per recorded change to this sitting, from any app server. */
import { requireActor, route } from "../../../../../lib/server/http.ts";
import { subscribeFloor } from "../../../../../lib/server/floor-bus.ts";
import { sittingExists } from "../../../../../lib/server/services/floor.ts";
import { claimStreamSlot, maxStreamsPerUser } from "../../../../../lib/server/stream-slots.ts";
import { GavelError } from "../../../../../lib/errors.ts";

const HEARTBEAT_MS = 20_000;

export const GET = route(async ({ locals, params, request }) => {
  const actor = requireActor(locals, "chamber:read");
  const id = params.id ?? "";
  await sittingExists(actor, id);
  const release = claimStreamSlot(actor.user.id);
  if (!release) throw new GavelError("rate-limited", `You already have ${maxStreamsPerUser()} live floor views open. Close one (another tab or window), then reload this page.`);
  const encoder = new TextEncoder();
  let cleanup = release;
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (text: string) => {
        try {
          controller.enqueue(encoder.encode(text));
        } catch {
          cleanup();
        }
      };
      const unsubscribe = await subscribeFloor((n) => {
        if (n.chamberId === actor.chamber.id && n.sittingId === id) send(`event: floor\ndata: ${JSON.stringify({ revision: n.revision, kind: n.kind })}\n\n`);
      }).catch((e) => {
        release();
        throw e;
      });
      const beat = setInterval(() => send(": keep-alive\n\n"), HEARTBEAT_MS);
      cleanup = () => {
        release();
        clearInterval(beat);
        unsubscribe();
        try {
          controller.close();
        } catch {
          /* already closed */
        }
      };
      request.signal.addEventListener("abort", () => cleanup());
      if (request.signal.aborted) return cleanup();
      send("retry: 3000\nevent: ready\ndata: {}\n\n");
    },
    cancel() {
      cleanup();
    },
  });
  return new Response(stream, { headers: { "content-type": "text/event-stream; charset=utf-8", "cache-control": "no-store", "x-accel-buffering": "no" } });
});
