// Issue 17, item 6: the content security policy has no 'unsafe-inline' for scripts; the inline
// scripts Astro writes for islands are allowed by hash (src/lib/server/csp.ts). The probe found
// `script-src 'self' 'unsafe-inline'`. A page with islands is rendered with Astro's container and
// every inline script in it must be covered by a hash in the policy the middleware sends; no page
// or component may carry an inline script or event-handler attribute of its own.
// (W3C Content Security Policy Level 3, "hash-source" and "script-src", paraphrase.)
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import type { APIContext } from "astro";
import { experimental_AstroContainer as AstroContainer } from "astro/container";
import reactRenderer from "@astrojs/react/server.js";
import { describe, expect, it } from "vitest";
import SignIn from "../../../src/pages/sign-in.astro";
import { onRequest } from "../../../src/middleware.ts";
import { contentSecurityPolicy, scriptHash } from "../../../src/lib/server/csp.ts";
import { BASE } from "../../support/app.ts";

const locals = { user: null, session: null, chamber: null, role: null, chambers: [], requestId: "test" };

async function policyFromMiddleware(): Promise<string> {
  const url = new URL("/sign-in", BASE);
  const res = (await onRequest({ request: new Request(url), url, locals: {}, params: {} } as unknown as APIContext, async () => new Response("<!doctype html>", { headers: { "content-type": "text/html" } }))) as Response;
  return res.headers.get("content-security-policy")!;
}
const directive = (policy: string, name: string) => policy.split(";").map((d) => d.trim()).find((d) => d.startsWith(`${name} `)) ?? "";

describe("content security policy", () => {
  it("allows scripts from this origin and by hash only: no 'unsafe-inline', no 'unsafe-eval'", async () => {
    const scriptSrc = directive(await policyFromMiddleware(), "script-src");
    expect(scriptSrc).toMatch(/^script-src 'self'( 'sha256-[A-Za-z0-9+/]+=*')+$/);
    expect(scriptSrc).not.toContain("unsafe");
  });

  it("covers every inline script of a page with an island (the island loader and client:load)", async () => {
    const container = await AstroContainer.create();
    container.addServerRenderer({ renderer: reactRenderer, name: "@astrojs/react" });
    container.addClientRenderer({ name: "@astrojs/react", entrypoint: "@astrojs/react/client.js" });
    const html = await container.renderToString(SignIn, { request: new Request(`${BASE}/sign-in`), locals });
    const inline = [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!);
    expect(inline.length).toBeGreaterThanOrEqual(2); // the directive and the island loader
    const scriptSrc = directive(await policyFromMiddleware(), "script-src");
    for (const text of inline) expect(scriptSrc, `inline script not allowed: ${text.slice(0, 80)}…`).toContain(scriptHash(text));
  });

  it("no page, layout or component has an inline script or an on…= handler attribute of its own", () => {
    const offenders: string[] = [];
    const walk = (dir: string) => {
      for (const e of readdirSync(dir, { withFileTypes: true })) {
        const p = join(dir, e.name);
        if (e.isDirectory()) walk(p);
        else if (p.endsWith(".astro")) {
          const text = readFileSync(p, "utf8");
          for (const m of text.matchAll(/<script\b([^>]*)>/g)) if (!/\bsrc=/.test(m[1]!)) offenders.push(`${p}: inline <script>`);
          if (/<[a-z][^>]*\son[a-z]+=["{]/i.test(text)) offenders.push(`${p}: on…= attribute`);
        }
      }
    };
    walk("src");
    expect(offenders).toEqual([]);
  });

  it("astro dev keeps 'unsafe-inline' (Vite writes inline scripts there); a build never does", () => {
    expect(directive(contentSecurityPolicy(true), "script-src")).toBe("script-src 'self' 'unsafe-inline'");
    expect(directive(contentSecurityPolicy(false), "script-src")).not.toContain("unsafe-inline");
  });
});
