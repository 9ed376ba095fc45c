/** Shared test helpers: load a shipped rulebook template as raw JSON or parsed. */
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import type { Rulebook } from "../../../src/lib/procedure/rulebook-schema.ts";

export const TEMPLATE_IDS = ["general-parliamentary-law", "four-amendment-legislature", "continental-successive", "demo-chamber"] as const;

export function templatePath(id: string): string {
  return resolve(import.meta.dirname, "../../../rulebooks", `${id}.json`);
}

export function rawTemplate(id: string): any {
  return JSON.parse(readFileSync(templatePath(id), "utf8"));
}

export function template(id: string): Rulebook {
  return parseRulebook(rawTemplate(id));
}
