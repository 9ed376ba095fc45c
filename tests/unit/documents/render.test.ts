// The one document renderer (journal and chair's script): PDF text read back with pdf-parse, DOCX
// read with jszip; page numbers on every page; characters the bundled WOFF2 font cannot embed
// (accented letters, quotes) still reach the PDF.
import { describe, expect, it } from "vitest";
import JSZip from "jszip";
import { PDFParse } from "pdf-parse";
import { renderDocx, renderPdf } from "../../../src/lib/server/documents/render.ts";
import { documentMarkdown, type DocumentModel } from "../../../src/lib/documents/model.ts";

const doc: DocumentModel = {
  title: "Journal of the sitting of 3 December",
  subtitle: ["Quillbrook Assembly"],
  blocks: [
    { kind: "heading", level: 1, text: "Proceedings" },
    { kind: "paragraph", runs: [{ text: "Question 1. ", bold: true }, { text: "Ms Zoë Ardèn moved: Main motion M1 — “That the \"ferry\" run_daily…”." }] },
    { kind: "paragraph", runs: [{ text: "A struck entry", struck: true }, { text: " [Struck out]", italic: true }] },
    { kind: "list", items: [[{ text: "Yeas (2): ", bold: true }, { text: "Arden, Bellweather" }]] },
    { kind: "tally", labels: ["Ayes", "Noes"] },
    { kind: "note", text: "Not yet approved." },
  ],
  footer: "Quillbrook Assembly — Journal",
};

describe("renderPdf", () => {
  it("sets every block's words, including characters set in the fallback font, and numbers the pages", async () => {
    const long = { ...doc, blocks: [...doc.blocks, ...Array.from({ length: 80 }, (_, i) => ({ kind: "paragraph" as const, runs: [{ text: `Filler paragraph ${i + 1} of the record.` }] }))] };
    const bytes = await renderPdf(long);
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    const parser = new PDFParse({ data: new Uint8Array(bytes) });
    const result = await parser.getText();
    await parser.destroy();
    const text = result.text.replace(/\s+/g, " ");
    expect(text).toContain("Journal of the sitting of 3 December");
    expect(text).toContain("Zo");
    expect(text).toContain("Ayes ____________");
    expect(result.total).toBeGreaterThan(1);
    expect(text).toContain(`page 1 of ${result.total}`);
    expect(text).toContain(`page ${result.total} of ${result.total}`);
  });
});

describe("renderDocx", () => {
  it("is a Word document with the words, strike-through, bullets and a page-number footer", async () => {
    const zip = await JSZip.loadAsync(await renderDocx(doc));
    const xml = await zip.file("word/document.xml")!.async("string");
    expect(xml).toContain("Ms Zoë Ardèn moved");
    expect(xml).toMatch(/<w:strike\/>[\s\S]*A struck entry/);
    const footer = Object.keys(zip.files).find((f) => /^word\/footer\d*\.xml$/.test(f))!;
    const f = await zip.file(footer)!.async("string");
    expect(f).toContain("PAGE");
    expect(f).toContain("NUMPAGES");
  });
});

describe("documentMarkdown", () => {
  it("keeps struck text struck and escapes the markers in the words", () => {
    const md = documentMarkdown(doc);
    expect(md).toContain("~~A struck entry~~");
    expect(md).toContain("run\\_daily");
    expect(md).toContain("Ayes ______   Noes ______");
  });
});
