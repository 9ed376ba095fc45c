/**
 * The content security policy. Scripts: only files from this origin, plus the inline scripts
 * Astro itself writes into a page with an island (the island loader and the `client:load`
 * directive), allowed by their SHA-256 hashes: no 'unsafe-inline', so an injected inline
 * script does not run. The hashed texts come from the installed Astro (its prebuilt runtime
 * strings), so an Astro upgrade changes the hashes with it; the test
 * tests/integration/hardening/csp.test.ts renders a page and checks every inline script in it
 * is covered, and that no page or component carries an inline script of its own (put page
 * scripts in public/ and load them with `<script is:inline src=…>`).
 *
 * Styles keep 'unsafe-inline': React and the flow diagrams set style attributes.
 */
import { createHash } from "node:crypto";
import islandScript from "astro/runtime/server/astro-island.prebuilt.js";
import islandScriptDev from "astro/runtime/server/astro-island.prebuilt-dev.js";
import idleDirective from "astro/runtime/client/idle.prebuilt.js";
import loadDirective from "astro/runtime/client/load.prebuilt.js";
import mediaDirective from "astro/runtime/client/media.prebuilt.js";
import onlyDirective from "astro/runtime/client/only.prebuilt.js";
import visibleDirective from "astro/runtime/client/visible.prebuilt.js";

/** `'sha256-…'` of a script's text, as a CSP source expression. */
export function scriptHash(text: string): string {
  return `'sha256-${createHash("sha256").update(text, "utf8").digest("base64")}'`;
}

/** The inline scripts Astro writes for islands (every client directive, production and development loaders). */
export const ASTRO_INLINE_SCRIPTS: readonly string[] = [islandScript, islandScriptDev, loadDirective, idleDirective, visibleDirective, mediaDirective, onlyDirective];

export const SCRIPT_SRC = ["'self'", ...ASTRO_INLINE_SCRIPTS.map(scriptHash)].join(" ");

/**
 * The policy for a response. `astro dev` (NODE_ENV=development) keeps 'unsafe-inline' for
 * scripts, since Vite and the React refresh preamble write inline scripts there; a build never does.
 */
export function contentSecurityPolicy(development = process.env.NODE_ENV === "development"): string {
  return development ? CONTENT_SECURITY_POLICY.replace(`script-src ${SCRIPT_SRC}`, "script-src 'self' 'unsafe-inline'") : CONTENT_SECURITY_POLICY;
}

export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  `script-src ${SCRIPT_SRC}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "frame-ancestors 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "object-src 'none'",
].join("; ");
