// Measures API: roles, chamber isolation, creation from text and uploads, stale edits, audit.
// The behaviour checked is the product's own contract (common practice, no source), except
// where a test names a rule.
import { beforeAll, describe, expect, it } from "vitest";
import * as list from "../../../src/pages/api/measures/index.ts";
import * as upload from "../../../src/pages/api/measures/upload.ts";
import * as sponsors from "../../../src/pages/api/measures/sponsors.ts";
import * as one from "../../../src/pages/api/measures/[id]/index.ts";
import * as audit from "../../../src/pages/api/measures/[id]/audit.ts";
import * as attachment from "../../../src/pages/api/measures/[id]/attachments/[aid].ts";
import { MAX_UPLOAD_BYTES } from "../../../src/lib/server/uploads.ts";
import { call } from "../../support/app.ts";
import { tableCounts } from "../../support/db.ts";
import { seedChambers, type Seeded } from "../../support/fixtures.ts";
import { docxBytes, legislatorIds, multipart, multipartBody, pdfBytes } from "./helpers.ts";

let s: Seeded;
let L: string[];
const ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;
const TEXT = "# Quay Bollard Ordinance\n\n## Section 1 — Bollards\nSubjects: quayside, safety\nBollards shall be painted white.\nEach bollard shall carry a number.\n\n## Section 2 — Funding\nSubjects: finance\nCosts are met from harbour dues.\n";

async function create(body: Record<string, unknown>, as = s.as.clerk) {
  return call(list.POST, "POST", "/api/measures", { as, body });
}

beforeAll(async () => {
  s = await seedChambers();
  L = await legislatorIds(s.chambers.harrowmere);
});

describe("creating measures", () => {
  it("rejects bad input with path-precise issues and writes nothing", async () => {
    const before = await tableCounts();
    const r = await create({ number: "", title: "x".repeat(600), sponsors: ["nope"], sittingAt: "tomorrow" });
    expect(r.status).toBe(400);
    expect([...new Set(r.body.error.issues.map((i: { path: string }) => i.path))].sort()).toEqual(["number", "sittingAt", "sponsors.0", "title"]);
    const notJson = await call(list.POST, "POST", "/api/measures", { as: s.as.clerk, rawBody: "{", headers: { "content-type": "application/json" } });
    expect(notJson.status).toBe(400);
    const stranger = await create({ number: "HCA 91", title: "T", sponsors: ["00000000-0000-4000-8000-000000000000"] });
    expect(stranger.status).toBe(422);
    expect(stranger.body.error.issues[0].path).toBe("sponsors.0");
    expect(await tableCounts()).toEqual(before);
  });

  it("splits typed text into sections with subject tags and line counts", async () => {
    const r = await create({ number: "HCA 20", title: "Quay Bollard Ordinance", subjects: ["Quayside"], sponsors: [L[0], L[1]], text: TEXT });
    expect(r.status).toBe(201);
    expect(r.body.subjects).toEqual(["quayside"]);
    expect(r.body.sections.map((x: { id: string; heading: string; subjects: string[]; lines: number }) => [x.id, x.heading, x.subjects, x.lines])).toEqual([
      ["s1", "Section 1 — Bollards", ["quayside", "safety"], 2],
      ["s2", "Section 2 — Funding", ["finance"], 1],
    ]);
    expect(r.body.sponsors.map((x: { id: string }) => x.id)).toEqual([L[0], L[1]]);
    const dup = await create({ number: "HCA 20", title: "Again" });
    expect(dup.status).toBe(409);
  });

  it("lets the chief clerk create too, and refuses duplicate section ids", async () => {
    expect((await create({ number: "HCA 21", title: "By the chief", sections: [{ text: "One." }] }, s.as["chief-clerk"])).status).toBe(201);
    const r = await create({ number: "HCA 22", title: "Dup", sections: [{ id: "a", text: "x" }, { id: "a", text: "y" }] });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe("sections.1.id");
  });

  it("refuses a section id the amendment tree gives the measure or an amendment (A1, Draft), storing nothing", async () => {
    for (const [i, id] of ["A1", "Draft", "Draft-2", "measure"].entries()) {
      const before = await tableCounts();
      const r = await create({ number: `HCA 2${5 + i}`, title: "Clash", sections: [{ id: "s1", text: "x" }, { id, text: "y" }] });
      expect(r.status, id).toBe(400);
      expect(r.body.error.issues[0].path).toBe("sections.1.id");
      expect(r.body.error.issues[0].message).toContain("give the section another id");
      expect(await tableCounts()).toEqual(before);
    }
    expect((await create({ number: "HCA 29", title: "Fine", sections: [{ id: "A1x", text: "x" }, { id: "Drafting", text: "y" }] })).status).toBe(201);
  });
});

