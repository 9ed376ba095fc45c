/** Shared test helpers: load a shipped rulebook template as raw JSON or parsed. */
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import type { Rulebook } from "../../../src/lib/procedure/rulebook-schema.ts";
import { resolveTemplateId } from "../../../src/lib/procedure/template-aliases.ts";

export const TEMPLATE_IDS = ["general-parliamentary-law", "us-house", "us-senate", "continental-successive", "demo-chamber"] as const;

/** The file of a shipped template; a former id (TEMPLATE_ALIASES) names the template that replaced it. */
export function templatePath(id: string): string {
  return resolve(import.meta.dirname, "../../../rulebooks", `${resolveTemplateId(id)}.json`);
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function rawTemplate(id: string): any {
  return JSON.parse(readFileSync(templatePath(id), "utf8"));
}

export function template(id: string): Rulebook {
  return parseRulebook(rawTemplate(id));
}
