/**
 * The rulebook templates shipped in rulebooks/*.json, offered to clerks as starting points.
 * Read from the project folder (the app, the seed and the tests all start there, as with
 * drizzle/); RULEBOOKS_DIR overrides it. Each file is checked with the same parser as an upload.
 */
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { GavelError } from "../errors.ts";
import { parseRulebookText } from "../procedure/parse-rulebook.ts";
import { listedTemplateIds, templateAliases, templateIdCandidates, templateIdOfFile } from "../procedure/template-ids.ts";

export interface TemplateSource {
  title: string;
  edition?: string;
  date?: string;
  license?: string;
  url?: string;
  note?: string;
}

export interface RulebookTemplate {
  id: string;
  title: string;
  chamber: string;
  /** Older ids that still name this template (src/lib/procedure/template-ids.ts). */
  aliases: string[];
  /** The published text the template follows: title, edition, date of the text, licence. */
  source: TemplateSource;
  /** What a clerk should check against the chamber's own rules before adopting it. */
  verify: string[];
  /** The template as written in its file. */
  document: Record<string, unknown>;
}

const dir = () => process.env.RULEBOOKS_DIR ?? path.resolve("rulebooks");

let cache: Promise<RulebookTemplate[]> | null = null;

export function rulebookTemplates(): Promise<RulebookTemplate[]> {
  cache ??= (async () => {
    // Only rulebooks: `<id>.scenarios.json` files (the template's bench of scenarios) are not templates.
    const names = (await readdir(dir())).filter((n) => templateIdOfFile(n) !== null).sort();
    const out: RulebookTemplate[] = [];
    const listed = new Set(listedTemplateIds(names.map((n) => n.replace(/\.json$/, ""))));
    for (const n of names) {
      const id = n.replace(/\.json$/, "");
      if (!listed.has(id)) continue;
      const text = await readFile(path.join(dir(), n), "utf8");
      try {
        const parsed = parseRulebookText(text);
        const { title, edition, date, license, url, note, verify } = parsed.source;
        const source: TemplateSource = { title, edition, date, license, url, note };
        out.push({ id, title: parsed.title, chamber: parsed.chamber.name, aliases: templateAliases(id), source, verify, document: JSON.parse(text) as Record<string, unknown> });
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

/** A template by its id or by an old id it replaced (TEMPLATE_ALIASES). */
export async function rulebookTemplate(id: string): Promise<RulebookTemplate> {
  const all = await rulebookTemplates();
  const t = templateIdCandidates(id).map((c) => all.find((x) => x.id === c)).find((x) => x !== undefined);
  if (!t) throw new GavelError("not-found", `No rulebook template "${id}".`);
  return t;
}
