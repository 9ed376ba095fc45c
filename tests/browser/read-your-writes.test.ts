// Against the built server over HTTP: the server remembers who is asking and a measure's tree
// between requests (src/lib/server/context.ts, chamber-memory.ts), yet a write is seen by the
// very next request, whichever server process answers it: a remembered value is used only once
// the process has heard every notice committed before the request (caughtUp in
// src/lib/server/notices.ts). `npm test` serves these tests with two processes
// (GAVELWRIGHT_WORKERS=2), where the next request often lands on the other process; without
// caughtUp this failed within a few rounds there. Common practice ("read your writes"), no source.
import { describe, expect, it } from "vitest";
import { account, BASE_URL } from "./browser.ts";

async function signIn(role: string): Promise<string> {
  const a = account(role);
  const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE_URL }, body: JSON.stringify({ email: a.email, password: a.password }) });
  expect(r.status).toBe(200);
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

describe("read your writes on a server that remembers", () => {
  it("an override recorded or revoked shows in the tree on the next request, every time", async () => {
    const cookie = await signIn("chief-clerk");
    const headers = { cookie, origin: BASE_URL, "content-type": "application/json" };
    const measures = await (await fetch(`${BASE_URL}/api/measures`, { headers })).json();
    const hca12 = measures.measures.find((m: { number: string }) => m.number === "HCA 12");
    expect(hca12, "the demo measure HCA 12").toBeTruthy();
    const treeUrl = `${BASE_URL}/api/measures/${hca12.id}/tree`;
    const tree = async () => (await fetch(treeUrl, { headers })).json();
    const first = await tree();
    const f = first.findings.find((x: { amendmentId: string | null; overridden: boolean }) => x.amendmentId && !x.overridden);
    expect(f, "the demo tree has a finding not yet overridden").toBeTruthy();
    const version = first.nodes.find((n: { id: string }) => n.id === f.amendmentId).version;
    const findingOf = (t: { findings: Array<{ amendmentId: string; code: string; overrideId: string | null }> }) => t.findings.find((x) => x.amendmentId === f.amendmentId && x.code === f.code)!;

    for (let i = 0; i < 20; i++) {
      const made = await fetch(`${BASE_URL}/api/measures/${hca12.id}/overrides`, { method: "POST", headers, body: JSON.stringify({ amendmentId: f.amendmentId, code: f.code, version, rulingRef: `Read-your-writes check ${i}` }) });
      expect(made.status).toBe(201);
      const o = await made.json();
      expect(findingOf(await tree()).overrideId, `round ${i}: the override just recorded`).toBe(o.id);
      expect((await fetch(`${BASE_URL}/api/measures/${hca12.id}/overrides/${o.id}`, { method: "DELETE", headers })).status).toBe(200);
      expect(findingOf(await tree()).overrideId, `round ${i}: the override just revoked`).toBeNull();
    }
  });
});