describe("reading measures", () => {
  it("lists and reads for every role of the chamber, 404 for the other chamber", async () => {
    const m = (await create({ number: "HCA 23", title: "Readable", text: "Section 1. Words." })).body;
    for (const role of ROLES) {
      const l = await call(list.GET, "GET", "/api/measures", { as: s.as[role] });
      expect(l.status, role).toBe(200);
      expect(l.body.measures.some((x: { id: string }) => x.id === m.id)).toBe(true);
      expect((await call(one.GET, "GET", `/api/measures/${m.id}`, { as: s.as[role], params: { id: m.id } })).status, role).toBe(200);
      expect((await call(audit.GET, "GET", `/api/measures/${m.id}/audit`, { as: s.as[role], params: { id: m.id } })).status, role).toBe(200);
      expect((await call(sponsors.GET, "GET", "/api/measures/sponsors", { as: s.as[role] })).body.legislators).toHaveLength(40);
    }
    expect((await call(list.GET, "GET", "/api/measures", { as: s.outsider })).body.measures).toEqual([]);
    expect((await call(one.GET, "GET", `/api/measures/${m.id}`, { as: s.outsider, params: { id: m.id } })).status).toBe(404);
    expect((await call(audit.GET, "GET", `/api/measures/${m.id}/audit`, { as: s.outsider, params: { id: m.id } })).status).toBe(404);
    expect((await call(sponsors.GET, "GET", "/api/measures/sponsors", { as: s.outsider })).body.legislators).toEqual([]);
    expect((await call(one.GET, "GET", "/api/measures/not-a-uuid", { as: s.as.clerk, params: { id: "not-a-uuid" } })).status).toBe(404);
  });
});

