// Issue 17, item 2 (the probe's case): the sign-in and sign-up pages hand AccountForm only a page of
// this app as `next`. `/sign-in?next=/\evil.example/phish` used to pass the check
// `startsWith("/") && !startsWith("//")` and, after a genuine sign-in, the browser went to
// http://evil.example/phish. The pages are rendered with Astro's container; the island's props
// carry the `next` the browser would follow. (Common practice, no source: OWASP "Unvalidated
// Redirects and Forwards Cheat Sheet", paraphrase.)
import { experimental_AstroContainer as AstroContainer } from "astro/container";
import reactRenderer from "@astrojs/react/server.js";
import { describe, expect, it } from "vitest";
import SignIn from "../../../src/pages/sign-in.astro";
import SignUp from "../../../src/pages/sign-up.astro";

const ORIGIN = "http://127.0.0.1:4399";
const locals = { user: null, session: null, chamber: null, role: null, chambers: [], requestId: "test" };

/** The `next` prop AccountForm is rendered with on `page` for this query string. */
async function nextProp(page: typeof SignIn, path: string, next: string): Promise<string> {
  const container = await AstroContainer.create();
  container.addServerRenderer({ renderer: reactRenderer, name: "@astrojs/react" });
  container.addClientRenderer({ name: "@astrojs/react", entrypoint: "@astrojs/react/client.js" });
  const html = await container.renderToString(page, { request: new Request(`${ORIGIN}${path}?next=${encodeURIComponent(next)}`), locals });
  const props = /<astro-island[^>]*props="([^"]*)"/.exec(html)?.[1];
  if (!props) throw new Error("no island in the page");
  const decoded = JSON.parse(props.replace(/&quot;/g, '"').replace(/&amp;/g, "&").replace(/&#39;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">")) as Record<string, [number, unknown]>;
  return decoded.next[1] as string;
}

const HOSTILE = ["/\\evil.example/phish", "/%5Cevil.example", "//evil.example", "\\/evil.example", "/\t/evil.example", "/\n/evil.example", "javascript:alert(1)", "https://evil.example/"];

describe("after sign-in and sign-up, only a page of this app", () => {
  for (const next of HOSTILE) {
    it(`sign-in refuses ${JSON.stringify(next)}`, async () => {
      expect(await nextProp(SignIn, "/sign-in", next)).toBe("/");
    });
    it(`sign-up refuses ${JSON.stringify(next)}`, async () => {
      expect(await nextProp(SignUp, "/sign-up", next)).toBe("/chambers");
    });
  }
  it("keeps a page of the app (the invitation a sign-up comes from)", async () => {
    expect(await nextProp(SignUp, "/sign-up", "/invitations/abc123")).toBe("/invitations/abc123");
    expect(await nextProp(SignIn, "/sign-in", "/rulebooks/compare?a=1")).toBe("/rulebooks/compare?a=1");
  });
});
