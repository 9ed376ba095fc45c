// The route inventory is complete: every route file under src/pages is listed with each
// handler it exports, nothing listed is gone, and docs/routes.md is rendered from it.
// Common practice, no source.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { API_ROUTES, PAGE_ROUTES } from "./route-inventory.ts";
import { renderRoutes } from "./render-routes.ts";

const PAGES = join(import.meta.dirname, "../../src/pages");

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? walk(p) : [relative(PAGES, p).split("\\").join("/")];
  });
}

const files = walk(PAGES).sort();

describe("route inventory", () => {
  it("lists every page file under src/pages", () => {
    const pages = files.filter((f) => /\.(astro|md|mdx|html)$/.test(f));
    expect(pages.length).toBeGreaterThan(10);
    expect(pages.filter((f) => !PAGE_ROUTES.some((r) => r.file === f))).toEqual([]);
  });

  it("lists every handler every API route file exports, and nothing else", () => {
    const api = files.filter((f) => /\.(ts|js|mjs)$/.test(f));
    expect(api.length).toBeGreaterThan(10);
    for (const f of api) {
      const text = readFileSync(join(PAGES, f), "utf8");
      const exported = [...text.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|ALL|HEAD|OPTIONS)\b/g)].map((m) => m[1]).sort();
      const listed = API_ROUTES.filter((r) => r.file === f).map((r) => r.method).sort();
      expect(listed, f).toEqual(exported);
    }
  });

  it("lists no file that does not exist", () => {
    for (const r of [...API_ROUTES, ...PAGE_ROUTES]) expect(files, r.file).toContain(r.file);
  });

  it("docs/routes.md is rendered from the inventory (npx tsx tests/access/render-routes.ts)", () => {
    expect(readFileSync(join(import.meta.dirname, "../../docs/routes.md"), "utf8")).toBe(renderRoutes());
  });
});
