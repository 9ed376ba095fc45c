/**
 * The rulebook templates shipped in rulebooks/*.json, offered to clerks as starting points.
 * Read from the project folder (the app, the seed and the tests all start there, as with
 * drizzle/); RULEBOOKS_DIR overrides it. Each file is checked with the same parser as an upload.
 */
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { GavelError } from "../errors.ts";
import { parseRulebookText } from "../procedure/parse-rulebook.ts";
import { resolveTemplateId } from "../procedure/template-aliases.ts";

export interface RulebookTemplate {
  id: string;
  title: string;
  chamber: string;
  /** The template as written in its file. */
  document: Record<string, unknown>;
}

const dir = () => process.env.RULEBOOKS_DIR ?? path.resolve("rulebooks");

let cache: Promise<RulebookTemplate[]> | null = null;

export function rulebookTemplates(): Promise<RulebookTemplate[]> {
  cache ??= (async () => {
    const names = (await readdir(dir())).filter((n) => n.endsWith(".json")).sort();
    const out: RulebookTemplate[] = [];
    for (const n of names) {
      const text = await readFile(path.join(dir(), n), "utf8");
      try {
        const parsed = parseRulebookText(text);
        out.push({ id: n.replace(/\.json$/, ""), title: parsed.title, chamber: parsed.chamber.name, document: JSON.parse(text) as Record<string, unknown> });
      } catch (e) {
        // A template being edited may be invalid for a moment; it is left out rather than breaking the app.
        console.error(`[rulebooks] template ${n} is not a valid rulebook:`, (e as Error).message);
      }
    }
    return out;
  })().catch((e) => {
    cache = null;
    throw e;
  });
  return cache;
}

/** One template by id; a former id (TEMPLATE_ALIASES) resolves to the template that replaced it. */
export async function rulebookTemplate(id: string): Promise<RulebookTemplate> {
  const current = resolveTemplateId(id);
  const t = (await rulebookTemplates()).find((x) => x.id === current);
  if (!t) throw new GavelError("not-found", `No rulebook template "${id}".`);
  return t;
}
