/**
 * Former ids of shipped rulebook templates. The table and the resolution rules live in one module,
 * template-ids.ts (TEMPLATE_ALIASES: four-amendment-legislature → us-house, continental-successive →
 * continental); this file keeps the name the US templates' branch imported.
 */
export { TEMPLATE_ALIASES, canonicalTemplateId as resolveTemplateId } from "./template-ids.ts";
