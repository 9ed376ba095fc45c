/**
 * Template ids: the name each shipped template goes by (`rulebooks/<id>.json`) and the old names
 * kept as aliases. One table, read by the CLI (`rulebook: "<id>"` in a case file) and by the server
 * (the template list and `/api/rulebooks/templates/<id>`), so an old id keeps working wherever an id
 * is accepted. Pure data: no I/O here; callers ask whether a candidate file exists.
 *
 * An alias resolves to its current template when that file is shipped, and to its own file while the
 * renamed template has not yet landed (so the table can be written before the file is). A current id
 * likewise falls back to a file still shipped under an old name.
 */

/** Old id → current id. Add a line when a template is renamed; never remove one. */
export const TEMPLATE_ALIASES: Readonly<Record<string, string>> = Object.freeze({
  /** Re-derived from the Rules of the House of Representatives (issue 14, item 2). */
  "four-amendment-legislature": "us-house",
  /** Re-derived from the European Parliament's Rules of Procedure (issue 14, item 5). */
  "continental-successive": "continental",
});

/** The current id for `id` (itself when it is not an alias). */
export function canonicalTemplateId(id: string): string {
  return Object.prototype.hasOwnProperty.call(TEMPLATE_ALIASES, id) ? TEMPLATE_ALIASES[id]! : id;
}

/** The old ids that name the template `id` (an alias's own aliases included). */
export function templateAliases(id: string): string[] {
  const current = canonicalTemplateId(id);
  return Object.keys(TEMPLATE_ALIASES).filter((old) => TEMPLATE_ALIASES[old] === current);
}

/**
 * The file ids to try for a requested id, best first: the current template, the id as given,
 * then any older name of the same template. Duplicates removed.
 */
export function templateIdCandidates(id: string): string[] {
  const current = canonicalTemplateId(id);
  return [...new Set([current, id, ...templateAliases(current)])];
}

/**
 * Of the template files present (`ids`), the ones a library lists: a file shipped under an old
 * name is left out when the template it was renamed to is also present.
 */
export function listedTemplateIds(ids: readonly string[]): string[] {
  const present = new Set(ids);
  return ids.filter((id) => canonicalTemplateId(id) === id || !present.has(canonicalTemplateId(id)));
}

/** Scenario benches ship beside their template as `<id>.scenarios.json` (docs/rulebook-format.md, "Scenarios"). */
export const SCENARIOS_SUFFIX = ".scenarios.json";

/** The template id a file in rulebooks/ holds, or null for anything else (a scenarios file, a README). */
export function templateIdOfFile(name: string): string | null {
  if (!name.endsWith(".json") || name.endsWith(SCENARIOS_SUFFIX)) return null;
  return name.slice(0, -".json".length);
}