describe("editing measures: versions and audit", () => {
  it("applies an edit based on the current version, refuses a stale one with 409 naming what changed, and logs both sides", async () => {
    const m = (await create({ number: "HCA 30", title: "Lamp Ordinance", text: "Section 1. Lamps." })).body;
    const ok = await call(one.PATCH, "PATCH", `/api/measures/${m.id}`, { as: s.as.clerk, params: { id: m.id }, body: { version: 1, title: "Lamp Ordinance (amended title)", status: "on-floor" } });
    expect(ok.status).toBe(200);
    expect(ok.body.version).toBe(2);
    const before = await tableCounts();
    const stale = await call(one.PATCH, "PATCH", `/api/measures/${m.id}`, { as: s.as["chief-clerk"], params: { id: m.id }, body: { version: 1, committee: "Works" } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("conflict");
    expect(stale.body.error.details.current).toBe(2);
    expect(stale.body.error.details.changes[0].fields).toEqual(["status", "title"]);
    expect(stale.body.error.details.changes[0].by).toBe("Tamsin Abernethy");
    expect(await tableCounts()).toEqual(before);
    const log = await call(audit.GET, "GET", `/api/measures/${m.id}/audit`, { as: s.as.observer, params: { id: m.id } });
    const edit = log.body.entries.find((e: { action: string }) => e.action === "edited");
    expect(edit.before.title).toBe("Lamp Ordinance");
    expect(edit.after.title).toBe("Lamp Ordinance (amended title)");
    expect(edit.actorName).toBe("Tamsin Abernethy");
    expect(log.body.entries.map((e: { action: string }) => e.action)).toEqual(["edited", "created"]);
  });

  it("refuses edits by the other chamber and without a version (other roles: tests/access)", async () => {
    const m = (await create({ number: "HCA 31", title: "Guarded" })).body;
    const before = await tableCounts();
    expect((await call(one.PATCH, "PATCH", `/api/measures/${m.id}`, { as: s.outsider, params: { id: m.id }, body: { version: 1, title: "X" } })).status).toBe(404);
    expect((await call(one.PATCH, "PATCH", `/api/measures/${m.id}`, { as: s.as.clerk, params: { id: m.id }, body: { title: "no version" } })).status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });
});

describe("uploads", () => {
  async function send(fields: Record<string, string>, file?: { name: string; bytes: Buffer }, as = s.as.clerk) {
    return call(upload.POST, "POST", "/api/measures/upload", { as, ...(await multipartBody(multipart(fields, file))) });
  }

  it("creates a measure from Markdown, split into sections", async () => {
    const r = await send({ number: "HCA 40", title: "From Markdown", subjects: "quayside, safety" }, { name: "bollards.md", bytes: Buffer.from(TEXT) });
    expect(r.status).toBe(201);
    expect(r.body.sections).toHaveLength(2);
    expect(r.body.attachment.filename).toBe("bollards.md");
  });

  it("keeps a PDF as an attachment, extracts its text, and serves it back to the chamber only", async () => {
    const bytes = pdfBytes("Harbour lamps shall burn all night.");
    const r = await send({ number: "HCA 41", title: "From PDF" }, { name: "lamps.pdf", bytes });
    expect(r.status).toBe(201);
    expect(r.body.sections[0].text).toContain("Harbour lamps shall burn all night.");
    expect(r.body.attachment.mediaType).toBe("application/pdf");
    const params = { id: r.body.id, aid: r.body.attachment.id };
    const got = await call(attachment.GET, "GET", `/api/measures/${r.body.id}/attachments/${r.body.attachment.id}`, { as: s.as.observer, params });
    expect(got.status).toBe(200);
    expect(got.response.headers.get("content-disposition")).toContain("attachment");
    expect((await call(attachment.GET, "GET", "/x", { as: s.outsider, params })).status).toBe(404);
  });

  it("keeps a DOCX and extracts its paragraphs", async () => {
    const r = await send({ number: "HCA 42", title: "From Word" }, { name: "ordinance.docx", bytes: await docxBytes(["Section 1. Signs", "Every quay shall carry a sign."]) });
    expect(r.status).toBe(201);
    expect(r.body.sections[0].heading).toBe("Section 1. Signs");
    expect(r.body.sections[0].text).toBe("Every quay shall carry a sign.");
  });

  it("refuses wrong types by content, oversized files and malformed documents with a clear 4xx, writing nothing", async () => {
    const before = await tableCounts();
    const exe = Buffer.concat([Buffer.from([0x4d, 0x5a, 0x90, 0x00]), Buffer.alloc(100, 1)]);
    const cases: Array<[string, Awaited<ReturnType<typeof send>>, number]> = [
      ["executable named .pdf", await send({ number: "HCA 50", title: "x" }, { name: "law.pdf", bytes: exe }), 400],
      ["PDF named .txt", await send({ number: "HCA 51", title: "x" }, { name: "law.txt", bytes: pdfBytes("hi") }), 400],
      ["binary named .md", await send({ number: "HCA 52", title: "x" }, { name: "law.md", bytes: Buffer.from([0x41, 0x00, 0x42]) }), 400],
      ["zip that is not DOCX", await send({ number: "HCA 53", title: "x" }, { name: "law.docx", bytes: Buffer.from("PK\x03\x04 just a zip", "latin1") }), 400],
      ["damaged PDF", await send({ number: "HCA 54", title: "x" }, { name: "law.pdf", bytes: Buffer.from("%PDF-1.4 this is not a real pdf") }), 422],
      ["oversized", await send({ number: "HCA 55", title: "x" }, { name: "big.txt", bytes: Buffer.alloc(MAX_UPLOAD_BYTES + 1, 0x61) }), 413],
      ["no file", await send({ number: "HCA 56", title: "x" }), 400],
      ["empty file", await send({ number: "HCA 57", title: "x" }, { name: "e.txt", bytes: Buffer.alloc(0) }), 400],
      ["bad fields", await send({ number: "", title: "x" }, { name: "a.txt", bytes: Buffer.from("Section 1. a") }), 400],
    ];
    for (const [name, r, status] of cases) {
      expect(r.status, name).toBe(status);
      expect(r.body.error.issues.length, name).toBeGreaterThan(0);
    }
    const notMultipart = await call(upload.POST, "POST", "/api/measures/upload", { as: s.as.clerk, body: { number: "x" } });
    expect(notMultipart.status).toBe(400);
    const malformed = await call(upload.POST, "POST", "/api/measures/upload", { as: s.as.clerk, rawBody: "--zzz\r\nnonsense", headers: { "content-type": "multipart/form-data; boundary=zzz" } });
    expect(malformed.status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });
});
