/**
 * Render the route inventory (tests/access/route-inventory.ts) as docs/routes.md.
 * `npx tsx tests/access/render-routes.ts` rewrites the file; the inventory test checks it is current.
 */
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { API_ROUTES, PAGE_ROUTES, type Audience, type OutsiderRule } from "./route-inventory.ts";

const who = (a: Audience) => (a === "public" ? "anyone (no sign-in)" : a === "signed-in" ? "any signed-in user" : a.join(", "));
const outsider = (o: OutsiderRule) => (o === "refused" ? "refused (404)" : "own chamber only");
const cell = (s: string | undefined) => (s ?? "").replace(/\|/g, "\\|");

export function renderRoutes(): string {
  const lines = [
    "# Routes and who may use them",
    "",
    "Generated from `tests/access/route-inventory.ts` by `npx tsx tests/access/render-routes.ts`; do not edit by hand.",
    "`tests/access/inventory.test.ts` fails when a route file under `src/pages` is missing here; `tests/access/access.test.ts` (API)",
    "and `tests/browser/access.test.ts` (pages) sign in as every role not listed, as anonymous and as the other chamber's chief clerk",
    "and expect a refusal: 401 (not signed in), 403 (role), 404 (another chamber's record), or for pages a redirect to sign-in or away.",
    "",
    "Roles: chief-clerk, clerk, member, staff, observer (`src/lib/permissions.ts`). \"Other chamber\": what a signed-in user of another",
    "chamber gets when the request names this chamber's records (404 for a record in the path; 404 or 422 naming the field",
    "for a record named in the body or query).",
    "",
    "## API",
    "",
    "| method | path | roles allowed | other chamber | note |",
    "| --- | --- | --- | --- | --- |",
    ...API_ROUTES.map((r) => `| ${r.method} | \`${r.path}\` | ${who(r.audience)} | ${outsider(r.outsider)} | ${cell(r.note)} |`),
    "",
    "## Pages",
    "",
    "| path | roles allowed | other chamber | note |",
    "| --- | --- | --- | --- |",
    ...PAGE_ROUTES.map((r) => `| \`${r.path}\` | ${who(r.audience)} | ${outsider(r.outsider)} | ${cell(r.note)} |`),
    "",
  ];
  return lines.join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  writeFileSync(new URL("../../docs/routes.md", import.meta.url), renderRoutes());
  console.log("wrote docs/routes.md");
}
