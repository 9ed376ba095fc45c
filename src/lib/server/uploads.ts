/**
 * Uploaded documents for measures and amendments: read a multipart body (size-checked before
 * and while reading), decide the document's type from its bytes (magic numbers, never the name
 * alone), and extract its text with a well-known package (pdf-parse for PDF, mammoth for DOCX).
 */
import { createHash } from "node:crypto";
import { storableText, textProblem } from "../schema-parts.ts";
import { GavelError, isGavelError } from "../errors.ts";
import { readBody, refuseBadText } from "./http.ts";
import { MAX_RULEBOOK_BYTES } from "../procedure/parse-rulebook.ts";
import { decodeCsv, MAX_CSV_BYTES } from "../estimates/csv-text.ts";

export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Multipart framing and the small form fields sent beside the file. */
const MULTIPART_SLACK = 64 * 1024;

export type DocumentKind = "pdf" | "docx" | "text" | "markdown";

export const MEDIA_TYPES: Record<DocumentKind, string> = {
  pdf: "application/pdf",
  docx: "application/vnd.openxmlformats-officedocument.wordprocessingml.document",
  text: "text/plain; charset=utf-8",
  markdown: "text/markdown; charset=utf-8",
};

export interface UploadedFile {
  filename: string;
  bytes: Buffer;
}

export interface MultipartUpload {
  fields: Record<string, string>;
  file: UploadedFile | null;
}

const fileIssue = (message: string) => [{ path: "file", message }];

/** Read a multipart/form-data body with at most one file (field `file`) and string fields. */
export async function readMultipart(request: Request, maxBytes = MAX_UPLOAD_BYTES): Promise<MultipartUpload> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(type)) throw new GavelError("invalid-input", "upload: send the file as multipart/form-data", { issues: [{ path: "(content-type)", message: `expected multipart/form-data, got ${type || "nothing"}` }] });
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > maxBytes + MULTIPART_SLACK) throw new GavelError("too-large", `the upload is ${declared} bytes; the limit is ${maxBytes} bytes per file`, { issues: fileIssue("too large") });
  let raw: Uint8Array<ArrayBuffer>;
  try {
    raw = await readBody(request, maxBytes + MULTIPART_SLACK, "the upload");
  } catch (e) {
    if (isGavelError(e) && e.code === "too-large") throw new GavelError("too-large", `the upload is larger than ${maxBytes} bytes per file`, { issues: fileIssue("too large") });
    throw e;
  }
  let form: FormData;
  try {
    form = await new Response(raw, { headers: { "content-type": type } }).formData();
  } catch {
    throw new GavelError("invalid-input", "upload: the multipart body could not be read", { issues: [{ path: "(body)", message: "malformed multipart/form-data" }] });
  }
  const fields: Record<string, string> = {};
  let file: UploadedFile | null = null;
  for (const [key, value] of form.entries()) {
    if (typeof value === "string") fields[key] = value;
    else if (key === "file") {
      if (file) throw new GavelError("invalid-input", "upload: send one file only", { issues: fileIssue("more than one file") });
      const bytes = Buffer.from(await value.arrayBuffer());
      if (bytes.length > maxBytes) throw new GavelError("too-large", `${value.name} is ${bytes.length} bytes; the limit is ${maxBytes}`, { issues: fileIssue("too large") });
      file = { filename: value.name || "upload", bytes };
    } else throw new GavelError("invalid-input", `upload: unexpected file field "${key}"`, { issues: [{ path: key, message: "only the field `file` may hold a file" }] });
  }
  refuseBadText(fields, "upload");
  const nameProblem = file ? textProblem(file.filename) : null;
  if (nameProblem) throw new GavelError("invalid-input", `upload: the file name ${nameProblem}`, { issues: fileIssue(`the file name ${nameProblem}`) });
  return { fields, file };
}

function startsWith(bytes: Buffer, magic: number[]): boolean {
  return magic.every((b, i) => bytes[i] === b);
}

/**
 * The document's kind from its bytes. PDF: "%PDF-". DOCX: a ZIP ("PK\3\4") whose directory
 * names word/document.xml (entry names are stored uncompressed). Text and Markdown: valid
 * UTF-8 without NUL bytes, named .txt or .md. Anything else is refused.
 */
