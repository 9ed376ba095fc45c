/** Shared test helpers: load a shipped rulebook template as raw JSON or parsed. */
import { existsSync, readFileSync } from "node:fs";
import { resolve } from "node:path";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import type { Rulebook } from "../../../src/lib/procedure/rulebook-schema.ts";
import { templateIdCandidates } from "../../../src/lib/procedure/template-ids.ts";

export const TEMPLATE_IDS = ["general-parliamentary-law", "us-house", "us-senate", "continental", "westminster", "demo-chamber"] as const;

/** The shipped file for a template id; an old id resolves as the CLI and the server resolve it (template-ids.ts). */
export function templatePath(id: string): string {
  const files = templateIdCandidates(id).map((c) => resolve(import.meta.dirname, "../../../rulebooks", `${c}.json`));
  return files.find((f) => existsSync(f)) ?? files[0]!;
}

export function rawTemplate(id: string): any {
  return JSON.parse(readFileSync(templatePath(id), "utf8"));
}

export function template(id: string): Rulebook {
  return parseRulebook(rawTemplate(id));
}
