/**
 * Which rulebook a chamber's amendment trees are validated under: the version it has adopted
 * (the rulebooks service), or, while it has adopted none, the shipped demo-chamber template,
 * labelled as such so nobody mistakes it for the chamber's own rules.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { isGavelError } from "../errors.ts";
import { parseRulebookText } from "../procedure/parse-rulebook.ts";
import type { Rulebook } from "../procedure/rulebook-schema.ts";
import { loadRulebook } from "./services/rulebooks.ts";

export interface TreeRulebook {
  rulebook: Rulebook;
  /** "adopted version N" or "template (no rulebook adopted)". */
  source: string;
  versionId: string | null;
}

let fallback: Promise<Rulebook> | null = null;
/** The shipped template used while a chamber has adopted no rulebook. */
export function templateRulebookFallback(): Promise<Rulebook> {
  fallback ??= readFile(path.resolve("rulebooks", "demo-chamber.json"), "utf8")
    .then(parseRulebookText)
    .catch((e) => {
      fallback = null;
      throw e;
    });
  return fallback;
}

export async function adoptedRulebookOf(chamberId: string): Promise<TreeRulebook> {
  try {
    const r = await loadRulebook(chamberId);
    return { rulebook: r.rulebook, source: `adopted version ${r.number}`, versionId: r.versionId };
  } catch (e) {
    if (!isGavelError(e) || e.code !== "not-found") throw e;
  }
  return { rulebook: await templateRulebookFallback(), source: "shipped template (this chamber has adopted no rulebook yet)", versionId: null };
}
