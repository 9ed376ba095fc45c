/**
 * A printable document as the journal and the chair's script are written: headings, paragraphs,
 * lists, tally lines, struck-out (corrected) text and notes. Pure data; the server renders it
 * to PDF and DOCX (src/lib/server/documents/render.ts) and this module to Markdown.
 */
export type Run = { text: string; bold?: boolean; italic?: boolean; struck?: boolean };

export type Block =
  | { kind: "heading"; level: 1 | 2 | 3; text: string }
  | { kind: "paragraph"; runs: Run[] }
  | { kind: "list"; items: Run[][] }
  /** A line to be filled in by hand: "Ayes ______  Noes ______  Abstaining ______". */
  | { kind: "tally"; labels: string[] }
  | { kind: "note"; text: string };

export interface DocumentModel {
  title: string;
  /** Under the title: the chamber, the sitting and its date. */
  subtitle: string[];
  blocks: Block[];
  /** In every page's footer with the page number ("Journal of the sitting of …"). */
  footer: string;
}

export const plain = (text: string): Run[] => [{ text }];

const md = (r: Run) => {
  let t = r.text.replace(/([*_~`])/g, "\\$1");
  if (!t) return t;
  if (r.struck) t = `~~${t}~~`;
  if (r.bold) t = `**${t}**`;
  if (r.italic) t = `*${t}*`;
  return t;
};
const runsMd = (runs: Run[]) => runs.map(md).join("");

/** The document as Markdown (the chair's script keeps its Markdown download). */
export function documentMarkdown(d: DocumentModel): string {
  const out = [`# ${d.title}`, ""];
  for (const s of d.subtitle) out.push(s, "");
  for (const b of d.blocks) {
    if (b.kind === "heading") out.push(`${"#".repeat(b.level + 1)} ${b.text}`, "");
    else if (b.kind === "paragraph") out.push(runsMd(b.runs), "");
    else if (b.kind === "list") out.push(...b.items.map((i) => `- ${runsMd(i)}`), "");
    else if (b.kind === "tally") out.push(b.labels.map((l) => `${l} ______`).join("   "), "");
    else out.push(`> ${b.text}`, "");
  }
  return out.join("\n");
}

/** The text of the document, one block a line (search and tests). */
export function documentText(d: DocumentModel): string {
  const lines = [d.title, ...d.subtitle];
  for (const b of d.blocks) {
    if (b.kind === "heading" || b.kind === "note") lines.push(b.text);
    else if (b.kind === "paragraph") lines.push(b.runs.map((r) => r.text).join(""));
    else if (b.kind === "list") lines.push(...b.items.map((i) => i.map((r) => r.text).join("")));
    else lines.push(b.labels.map((l) => `${l} ______`).join("   "));
  }
  return lines.join("\n");
}
