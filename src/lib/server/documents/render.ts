/**
 * One renderer for the documents a clerk downloads (the journal of a sitting, the chair's script):
 * a DocumentModel to PDF (pdfkit, with the app's own type from the bundled @fontsource
 * packages: Literata for headings, Public Sans for text) and to DOCX (docx), each with the
 * footer and page numbers on every page. Used by both documents; no document renders itself.
 */
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";
import PDFDocument from "pdfkit";
import { AlignmentType, Document, Footer, HeadingLevel, Packer, PageNumber, Paragraph, TextRun } from "docx";
import { documentMarkdown, type Block, type DocumentModel, type Run } from "../../documents/model.ts";

export type DocumentFormat = "pdf" | "docx" | "md";

const require = createRequire(import.meta.url);
let fonts: { sans: Buffer; sansItalic: Buffer; serif: Buffer } | null = null;
function fontFiles() {
  if (!fonts) {
    const file = (pkg: string, name: string) => readFileSync(require.resolve(`@fontsource-variable/${pkg}/files/${name}`));
    fonts = {
      sans: file("public-sans", "public-sans-latin-wght-normal.woff2"),
      sansItalic: file("public-sans", "public-sans-latin-wght-italic.woff2"),
      serif: file("literata", "literata-latin-wght-normal.woff2"),
    };
  }
  return fonts;
}

/**
 * The text split where the bundled font cannot be embedded: fontkit 2 fails to subset composite
 * glyphs (accented letters, straight quotes, "_", "…") read from a WOFF2 file, so those
 * characters are set in the PDF's standard Helvetica instead of failing the whole document.
 */
function safePieces(doc: PDFDocument, font: string, text: string): Array<{ text: string; fallback: boolean }> {
  doc.font(font);
  const f = typeof doc._font?.font?.glyphForCodePoint === "function" ? doc._font.font : undefined;
  const out: Array<{ text: string; fallback: boolean }> = [];
  for (const ch of text) {
    let fallback = false;
    if (f) {
      const glyph = f.glyphForCodePoint(ch.codePointAt(0)!);
      const decoded = glyph.id === 0 ? null : glyph._decode();
      fallback = glyph.id === 0 ? /\S/.test(ch) : (decoded?.numberOfContours ?? 0) < 0;
    }
    const last = out[out.length - 1];
    if (last && last.fallback === fallback) last.text += ch;
    else out.push({ text: ch, fallback });
  }
  return out.length ? out : [{ text: "", fallback: false }];
}

/** Set a line in one font with the fallback for characters it cannot embed. */
function safeText(doc: PDFDocument, font: string, text: string, x: number, y: number, options: { width: number; align?: "center"; lineBreak?: boolean }) {
  const pieces = safePieces(doc, font, text);
  pieces.forEach((p, i) => doc.font(p.fallback ? "Helvetica" : font).text(p.text, i === 0 ? x : undefined, i === 0 ? y : undefined, { ...options, continued: i < pieces.length - 1, features: NO_LIGATURES }));
}

/** Ligature glyphs ("fl", "fi") are composites too: set the letters apart. */
const NO_LIGATURES = { liga: false, clig: false, dlig: false, rlig: false, calt: false };

const HEADING_SIZE = { 1: 15, 2: 13, 3: 11.5 } as const;

/**
 * The document as a PDF (A4), footer and "Page n of m" on every page: in the app's type, or, should
 * the font library fail on a glyph the checks above did not catch, entirely in the PDF's standard fonts.
 */
export async function renderPdf(d: DocumentModel): Promise<Buffer> {
  try {
    return await renderPdfWith(d, fontFiles());
  } catch (e) {
    if (!(e instanceof RangeError)) throw e;
    return renderPdfWith(d, null);
  }
}

