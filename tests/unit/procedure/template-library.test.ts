/**
 * The rulebook library's template list (issue 14): each template shows the text it follows, the date
 * of that text and its "verify before use" points, in the clerk's words — no file ids on the screen.
 * Product contract (common practice, no source).
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { originLabel, TemplateEntry } from "../../../src/components/rulebooks/RulebookLibrary.tsx";
import { templateMetaSchema } from "../../../src/components/rulebooks/schemas.ts";
import { rulebookTemplates } from "../../../src/lib/server/rulebook-templates.ts";
import { TEMPLATE_ALIASES } from "../../../src/lib/procedure/template-ids.ts";

const ENTITIES: Record<string, string> = { "&#x27;": "'", "&quot;": '"', "&amp;": "&", "&lt;": "<", "&gt;": ">" };
const visibleText = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&#x27;|&quot;|&amp;|&lt;|&gt;/g, (e) => ENTITIES[e]!);

describe("template library entries", async () => {
  const templates = (await rulebookTemplates()).map((t) => templateMetaSchema.parse({ id: t.id, title: t.title, chamber: t.chamber, aliases: t.aliases, source: t.source, verify: t.verify }));

  it("lists every shipped template once, under its current id", () => {
    const ids = templates.map((t) => t.id);
    expect(ids).toEqual(expect.arrayContaining(["continental", "westminster", "general-parliamentary-law", "demo-chamber"]));
    for (const old of Object.keys(TEMPLATE_ALIASES)) expect(ids).not.toContain(old);
  });

  it("shows the source, the date of the text and the verify-before-use list, and no hyphenated file id", () => {
    for (const t of templates) {
      const text = visibleText(renderToStaticMarkup(createElement(TemplateEntry, { t })));
      expect(text).toContain(t.title);
      if (t.source) expect(text).toContain(t.source.title);
      if (t.source?.date) expect(text).toContain(t.source.date);
      for (const v of t.verify) expect(text).toContain(v.slice(0, 40));
      for (const id of [...templates.map((x) => x.id), ...Object.keys(TEMPLATE_ALIASES)].filter((x) => x.includes("-"))) expect(text, `${t.id} shows ${id}`).not.toContain(id);
    }
  });

  it("the Westminster and continental entries carry a date and a verify-before-use list", () => {
    for (const id of ["westminster", "continental"]) {
      const t = templates.find((x) => x.id === id)!;
      expect(t.source?.date, id).toBeTruthy();
      expect(t.verify.length, id).toBeGreaterThan(3);
    }
  });

  it("names a version's origin by the template's title, old ids included", () => {
    const ep = templates.find((t) => t.id === "continental")!;
    expect(originLabel("template:continental-successive", templates)).toBe(`from the template “${ep.title}”`);
    expect(originLabel("template:no-such-template", templates)).toBe("from a template");
    expect(originLabel("edit", templates)).toBeNull();
  });
});
