// Issue 17, item 2: `next` after sign-in or sign-up only ever names a page of this app on its own
// origin. The bypasses are the usual ones for open redirects (common practice, no source: OWASP
// "Unvalidated Redirects and Forwards Cheat Sheet", paraphrase; the WHATWG URL Standard's
// basic URL parser strips tabs and newlines and reads "\" as "/" in special schemes, paraphrase).
import { describe, expect, it } from "vitest";
import { isAppPage, safeNext } from "../../../src/lib/safe-next.ts";

const ORIGIN = "http://127.0.0.1:4399";

describe("safeNext: where to go after signing in", () => {
  it("keeps a page of this app, with its query and fragment", () => {
    expect(safeNext("/", ORIGIN)).toBe("/");
    expect(safeNext("/measures", ORIGIN)).toBe("/measures");
    expect(safeNext("/rulebooks/compare?a=1&b=2", ORIGIN)).toBe("/rulebooks/compare?a=1&b=2");
    expect(safeNext("/invitations/Ab12_cd-34", ORIGIN)).toBe("/invitations/Ab12_cd-34");
    expect(safeNext("/measures/6f1c2d0e-1111-4222-8333-944455566677/tree#a3", ORIGIN)).toBe("/measures/6f1c2d0e-1111-4222-8333-944455566677/tree#a3");
  });

  // The probe's case: `/\evil.example/phish` passed `startsWith("/") && !startsWith("//")`, and the
  // browser, reading "\" as "/", went to http://evil.example/phish.
  const bypasses: Array<[string, string]> = [
    ["backslash after the slash", "/\\evil.example/phish"],
    ["two backslashes", "\\\\evil.example"],
    ["backslash then slash", "\\/evil.example"],
    ["slash then backslash then slash", "/\\/evil.example"],
    ["protocol-relative", "//evil.example/phish"],
    ["three slashes", "///evil.example"],
    ["encoded backslash, as the browser receives it once decoded", decodeURIComponent("/%5Cevil.example")],
    ["encoded backslash left encoded", "/%5Cevil.example"],
    ["encoded slash", "/%2F%2Fevil.example"],
    ["tab inside the slashes", "/\t/evil.example"],
    ["newline inside the slashes", "/\n/evil.example"],
    ["carriage return inside the slashes", "/\r/evil.example"],
    ["javascript: scheme", "javascript:alert(1)"],
    ["javascript: after a tab", "\tjavascript:alert(1)"],
    ["data: scheme", "data:text/html,<script>alert(1)</script>"],
    ["absolute URL elsewhere", "https://evil.example/phish"],
    ["absolute URL on this origin (only paths are taken)", `${ORIGIN}/measures`],
    ["user info trick", "/@evil.example"],
    ["path that is not a page", "/api/auth/sign-out"],
    ["another page-looking path the app does not serve", "/evil.example/phish"],
    ["sign-in itself (a loop)", "/sign-in"],
    ["relative path without a slash", "evil.example"],
    ["dot segments that climb to an API route", "/measures/../api/moves"],
    ["NUL", "/measures\u0000"],
    ["empty", ""],
  ];
  for (const [name, next] of bypasses) {
    it(`refuses ${name}`, () => {
      expect(safeNext(next, ORIGIN, "/fallback")).toBe("/fallback");
    });
  }

  it("refuses an overlong value and a missing one", () => {
    expect(safeNext(`/measures?q=${"a".repeat(3000)}`, ORIGIN)).toBe("/");
    expect(safeNext(null, ORIGIN)).toBe("/");
    expect(safeNext(undefined, ORIGIN, "/chambers")).toBe("/chambers");
  });

  it("whatever it returns resolves to this origin when the browser follows it", () => {
    for (const [, next] of bypasses) expect(new URL(safeNext(next, ORIGIN), ORIGIN).origin).toBe(ORIGIN);
  });

  it("knows the app's pages", () => {
    expect(isAppPage("/floor/moves")).toBe(true);
    expect(isAppPage("/orders/abc/script")).toBe(true);
    expect(isAppPage("/api/moves")).toBe(false);
    expect(isAppPage("/_astro/x.js")).toBe(false);
  });
});

describe("the list of pages safeNext accepts follows src/pages", () => {
  it("every page file (with a sample id) is accepted, except those one is never sent back to", async () => {
    const { readdirSync } = await import("node:fs");
    const { join, relative, sep } = await import("node:path");
    const NOT_A_DESTINATION = new Set(["/sign-in", "/sign-up", "/reset-password", "/unsubscribe", "/not-permitted", "/404"]);
    const paths: string[] = [];
    const walk = (dir: string) => {
      for (const e of readdirSync(dir, { withFileTypes: true })) {
        const p = join(dir, e.name);
        if (e.isDirectory()) walk(p);
        else if (p.endsWith(".astro")) {
          const path = "/" + relative("src/pages", p).split(sep).join("/").replace(/\.astro$/, "").replace(/(^|\/)index$/, "").replace(/\[[^\]]+\]/g, "Ab12-cd_34");
          paths.push(path === "/" ? "/" : path.replace(/\/$/, ""));
        }
      }
    };
    walk("src/pages");
    expect(paths.length).toBeGreaterThan(20);
    for (const p of paths) expect(isAppPage(p), p).toBe(!NOT_A_DESTINATION.has(p));
  });
});
