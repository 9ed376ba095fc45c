/**
 * The bad-input corpus: requests a careless or hostile client may send, each driven through
 * the real route, with the status, error code and the field the answer must name.
 * Common practice (validate at the boundary, fail closed, say what is wrong), no source.
 */
import type { ChamberRole } from "../../src/lib/permissions.ts";
import type { Samples } from "../access/route-inventory.ts";

export interface BadInput {
  name: string;
  file: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  as: ChamberRole;
  params?: (s: Samples) => Record<string, string>;
  query?: (s: Samples) => Record<string, string>;
  /** A JSON value sent as application/json. */
  json?: (s: Samples) => unknown;
  /** Anything else: the exact bytes and content type. */
  raw?: (s: Samples) => { body: BodyInit; contentType?: string };
  status: number;
  code: string;
  /** Text the error (message or an issue path) must contain: what is wrong. */
  names: string;
}

const MB = 1024 * 1024;
const nested = (depth: number, leaf: unknown, key = "a") => {
  let v = leaf;
  for (let i = 0; i < depth; i++) v = { [key]: v };
  return v;
};
/** A deep JSON text built as text (JSON.stringify itself would overflow the stack). */
const deepText = (depth: number) => "[".repeat(depth) + "]".repeat(depth);

function multipart(fields: Record<string, string>, file?: { name: string; bytes: Uint8Array | string; type?: string }) {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  if (file) fd.set("file", new Blob([file.bytes as BlobPart], { type: file.type ?? "application/octet-stream" }), file.name);
  // The test turns the form into bytes and takes the boundary from the same Request.
  return { body: fd as BodyInit };
}

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0]);
const doc = (s: Samples) => structuredClone(s.rulebookDocument) as { rules: Array<{ conditions: { all?: Array<Record<string, unknown>> } }> };
const firstAllRule = (d: ReturnType<typeof doc>) => d.rules.findIndex((r) => Array.isArray(r.conditions?.all) && r.conditions.all.length > 0);