export function sniffDocument(file: UploadedFile): DocumentKind {
  const { bytes, filename } = file;
  const ext = (/\.([A-Za-z0-9]+)$/.exec(filename)?.[1] ?? "").toLowerCase();
  if (bytes.length === 0) throw new GavelError("invalid-input", `${filename} is empty`, { issues: fileIssue("empty file") });
  let kind: DocumentKind | null = null;
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) kind = "pdf";
  else if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04])) {
    if (!bytes.includes("word/document.xml", 0, "latin1")) throw new GavelError("invalid-input", `${filename} is a ZIP archive but not a Word (DOCX) document`, { issues: fileIssue("not a DOCX document") });
    kind = "docx";
  } else if ((ext === "txt" || ext === "md" || ext === "markdown") && !bytes.includes(0)) {
    try {
      new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    } catch {
      throw new GavelError("invalid-input", `${filename} is not UTF-8 text`, { issues: fileIssue("not UTF-8 text") });
    }
    kind = ext === "txt" ? "text" : "markdown";
  }
  if (!kind) throw new GavelError("invalid-input", `${filename}: only PDF, Word (DOCX), plain text (.txt) and Markdown (.md) documents are accepted; the file's contents match none of them`, { issues: fileIssue("unsupported document type (checked by content)") });
  const expected: Record<DocumentKind, string[]> = { pdf: ["pdf"], docx: ["docx"], text: ["txt"], markdown: ["md", "markdown"] };
  if (!expected[kind].includes(ext)) throw new GavelError("invalid-input", `${filename}: the name says .${ext || "(none)"} but the contents are ${kind.toUpperCase()}; rename the file or upload the right one`, { issues: fileIssue("extension does not match contents") });
  return kind;
}

async function pdfText(bytes: Buffer): Promise<string> {
  const { PDFParse } = await import("pdf-parse");
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    const r = await parser.getText();
    // pdf-parse marks page breaks as "-- n of m --": page furniture, not measure text.
    return r.text.replace(/^-- \d+ of \d+ --$/gm, "").trim();
  } finally {
    await parser.destroy();
  }
}

async function docxText(bytes: Buffer): Promise<string> {
  const mammoth = await import("mammoth");
  const r = await (mammoth.default ?? mammoth).extractRawText({ buffer: bytes });
  return r.value.trim();
}

/** The document's text. A file that matches its magic number but will not open is refused (422). */
export async function extractDocumentText(kind: DocumentKind, file: UploadedFile): Promise<string> {
  if (kind === "text" || kind === "markdown") return storableText(file.bytes.toString("utf8"));
  try {
    return storableText(kind === "pdf" ? await pdfText(file.bytes) : await docxText(file.bytes));
  } catch (e) {
    throw new GavelError("unprocessable", `${file.filename} looks like a ${kind.toUpperCase()} file but could not be read (${(e as Error).message ?? "damaged"}). Save it again from its program and re-upload it.`, { issues: fileIssue("damaged or malformed document") });
  }
}

export interface CheckedDocument {
  filename: string;
  kind: DocumentKind;
  mediaType: string;
  size: number;
  sha256: string;
  bytes: Buffer;
  text: string;
}

/** Sniff and extract in one step: what the services store. */
export async function checkDocument(file: UploadedFile): Promise<CheckedDocument> {
  const kind = sniffDocument(file);
  const text = await extractDocumentText(kind, file);
  const filename = file.filename.replace(/[^\w .()-]+/g, "_").slice(0, 200) || "upload";
  return { filename, kind, mediaType: MEDIA_TYPES[kind], size: file.bytes.length, sha256: createHash("sha256").update(file.bytes).digest("hex"), bytes: file.bytes, text };
}

/** Read a rulebook upload (multipart: field "file", plus basedOn and note): size-checked before and while reading. The route calls this; services/rulebooks.ts importVersion takes the form. */
export async function readRulebookUpload(request: Request): Promise<FormData> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(type)) throw new GavelError("invalid-input", "Send the rulebook as a file upload (multipart/form-data, field \"file\").", { issues: [{ path: "(content-type)", message: `expected multipart/form-data, got ${type || "nothing"}` }] });
  // The form carries the file plus two short fields; refuse an oversize body before reading it.
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > MAX_RULEBOOK_BYTES + 64 * 1024) throw new GavelError("too-large", `The upload is ${declared} bytes; a rulebook file may be at most ${MAX_RULEBOOK_BYTES} bytes.`, { issues: [{ path: "file", message: "too large" }] });
  try {
    return await new Response(await readBody(request, MAX_RULEBOOK_BYTES + 64 * 1024, "the upload"), { headers: { "content-type": type } }).formData();
  } catch (e) {
    if (isGavelError(e)) throw e;
    throw new GavelError("invalid-input", "The upload could not be read as a form.", { issues: [{ path: "(body)", message: "not a readable multipart form" }] });
  }
}

/** Read a CSV file sent as the body itself (Content-Type text/csv), size-checked, as text. The route calls this; services/estimates.ts importCsv takes the text. */
export async function readCsvUpload(request: Request): Promise<string> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^(text\/csv|text\/plain|application\/octet-stream)\b/i.test(type)) throw new GavelError("invalid-input", "send the CSV file itself with Content-Type: text/csv", { issues: [{ path: "(content-type)", message: `expected text/csv, got ${type || "nothing"}` }] });
  return decodeCsv(await readBody(request, MAX_CSV_BYTES, "the file"));
}
