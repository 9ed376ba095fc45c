// Shared helpers for the measures integration tests: sample documents built in memory.
import JSZip from "jszip";
import { asc, eq } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { legislators } from "../../../src/lib/db/schema/chamber.ts";

/** A one-page PDF whose content stream shows `text` (hand-built, valid xref offsets). */
export function pdfBytes(text: string): Buffer {
  const stream = `BT /F1 12 Tf 72 720 Td (${text}) Tj ET`;
  const objs = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 612 792] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>",
    `<< /Length ${stream.length} >>\nstream\n${stream}\nendstream`,
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>",
  ];
  let out = "%PDF-1.4\n";
  const offsets: number[] = [];
  objs.forEach((o, i) => {
    offsets.push(out.length);
    out += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xref = out.length;
  out += `xref\n0 ${objs.length + 1}\n0000000000 65535 f \n` + offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`).join("");
  out += `trailer\n<< /Size ${objs.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(out, "latin1");
}

/** A minimal Word document with one paragraph per line. */
export async function docxBytes(lines: string[]): Promise<Buffer> {
  const zip = new JSZip();
  zip.file("[Content_Types].xml", `<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/word/document.xml" ContentType="application/vnd.openxmlformats-officedocument.wordprocessingml.document.main+xml"/></Types>`);
  zip.file("_rels/.rels", `<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="word/document.xml"/></Relationships>`);
  const body = lines.map((l) => `<w:p><w:r><w:t xml:space="preserve">${l}</w:t></w:r></w:p>`).join("");
  zip.file("word/document.xml", `<?xml version="1.0" encoding="UTF-8"?><w:document xmlns:w="http://schemas.openxmlformats.org/wordprocessingml/2006/main"><w:body>${body}</w:body></w:document>`);
  return zip.generateAsync({ type: "nodebuffer" });
}

export function multipart(fields: Record<string, string>, file?: { name: string; bytes: Buffer; type?: string }): FormData {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  if (file) fd.set("file", new Blob([new Uint8Array(file.bytes)], { type: file.type ?? "application/octet-stream" }), file.name);
  return fd;
}

/** Request options for a multipart body (the Request computes the boundary header). */
export async function multipartBody(fd: FormData): Promise<{ rawBody: ArrayBuffer; headers: Record<string, string> }> {
  const r = new Request("http://x/", { method: "POST", body: fd });
  return { rawBody: await r.arrayBuffer(), headers: { "content-type": r.headers.get("content-type")! } };
}

export async function legislatorIds(chamberId: string): Promise<string[]> {
  return (await db.select({ id: legislators.id }).from(legislators).where(eq(legislators.chamberId, chamberId)).orderBy(asc(legislators.name))).map((r) => r.id);
}
