/**
 * Former ids of shipped rulebook templates (rulebooks/*.json) that must keep working after a
 * template was re-derived under a name saying what it follows (issue 14): case files, API calls
 * and stored version origins ("template:four-amendment-legislature") may still name them.
 * The CLI (`loadRulebookRef`) and the server (`rulebookTemplate`) resolve through this map;
 * the template library lists only the current ids.
 */
export const TEMPLATE_ALIASES: Readonly<Record<string, string>> = Object.freeze({
  /** The House template before it was re-derived from the Rules of the House (issue 14 item 2). */
  "four-amendment-legislature": "us-house",
});

/** The current id for a template id: itself, or what its former id now names. */
export function resolveTemplateId(id: string): string {
  return Object.hasOwn(TEMPLATE_ALIASES, id) ? TEMPLATE_ALIASES[id] : id;
}
