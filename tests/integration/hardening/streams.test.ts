// Issue 17, item 6: a per-user cap on open live-floor event streams (src/lib/server/stream-slots.ts;
// GAVELWRIGHT_MAX_STREAMS_PER_USER, default 8 per server process). The probe found none: one
// account could hold any number of connections, subscribers and timers. A slot is given back when
// the stream ends, however it ends. Common practice, no source; the number is ours.
import type { APIContext } from "astro";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as sittingsRoute from "../../../src/pages/api/floor/sittings/index.ts";
import * as streamRoute from "../../../src/pages/api/floor/sittings/[id]/stream.ts";
import { DEMO_SITTING_TITLE, seedRulebooks } from "../../../src/lib/server/seed/rulebooks.ts";
import { loadContext } from "../../../src/lib/server/context.ts";
import { maxStreamsPerUser, openStreams } from "../../../src/lib/server/stream-slots.ts";
import { BASE, call, type Session } from "../../support/app.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";

let s: Seeded;
let sittingId: string;
const opened: Array<{ reader: ReadableStreamDefaultReader<Uint8Array>; abort: AbortController }> = [];

beforeAll(async () => {
  s = await seedChambers();
  await seedRulebooks();
  const r = await call(sittingsRoute.GET, "GET", "/api/floor/sittings", { as: s.as.member });
  sittingId = r.body.sittings.find((x: { title: string }) => x.title === DEMO_SITTING_TITLE).id;
});
afterAll(async () => {
  for (const o of opened) await o.reader.cancel().catch(() => {});
});

/** Open the stream as `who` (the route called as the middleware would); the status, and the first event when it is open. */
async function openStream(who: Session): Promise<{ status: number; first?: string; body?: any; reader?: ReadableStreamDefaultReader<Uint8Array>; abort: AbortController }> {
  const abort = new AbortController();
  const url = new URL(`/api/floor/sittings/${sittingId}/stream`, BASE);
  const headers = new Headers({ cookie: who.cookie });
  const request = new Request(url, { headers, signal: abort.signal });
  const locals = { ...(await loadContext(headers)), requestId: "test" };
  const res = await streamRoute.GET({ request, url, params: { id: sittingId }, locals } as unknown as APIContext);
  if (res.status !== 200) return { status: res.status, body: await res.json(), abort };
  const reader = res.body!.getReader();
  const { value } = await reader.read();
  opened.push({ reader, abort });
  return { status: 200, first: new TextDecoder().decode(value), reader, abort };
}

describe("open live-floor streams per user", () => {
  it("refuses one stream more than the cap (429 rate-limited), for that user only, and gives a slot back when a stream ends", async () => {
    const cap = maxStreamsPerUser();
    expect(cap).toBe(8);
    const mine = [];
    for (let i = 0; i < cap; i++) {
      const r = await openStream(s.as.clerk);
      expect(r.status).toBe(200);
      expect(r.first).toContain("event: ready");
      mine.push(r);
    }
    expect(openStreams(s.as.clerk.userId)).toBe(cap);
    const refused = await openStream(s.as.clerk);
    expect(refused).toMatchObject({ status: 429, body: { error: { code: "rate-limited" } } });
    // Another user is not affected.
    expect((await openStream(s.as.member)).status).toBe(200);
    // The reader goes away (the browser tab closes): the slot comes back.
    await mine[0]!.reader!.cancel();
    expect(openStreams(s.as.clerk.userId)).toBe(cap - 1);
    expect((await openStream(s.as.clerk)).status).toBe(200);
    // The connection is aborted: the slot comes back too.
    mine[1]!.abort.abort();
    await expect.poll(() => openStreams(s.as.clerk.userId)).toBe(cap - 1);
    expect((await openStream(s.as.clerk)).status).toBe(200);
  });
});