async function renderPdfWith(d: DocumentModel, f: ReturnType<typeof fontFiles> | null): Promise<Buffer> {
  const doc = new PDFDocument({ size: "A4", margins: { top: 56, bottom: 64, left: 62, right: 62 }, bufferPages: true, info: { Title: d.title, Creator: "Gavelwright" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve, reject) => {
    doc.on("end", () => resolve());
    doc.on("error", reject);
  });
  doc.registerFont("sans", f?.sans ?? "Helvetica");
  doc.registerFont("sans-italic", f?.sansItalic ?? "Helvetica-Oblique");
  doc.registerFont("serif", f?.serif ?? "Times-Roman");
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;

  const runs = (rs: Run[], opts: { indent?: number; bullet?: boolean } = {}) => {
    const x = doc.page.margins.left + (opts.indent ?? 0);
    const w = width - (opts.indent ?? 0);
    if (opts.bullet) doc.font("sans").fontSize(10.5).text("•", x - 10, doc.y, { continued: false, lineBreak: false });
    const pieces = (rs.length ? rs : [{ text: "" }]).flatMap((r) => {
      const font = r.bold ? "serif" : r.italic ? "sans-italic" : "sans";
      return safePieces(doc, font, r.text).map((p) => ({ ...r, text: p.text, font: p.fallback ? "Helvetica" : font }));
    });
    pieces.forEach((r, i) => {
      doc
        .font(r.font)
        .fontSize(10.5)
        .fillColor(r.struck ? "#555555" : "#111111")
        .text(r.text, i === 0 ? x : undefined, i === 0 ? doc.y : undefined, { width: w, continued: i < pieces.length - 1, strike: r.struck ?? false, lineGap: 2, features: NO_LIGATURES });
    });
    doc.fillColor("#111111");
  };

  doc.fontSize(18);
  safeText(doc, "serif", d.title, doc.page.margins.left, doc.y, { width });
  doc.moveDown(0.3);
  doc.fontSize(10.5);
  for (const s of d.subtitle) safeText(doc, "sans", s, doc.page.margins.left, doc.y, { width });
  doc.moveDown(0.8);
  for (const b of d.blocks) renderPdfBlock(doc, b, runs, width);

  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.fontSize(8.5).fillColor("#444444");
    safeText(doc, "sans", `${d.footer} — page ${i + 1} of ${range.count}`, doc.page.margins.left, doc.page.height - 40, { width, align: "center", lineBreak: false });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

function renderPdfBlock(doc: PDFDocument, b: Block, runs: (rs: Run[], o?: { indent?: number; bullet?: boolean }) => void, width: number) {
  switch (b.kind) {
    case "heading":
      doc.moveDown(b.level === 1 ? 0.8 : 0.5);
      doc.fontSize(HEADING_SIZE[b.level]).fillColor("#111111");
      safeText(doc, "serif", b.text, doc.page.margins.left, doc.y, { width });
      doc.moveDown(0.2);
      return;
    case "paragraph":
      runs(b.runs);
      doc.moveDown(0.35);
      return;
    case "list":
      for (const item of b.items) runs(item, { indent: 14, bullet: true });
      doc.moveDown(0.35);
      return;
    case "tally":
      doc.fontSize(10.5);
      safeText(doc, "sans", b.labels.map((l) => `${l} ____________`).join("      "), doc.page.margins.left, doc.y, { width });
      doc.moveDown(0.5);
      return;
    case "note":
      doc.fontSize(9.5).fillColor("#333333");
      safeText(doc, "sans-italic", b.text, doc.page.margins.left, doc.y, { width });
      doc.fillColor("#111111");
      doc.moveDown(0.4);
      return;
  }
}

const docxRuns = (rs: Run[]) => rs.map((r) => new TextRun({ text: r.text, bold: r.bold, italics: r.italic, strike: r.struck }));

/** The document as a Word file, footer and "Page n of m" on every page. */
export async function renderDocx(d: DocumentModel): Promise<Buffer> {
  const children: Paragraph[] = [new Paragraph({ heading: HeadingLevel.TITLE, children: [new TextRun(d.title)] }), ...d.subtitle.map((s) => new Paragraph({ children: [new TextRun(s)] }))];
  for (const b of d.blocks) {
    if (b.kind === "heading") children.push(new Paragraph({ heading: b.level === 1 ? HeadingLevel.HEADING_1 : b.level === 2 ? HeadingLevel.HEADING_2 : HeadingLevel.HEADING_3, children: [new TextRun(b.text)] }));
    else if (b.kind === "paragraph") children.push(new Paragraph({ children: docxRuns(b.runs) }));
    else if (b.kind === "list") for (const item of b.items) children.push(new Paragraph({ bullet: { level: 0 }, children: docxRuns(item) }));
    else if (b.kind === "tally") children.push(new Paragraph({ children: [new TextRun(b.labels.map((l) => `${l} ____________`).join("      "))] }));
    else children.push(new Paragraph({ children: [new TextRun({ text: b.text, italics: true })] }));
  }
  const doc = new Document({
    creator: "Gavelwright",
    title: d.title,
    styles: { default: { document: { run: { font: "Public Sans", size: 21 } }, heading1: { run: { font: "Literata" } }, heading2: { run: { font: "Literata" } }, title: { run: { font: "Literata" } } } },
    sections: [
      {
        footers: {
          default: new Footer({
            children: [new Paragraph({ alignment: AlignmentType.CENTER, children: [new TextRun(`${d.footer} — page `), new TextRun({ children: [PageNumber.CURRENT] }), new TextRun(" of "), new TextRun({ children: [PageNumber.TOTAL_PAGES] })] })],
          }),
        },
        children,
      },
    ],
  });
  return Packer.toBuffer(doc);
}

const TYPES: Record<DocumentFormat, string> = {
  pdf: "application/pdf",
  docx: "application/vnd.openxmlformats-officedocument.wordprocessingml.document",
  md: "text/markdown; charset=utf-8",
};

/** A file name from words: "journal-sitting-of-3-december" (ASCII letters, digits and dashes). */
export function fileStem(words: string): string {
  return (
    words
      .normalize("NFKD")
      .replace(/[^\w\s-]/g, "")
      .trim()
      .replace(/[\s_]+/g, "-")
      .toLowerCase()
      .slice(0, 80) || "document"
  );
}

/** The download response for a document in one of the formats. */
export async function documentResponse(d: DocumentModel, format: DocumentFormat, stem: string): Promise<Response> {
  const body = format === "pdf" ? await renderPdf(d) : format === "docx" ? await renderDocx(d) : documentMarkdown(d);
  return new Response(typeof body === "string" ? body : new Uint8Array(body), {
    headers: { "content-type": TYPES[format], "content-disposition": `attachment; filename="${fileStem(stem)}.${format}"`, "cache-control": "no-store" },
  });
}