export const CORPUS: BadInput[] = [
  // --- malformed JSON
  { name: "truncated JSON", file: "api/measures/index.ts", method: "POST", as: "clerk", raw: () => ({ body: '{"number": "HB 1", "title": ', contentType: "application/json" }), status: 400, code: "invalid-input", names: "(body)" },
  { name: "JSON with a trailing comma", file: "api/rulings/index.ts", method: "POST", as: "clerk", raw: () => ({ body: '{"question": "x",}', contentType: "application/json" }), status: 400, code: "invalid-input", names: "(body)" },
  { name: "not JSON at all", file: "api/moves.ts", method: "POST", as: "member", raw: () => ({ body: "<xml>moves</xml>", contentType: "application/json" }), status: 400, code: "invalid-input", names: "(body)" },
  { name: "an empty body", file: "api/floor/sittings/index.ts", method: "POST", as: "clerk", raw: () => ({ body: "", contentType: "application/json" }), status: 400, code: "invalid-input", names: "(body)" },
  { name: "a JSON array where an object is expected", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => [{ number: "HB 1", title: "x" }], status: 400, code: "invalid-input", names: "measure" },
  { name: "JSON null", file: "api/estimates/index.ts", method: "POST", as: "member", json: () => null, status: 400, code: "invalid-input", names: "estimate" },
  { name: "deeply nested arrays (100 000 levels) as a legal-moves state", file: "api/moves.ts", method: "POST", as: "member", raw: () => ({ body: `{"state": ${deepText(100_000)}}`, contentType: "application/json" }), status: 400, code: "invalid-input", names: "state" },
  { name: "deeply nested objects (5 000 levels) as a pending motion", file: "api/moves.ts", method: "POST", as: "member", raw: () => ({ body: `{"state": {"pending": [{"motion": ${'{"a":'.repeat(5_000)}1${"}".repeat(5_000)}}]}}`, contentType: "application/json" }), status: 400, code: "invalid-input", names: "pending.0.motion" },
  { name: "rule conditions nested 3 000 levels deep", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => { const d = doc(s); const i = firstAllRule(d); (d.rules[i] as Record<string, unknown>).conditions = nested(3_000, [{ fact: "pending", operator: "equal", value: 1 }], "all") ; return { basedOn: s.rulebookVersion, document: d }; }, status: 400, code: "invalid-input", names: "conditions" },
  { name: "a body of nested objects 200 levels deep in a ruling's citations", file: "api/rulings/index.ts", method: "POST", as: "clerk", json: () => ({ citations: nested(200, {}) }), status: 400, code: "invalid-input", names: "citations" },

  // --- wrong types
  { name: "numbers and arrays where strings belong", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: 12, title: ["Harbour"] }), status: 400, code: "invalid-input", names: "number" },
  { name: "a string version", file: "api/measures/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.measure }), json: () => ({ version: "1", title: "x" }), status: 400, code: "invalid-input", names: "version" },
  { name: "a negative page size in the query", file: "api/rulings/index.ts", method: "GET", as: "observer", query: () => ({ limit: "-5" }), status: 400, code: "invalid-input", names: "limit" },
  { name: "a malformed date in the query", file: "api/rulings/index.ts", method: "GET", as: "observer", query: () => ({ from: "last tuesday" }), status: 400, code: "invalid-input", names: "from" },
  { name: "a version id that is no uuid", file: "api/rulebooks/compare.ts", method: "GET", as: "observer", query: () => ({ from: "1 OR 1=1", to: "x" }), status: 400, code: "invalid-input", names: "from" },
  { name: "an unknown amendment form", file: "api/measures/[id]/amendments.ts", method: "POST", as: "member", params: (s) => ({ id: s.measure }), json: () => ({ form: "rewrite-everything", target: "measure" }), status: 400, code: "invalid-input", names: "form" },
  { name: "a line range backwards", file: "api/measures/[id]/amendments.ts", method: "POST", as: "member", params: (s) => ({ id: s.measure }), json: () => ({ form: "strike", target: "s2", lines: [9, 2] }), status: 400, code: "invalid-input", names: "lines" },
  { name: "an unknown floor event", file: "api/floor/sittings/[id]/events.ts", method: "POST", as: "clerk", params: (s) => ({ id: s.sitting }), json: () => ({ revision: 0, event: { kind: "adjourn-forever" } }), status: 400, code: "invalid-input", names: "event.kind" },
  { name: "a pending stack that is a string", file: "api/moves.ts", method: "POST", as: "member", json: () => ({ state: { pending: "main" } }), status: 400, code: "invalid-input", names: "pending" },
  { name: "an unknown role", file: "api/people/invitations/index.ts", method: "POST", as: "chief-clerk", json: () => ({ email: "someone@harrowmere.example", role: "speaker" }), status: 400, code: "invalid-input", names: "role" },
  { name: "a sponsor who is not a legislator of the chamber", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "HB 77", title: "x", sponsors: ["00000000-0000-4000-8000-000000000000"] }), status: 422, code: "unprocessable", names: "sponsors" },

  // --- oversized bodies and uploads
  { name: "a JSON body over 1 MB", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "HB 2", title: "x", text: "y".repeat(MB + 10) }), status: 413, code: "too-large", names: "1048576" },
  { name: "a legal-moves question over 256 KB", file: "api/moves.ts", method: "POST", as: "member", json: () => ({ state: { pending: [], pad: "z".repeat(300 * 1024) } }), status: 413, code: "too-large", names: "262144" },
  { name: "an upload over 5 MB", file: "api/measures/upload.ts", method: "POST", as: "clerk", raw: () => multipart({ number: "HB 3", title: "Big" }, { name: "big.txt", bytes: "a".repeat(5 * MB + 100), type: "text/plain" }), status: 413, code: "too-large", names: "file" },
  { name: "a CSV over the import limit", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "Huge" }), raw: () => ({ body: "member,weight,ranking\n" + "all,1,measure>Q\n".repeat(500_000), contentType: "text/csv" }), status: 413, code: "too-large", names: "bytes" },
  { name: "a measure with 3 000 sections", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "HB 4", title: "x", sections: Array.from({ length: 3000 }, () => ({})) }), status: 400, code: "invalid-input", names: "sections" },

  // --- wrong MIME types
  { name: "JSON sent as text/plain", file: "api/measures/index.ts", method: "POST", as: "clerk", raw: () => ({ body: JSON.stringify({ number: "HB 5", title: "x" }), contentType: "text/plain" }), status: 400, code: "invalid-input", names: "(content-type)" },
  { name: "JSON sent as a form", file: "api/rulings/index.ts", method: "POST", as: "clerk", raw: () => ({ body: "question=x", contentType: "application/x-www-form-urlencoded" }), status: 400, code: "invalid-input", names: "(content-type)" },
  { name: "an upload sent as JSON", file: "api/measures/upload.ts", method: "POST", as: "clerk", json: () => ({ number: "HB 6", title: "x" }), status: 400, code: "invalid-input", names: "(content-type)" },
  { name: "a PNG image named .txt", file: "api/measures/upload.ts", method: "POST", as: "clerk", raw: () => multipart({ number: "HB 7", title: "Picture" }, { name: "bill.txt", bytes: PNG, type: "text/plain" }), status: 400, code: "invalid-input", names: "file" },
  { name: "a PNG image named .pdf", file: "api/measures/[id]/amendments.ts", method: "POST", as: "member", params: (s) => ({ id: s.measure }), raw: () => multipart({ form: "insert", target: "measure" }, { name: "amendment.pdf", bytes: PNG, type: "application/pdf" }), status: 400, code: "invalid-input", names: "file" },
  { name: "a multipart body with a broken boundary", file: "api/measures/upload.ts", method: "POST", as: "clerk", raw: () => ({ body: "--nope\r\nContent-Disposition: form-data; name=\"x\"\r\n\r\n", contentType: "multipart/form-data; boundary=other" }), status: 400, code: "invalid-input", names: "(body)" },
  { name: "a CSV sent as JSON", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "As JSON" }), json: () => ({ rows: [] }), status: 400, code: "invalid-input", names: "(content-type)" },
  { name: "a rulebook import that is not JSON", file: "api/rulebooks/import.ts", method: "POST", as: "clerk", raw: () => multipart({ note: "x" }, { name: "rules.json", bytes: "not json {", type: "application/json" }), status: 400, code: "invalid-input", names: "JSON" },

  // --- CSV with wrong columns or encodings
  { name: "a CSV with unknown columns", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "Wrong columns" }), raw: () => ({ body: "name,colour\nall,blue\n", contentType: "text/csv" }), status: 400, code: "invalid-input", names: "column" },
  { name: "a CSV with only a header", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "Header only" }), raw: () => ({ body: "member,ranking,bloc,weight\n", contentType: "text/csv" }), status: 400, code: "invalid-input", names: "row" },
  { name: "a CSV in UTF-16", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "UTF-16" }), raw: () => ({ body: new Uint8Array([0xff, 0xfe, ...Buffer.from("member,weight\r\nall,1\r\n", "utf16le")]), contentType: "text/csv" }), status: 400, code: "invalid-input", names: "UTF-8" },
  { name: "a CSV with bytes that are not UTF-8", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "Latin-1" }), raw: () => ({ body: new Uint8Array([...Buffer.from("member,weight\nM"), 0xe9, 0xff, ...Buffer.from("lanie,1\n")]), contentType: "text/csv" }), status: 400, code: "invalid-input", names: "UTF-8" },
  { name: "a binary file as CSV", file: "api/estimates/import.ts", method: "POST", as: "member", query: (s) => ({ measureId: s.measure, title: "Binary" }), raw: () => ({ body: PNG, contentType: "text/csv" }), status: 400, code: "invalid-input", names: "" },

  // --- cyclic and self-targeting amendments
  { name: "an amendment made to amend itself", file: "api/amendments/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.amendment }), json: () => ({ version: 1, target: "A1", lines: null }), status: 422, code: "unprocessable", names: "target" },
  { name: "an amendment made to amend its own second-degree amendment (a cycle)", file: "api/amendments/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.amendment }), json: () => ({ version: 1, target: "A2", lines: null }), status: 422, code: "unprocessable", names: "target" },
  { name: "an amendment made to amend the amendment of its amendment (a longer cycle)", file: "api/amendments/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.amendment }), json: () => ({ version: 1, target: "A8", lines: null }), status: 422, code: "unprocessable", names: "target" },
  { name: "an amendment to an amendment that does not exist", file: "api/measures/[id]/amendments.ts", method: "POST", as: "member", params: (s) => ({ id: s.measure }), json: () => ({ form: "insert", target: "A999" }), status: 422, code: "unprocessable", names: "target" },
  { name: "a ranking naming versions that do not exist", file: "api/estimates/index.ts", method: "POST", as: "member", json: (s) => ({ measureId: s.measure, title: "Ghosts", scope: [], content: { kind: "ballots", rows: [{ member: "all", weight: 40, ranking: ["measure+A99", "Q"] }] } }), status: 422, code: "unprocessable", names: "ranking" },

  // --- issue 17's probe: values the database refuses (NUL, half a surrogate pair, int4 overflow,
  // impossible dates) were 500s; each is now a 400 naming the field. PostgreSQL manual §8.1 table 8.2
  // (integer range), §8.3 and §8.14 (paraphrase: no NUL in text, no \u0000 in jsonb); calendar: ISO 8601.
  { name: "NUL in a measure's title", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "NUL 1", title: "Harbour\u0000lamps" }), status: 400, code: "invalid-input", names: "title" },
  { name: "half a surrogate pair in a measure's title", file: "api/measures/index.ts", method: "POST", as: "clerk", raw: () => ({ body: '{"number": "NUL 2", "title": "Harbour \\ud800 lamps"}', contentType: "application/json" }), status: 400, code: "invalid-input", names: "title" },
  { name: "a control character in a section heading", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "NUL 3", title: "x", sections: [{ heading: "bell\u0007", text: "y" }] }), status: 400, code: "invalid-input", names: "sections.0.heading" },
  { name: "NUL in an amendment's text", file: "api/measures/[id]/amendments.ts", method: "POST", as: "member", params: (s) => ({ id: s.measure }), json: () => ({ form: "insert", target: "measure", text: "a\u0000b" }), status: 400, code: "invalid-input", names: "text" },
  { name: "NUL in a distribution list's name", file: "api/circulation/lists/index.ts", method: "POST", as: "staff", json: () => ({ name: "List\u0000", entries: [] }), status: 400, code: "invalid-input", names: "name" },
  { name: "NUL in a sitting's title", file: "api/floor/sittings/index.ts", method: "POST", as: "clerk", json: () => ({ title: "Sitting\u0000" }), status: 400, code: "invalid-input", names: "title" },
  { name: "NUL in a rulebook document (kept as jsonb)", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => ({ basedOn: s.rulebookVersion, document: { ...(s.rulebookDocument as object), title: "Rules\u0000" } }), status: 400, code: "invalid-input", names: "document.title" },
  { name: "NUL in the rulings search (?q=%00)", file: "api/rulings/index.ts", method: "GET", as: "observer", query: () => ({ q: "\u0000" }), status: 400, code: "invalid-input", names: "q" },
  { name: "NUL in related rulings (?text=)", file: "api/rulings/related.ts", method: "GET", as: "observer", query: () => ({ text: "previous\u0000question" }), status: 400, code: "invalid-input", names: "text" },
  { name: "NUL in a record id in the path", file: "api/people/invitations/[id].ts", method: "DELETE", as: "chief-clerk", params: () => ({ id: "\u0000" }), status: 400, code: "invalid-input", names: "params.id" },
  { name: "a version of 2^31 on a measure (the column is int4)", file: "api/measures/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.measure }), json: () => ({ version: 2 ** 31, title: "x" }), status: 400, code: "invalid-input", names: "version" },
  { name: "a version of 2^31 on an amendment", file: "api/amendments/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.amendment }), json: () => ({ version: 2 ** 31, text: "x" }), status: 400, code: "invalid-input", names: "version" },
  { name: "a version of 2^53 − 1 on a distribution list", file: "api/circulation/lists/[id].ts", method: "PUT", as: "staff", params: (s) => ({ id: s.list }), json: () => ({ version: Number.MAX_SAFE_INTEGER, name: "x", entries: [] }), status: 400, code: "invalid-input", names: "version" },
  { name: "a ruling revision of 2^31", file: "api/rulings/[id]/revisions.ts", method: "POST", as: "clerk", params: (s) => ({ id: s.issuedRuling }), json: () => ({ revision: 2 ** 31, note: "x", content: {} }), status: 400, code: "invalid-input", names: "revision" },
  { name: "a floor revision of 2^31", file: "api/floor/sittings/[id]/events.ts", method: "POST", as: "clerk", params: (s) => ({ id: s.sitting }), json: () => ({ revision: 2 ** 31, event: { kind: "seconded" } }), status: 400, code: "invalid-input", names: "revision" },
  { name: "a sitting on 30 February (sittingAt)", file: "api/measures/index.ts", method: "POST", as: "clerk", json: () => ({ number: "DATE 1", title: "x", sittingAt: "2026-02-30T10:00:00Z" }), status: 400, code: "invalid-input", names: "sittingAt" },
  { name: "a sitting in year 0000 (sittingAt)", file: "api/measures/[id]/index.ts", method: "PATCH", as: "clerk", params: (s) => ({ id: s.measure }), json: () => ({ version: 1, sittingAt: "0000-01-01T00:00:00Z" }), status: 400, code: "invalid-input", names: "sittingAt" },
  { name: "a ruling's sitting date of 0000-01-01 (sittingDate)", file: "api/rulings/index.ts", method: "POST", as: "clerk", json: (s) => ({ raisedById: s.legislator, target: { kind: "motion", ref: "previous-question", label: "x" }, motion: "previous-question", question: "x?", decision: "not-sustained", reasoning: "x", citations: [], sitting: "x", sittingDate: "0000-01-01" }), status: 400, code: "invalid-input", names: "sittingDate" },
  { name: "a rulebook in force from 30 February (effectiveFrom)", file: "api/rulebooks/[id]/adopt.ts", method: "POST", as: "clerk", params: (s) => ({ id: s.rulebookVersion2 }), json: () => ({ effectiveFrom: "2026-02-30" }), status: 400, code: "invalid-input", names: "effectiveFrom" },
  { name: "a rulebook in force from year 0000 (effectiveFrom)", file: "api/rulebooks/[id]/adopt.ts", method: "POST", as: "clerk", params: (s) => ({ id: s.rulebookVersion2 }), json: () => ({ effectiveFrom: "0000-01-01T00:00:00Z" }), status: 400, code: "invalid-input", names: "effectiveFrom" },
  { name: "rulings from 30 February (?from=)", file: "api/rulings/index.ts", method: "GET", as: "observer", query: () => ({ from: "2026-02-30" }), status: 400, code: "invalid-input", names: "from" },
  { name: "rulings from year 0000 (?from=)", file: "api/rulings/index.ts", method: "GET", as: "observer", query: () => ({ from: "0000-01-01" }), status: 400, code: "invalid-input", names: "from" },
  { name: "an estimates list for a measure id that is no id", file: "api/estimates/index.ts", method: "GET", as: "observer", query: () => ({ measureId: "not-an-id" }), status: 400, code: "invalid-input", names: "measureId" },

  // --- rulebooks: unknown operators, facts, cycles
  { name: "a rule with an unknown operator", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => { const d = doc(s); const i = firstAllRule(d); d.rules[i].conditions.all![0].operator = "outranks"; return { basedOn: s.rulebookVersion, document: d }; }, status: 400, code: "invalid-input", names: "operator" },
  { name: "a rule on an unknown fact", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => { const d = doc(s); const i = firstAllRule(d); d.rules[i].conditions.all![0].fact = "moonPhase"; return { basedOn: s.rulebookVersion, document: d }; }, status: 400, code: "invalid-input", names: "fact" },
  { name: "a rulebook that is a string", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => ({ basedOn: s.rulebookVersion, document: "rules" }), status: 400, code: "invalid-input", names: "document" },
  { name: "a rulebook with no motions", file: "api/rulebooks/index.ts", method: "POST", as: "clerk", json: (s) => ({ basedOn: s.rulebookVersion, document: { ...(s.rulebookDocument as object), motions: [] } }), status: 400, code: "invalid-input", names: "motions" },
];
