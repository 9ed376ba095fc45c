/**
 * Every page and API route of the app, who may use it, and sample input to call it with.
 * Kept by hand on purpose: tests/access/inventory.test.ts fails when a route file exists that
 * is not listed here (or a listed handler is gone), and tests/access/access.test.ts (API,
 * in-process) and tests/browser/access.test.ts (pages, over HTTP) sign in as every role that
 * is NOT listed, as anonymous and as the other chamber's chief clerk, and expect a refusal.
 * docs/routes.md is rendered from this file (`npx tsx tests/access/render-routes.ts`).
 */
import type { ChamberRole } from "../../src/lib/permissions.ts";

/** Real Harrowmere records the tests look up or create before calling (see access.test.ts). */
export type SampleKey =
  | "measure"
  | "amendment"
  | "draftAmendment"
  | "attachment"
  | "uploadedMeasure"
  | "override"
  | "run"
  | "runOrder"
  | "circulation"
  | "list"
  | "message"
  | "estimate"
  | "sitting"
  | "invitation"
  | "member"
  | "rulebookVersion"
  | "rulebookVersion2"
  | "draftRuling"
  | "issuedRuling"
  | "legislator"
  | "template";

export type Samples = Record<SampleKey, string> & { rulebookDocument: unknown };

export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE" | "ALL";

export const ALL_ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const satisfies readonly ChamberRole[];
const CLERKS = ["chief-clerk", "clerk"] as const satisfies readonly ChamberRole[];
const FILERS = ["chief-clerk", "clerk", "member"] as const satisfies readonly ChamberRole[];
const SENDERS = ["chief-clerk", "clerk", "staff"] as const satisfies readonly ChamberRole[];
const ESTIMATORS = ["chief-clerk", "clerk", "member", "staff"] as const satisfies readonly ChamberRole[];
const CHIEF = ["chief-clerk"] as const satisfies readonly ChamberRole[];

/**
 * Who may call a route:
 * - a list of chamber roles (the permission check; services may narrow further, see `note`);
 * - "public": no sign-in (auth endpoints, signed unsubscribe links, sign-in pages);
 * - "signed-in": any signed-in user, even one in no chamber yet.
 */
export type Audience = readonly ChamberRole[] | "public" | "signed-in";

/**
 * What the other chamber's chief clerk must get:
 * - "refused": the request names Harrowmere records: 403 or 404, and nothing changes (422 naming the
 *   field when the record is named in the body or query rather than the path);
 * - "own-chamber": the route works on the caller's own chamber: a GET answers without any
 *   Harrowmere data in it; a write is not sent (it would only touch Saltreach).
 */
export type OutsiderRule = "refused" | "own-chamber";

export interface ApiRoute {
  file: string;
  method: Method;
  path: string;
  audience: Audience;
  outsider: OutsiderRule;
  params?: Partial<Record<string, SampleKey>>;
  query?: (s: Samples) => Record<string, string>;
  /** A body an allowed Harrowmere user could send (so the outsider gets past parsing to the chamber check). */
  body?: (s: Samples) => unknown;
  /** A non-JSON body (uploads). */
  raw?: (s: Samples) => { body: BodyInit; contentType: string };
  /** The answer is a never-ending stream: only refusals are called. */
  stream?: boolean;
  /**
   * A development tool (the local mail catcher's inbox): not chamber-scoped, 404 in production.
   * Exempt from the "no Harrowmere data" check for the other chamber's chief clerk.
   */
  devOnly?: boolean;
  /**
   * Answers only for the person who started the record, which lives in the server's memory for a
   * while (an ideal-point estimate): no stored sample can stand for it, so "every allowed role reads
   * it" is not called; the refusals are, and tests/browser/positions.test.ts reads it as its starter.
   */
  starterOnly?: boolean;
  note?: string;
}

export interface PageRoute {
  file: string;
  path: string;
  audience: Audience;
  outsider: OutsiderRule;
  params?: Partial<Record<string, SampleKey>>;
  query?: (s: Samples) => Record<string, string>;
  devOnly?: boolean;
  note?: string;
}

const ballots = { kind: "ballots", rows: [{ member: "all", weight: 40, ranking: ["measure", "Q"] }] };
const rulingContent = (s: Samples) => ({
  raisedById: s.legislator,
  target: { kind: "motion", ref: "previous-question", label: "Previous question" },
  motion: "previous-question",
  question: "Was the previous question carried?",
  decision: "not-sustained",
  reasoning: "The division superseded the show of hands.",
  citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }],
  sitting: "Access sitting",
  sittingDate: "2026-04-02",
});
const csv = () => ({ body: "member,rank1,rank2\nall,measure,Q\n", contentType: "text/csv" });

export const API_ROUTES: readonly ApiRoute[] = [
  // accounts (better-auth): sign-in, sign-up, sessions, password reset, organisations
  { file: "api/auth/[...all].ts", method: "ALL", path: "/api/auth/*", audience: "public", outsider: "own-chamber", note: "better-auth; rate-limited sign-in, sign-up and password reset" },

  // people
  { file: "api/people/index.ts", method: "GET", path: "/api/people", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/people/invitations/index.ts", method: "POST", path: "/api/people/invitations", audience: CHIEF, outsider: "own-chamber", body: () => ({ email: "access-test@harrowmere.example", role: "observer" }) },
  { file: "api/people/invitations/[id].ts", method: "DELETE", path: "/api/people/invitations/:id", audience: CHIEF, outsider: "refused", params: { id: "invitation" } },
  { file: "api/people/members/[id].ts", method: "PATCH", path: "/api/people/members/:id", audience: CHIEF, outsider: "refused", params: { id: "member" }, body: () => ({ role: "observer" }), note: "recorded in the people log; never leaves the chamber without a chief clerk" },
  { file: "api/people/members/[id].ts", method: "DELETE", path: "/api/people/members/:id", audience: CHIEF, outsider: "refused", params: { id: "member" }, note: "removes the person from the chamber (the account stays; restorable); never the last chief clerk; recorded in the people log" },
  { file: "api/people/removed/index.ts", method: "GET", path: "/api/people/removed", audience: CHIEF, outsider: "own-chamber" },
  { file: "api/people/removed/[id].ts", method: "POST", path: "/api/people/removed/:id", audience: CHIEF, outsider: "refused", params: { id: "member" }, note: "restores a removed person (by account) with the role they held; recorded in the people log" },
  { file: "api/people/log.ts", method: "GET", path: "/api/people/log", audience: CHIEF, outsider: "own-chamber" },

  // rulebooks
  { file: "api/rulebooks/index.ts", method: "GET", path: "/api/rulebooks", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/rulebooks/index.ts", method: "POST", path: "/api/rulebooks", audience: CLERKS, outsider: "refused", body: (s) => ({ basedOn: s.rulebookVersion, note: "access", document: s.rulebookDocument }), note: "basedOn names a Harrowmere version" },
  { file: "api/rulebooks/[id].ts", method: "GET", path: "/api/rulebooks/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "rulebookVersion" } },
  { file: "api/rulebooks/[id]/adopt.ts", method: "POST", path: "/api/rulebooks/:id/adopt", audience: CLERKS, outsider: "refused", params: { id: "rulebookVersion2" }, body: () => ({ note: "access" }) },
  { file: "api/rulebooks/[id]/export.ts", method: "GET", path: "/api/rulebooks/:id/export", audience: ALL_ROLES, outsider: "refused", params: { id: "rulebookVersion" } },
  { file: "api/rulebooks/compare.ts", method: "GET", path: "/api/rulebooks/compare?from&to", audience: ALL_ROLES, outsider: "refused", query: (s) => ({ from: s.rulebookVersion, to: s.rulebookVersion2 }) },
  { file: "api/rulebooks/import.ts", method: "POST", path: "/api/rulebooks/import", audience: CLERKS, outsider: "own-chamber", note: "multipart upload of a rulebook file" },
  { file: "api/rulebooks/[id]/coverage.ts", method: "GET", path: "/api/rulebooks/:id/coverage?text", audience: ALL_ROLES, outsider: "refused", params: { id: "rulebookVersion" } },
  { file: "api/rulebooks/[id]/links.ts", method: "POST", path: "/api/rulebooks/:id/links", audience: CLERKS, outsider: "refused", params: { id: "rulebookVersion" }, body: () => ({ links: [{ path: "motions.0.clause", clause: "so-1" }] }), note: "saves a new version based on :id" },
  { file: "api/rulebooks/[id]/scenarios.ts", method: "GET", path: "/api/rulebooks/:id/scenarios", audience: ALL_ROLES, outsider: "refused", params: { id: "rulebookVersion" } },
  { file: "api/rulebooks/text/index.ts", method: "GET", path: "/api/rulebooks/text?id", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/rulebooks/text/index.ts", method: "POST", path: "/api/rulebooks/text", audience: CLERKS, outsider: "own-chamber", note: "multipart upload of the chamber's rules" },
  { file: "api/rulebooks/scenarios/index.ts", method: "GET", path: "/api/rulebooks/scenarios", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/rulebooks/scenarios/index.ts", method: "POST", path: "/api/rulebooks/scenarios", audience: CLERKS, outsider: "own-chamber" },
  { file: "api/rulebooks/scenarios/index.ts", method: "PUT", path: "/api/rulebooks/scenarios?mode", audience: CLERKS, outsider: "own-chamber", note: "imports a scenarios file (replaces the bench)" },
  { file: "api/rulebooks/scenarios/[sid].ts", method: "DELETE", path: "/api/rulebooks/scenarios/:sid", audience: CLERKS, outsider: "own-chamber" },
  { file: "api/rulebooks/templates/[id].ts", method: "GET", path: "/api/rulebooks/templates/:id", audience: ALL_ROLES, outsider: "own-chamber", params: { id: "template" }, note: "shipped templates, no chamber data" },

  // floor
  { file: "api/moves.ts", method: "POST", path: "/api/moves", audience: ALL_ROLES, outsider: "refused", body: (s) => ({ version: s.rulebookVersion, state: { pending: [{ motion: "main" }] } }), note: "version names a Harrowmere rulebook version" },
  { file: "api/floor/sittings/index.ts", method: "GET", path: "/api/floor/sittings", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/floor/sittings/index.ts", method: "POST", path: "/api/floor/sittings", audience: CLERKS, outsider: "own-chamber", body: () => ({ title: "Access sitting" }) },
  { file: "api/floor/sittings/[id].ts", method: "GET", path: "/api/floor/sittings/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "sitting" } },
  { file: "api/floor/sittings/[id]/events.ts", method: "POST", path: "/api/floor/sittings/:id/events", audience: CLERKS, outsider: "refused", params: { id: "sitting" }, body: () => ({ revision: 0, event: { kind: "seconded" } }) },
  { file: "api/floor/recorded-votes.ts", method: "GET", path: "/api/floor/recorded-votes", audience: ALL_ROLES, outsider: "own-chamber", note: "the chamber's recorded votes: {votes: [{id, yea, nay, …}]}" },
  { file: "api/floor/sittings/[id]/journal/index.ts", method: "GET", path: "/api/floor/sittings/:id/journal", audience: ALL_ROLES, outsider: "refused", params: { id: "sitting" } },
  { file: "api/floor/sittings/[id]/journal/index.ts", method: "POST", path: "/api/floor/sittings/:id/journal", audience: CLERKS, outsider: "refused", params: { id: "sitting" }, body: () => ({ revision: 0 }), note: "approve the journal" },
  { file: "api/floor/sittings/[id]/journal/index.ts", method: "PUT", path: "/api/floor/sittings/:id/journal", audience: CLERKS, outsider: "refused", params: { id: "sitting" }, body: () => ({}), note: "always refused (409): an approved journal is changed only by a correction" },
  { file: "api/floor/sittings/[id]/journal/corrections.ts", method: "POST", path: "/api/floor/sittings/:id/journal/corrections", audience: CLERKS, outsider: "refused", params: { id: "sitting" }, body: () => ({ revision: 0, reason: "x" }) },
  { file: "api/floor/sittings/[id]/stream.ts", method: "GET", path: "/api/floor/sittings/:id/stream", audience: ALL_ROLES, outsider: "refused", params: { id: "sitting" }, stream: true, note: "server-sent events" },

  // measures and amendments
  { file: "api/measures/index.ts", method: "GET", path: "/api/measures", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/measures/index.ts", method: "POST", path: "/api/measures", audience: CLERKS, outsider: "own-chamber", body: () => ({ number: "ACC 1", title: "Access measure" }) },
  { file: "api/measures/upload.ts", method: "POST", path: "/api/measures/upload", audience: CLERKS, outsider: "own-chamber", note: "multipart: a .txt, .md, .pdf or .docx document" },
  { file: "api/measures/sponsors.ts", method: "GET", path: "/api/measures/sponsors", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/measures/[id]/index.ts", method: "GET", path: "/api/measures/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "api/measures/[id]/index.ts", method: "PATCH", path: "/api/measures/:id", audience: CLERKS, outsider: "refused", params: { id: "measure" }, body: () => ({ version: 1, title: "Taken over" }) },
  { file: "api/measures/[id]/archive.ts", method: "POST", path: "/api/measures/:id/archive", audience: CLERKS, outsider: "refused", params: { id: "measure" }, body: () => ({ version: 1 }), note: "archived measures leave the lists and option forms, stay readable; later changes answer 409 archived" },
  { file: "api/measures/[id]/amendments.ts", method: "GET", path: "/api/measures/:id/amendments", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "api/measures/[id]/amendments.ts", method: "POST", path: "/api/measures/:id/amendments", audience: FILERS, outsider: "refused", params: { id: "measure" }, body: () => ({ form: "insert", target: "measure", text: "access" }) },
  { file: "api/measures/[id]/tree.ts", method: "GET", path: "/api/measures/:id/tree", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "api/measures/[id]/audit.ts", method: "GET", path: "/api/measures/:id/audit", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "api/measures/[id]/attachments/[aid].ts", method: "GET", path: "/api/measures/:id/attachments/:aid", audience: ALL_ROLES, outsider: "refused", params: { id: "uploadedMeasure", aid: "attachment" } },
  { file: "api/measures/[id]/overrides/index.ts", method: "POST", path: "/api/measures/:id/overrides", audience: CLERKS, outsider: "refused", params: { id: "measure" }, body: (s) => ({ amendmentId: s.amendment, code: "not-germane", version: 1, rulingRef: "access" }) },
  { file: "api/measures/[id]/overrides/[oid].ts", method: "DELETE", path: "/api/measures/:id/overrides/:oid", audience: CLERKS, outsider: "refused", params: { id: "measure", oid: "override" } },
  { file: "api/amendments/[id]/index.ts", method: "GET", path: "/api/amendments/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "amendment" } },
  { file: "api/amendments/[id]/index.ts", method: "PATCH", path: "/api/amendments/:id", audience: FILERS, outsider: "refused", params: { id: "amendment" }, body: () => ({ version: 1, text: "taken over" }), note: "a member only while it is their own filed amendment" },
  { file: "api/amendments/[id]/file.ts", method: "POST", path: "/api/amendments/:id/file", audience: FILERS, outsider: "refused", params: { id: "draftAmendment" }, body: () => ({ version: 1 }), note: "a member only their own draft; body `{ version, confirm? }`, 409 `needs-confirmation` when the same amendment was filed within the hour" },

  // estimates and order analyses
  { file: "api/estimates/index.ts", method: "GET", path: "/api/estimates", audience: ALL_ROLES, outsider: "own-chamber", query: (s) => ({ measureId: s.measure }), note: "shared and own estimates only" },
  { file: "api/estimates/index.ts", method: "POST", path: "/api/estimates", audience: ESTIMATORS, outsider: "refused", body: (s) => ({ measureId: s.measure, title: "Access estimate", scope: [], content: ballots }) },
  { file: "api/estimates/options.ts", method: "GET", path: "/api/estimates/options", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "api/estimates/template.ts", method: "GET", path: "/api/estimates/template", audience: ALL_ROLES, outsider: "refused", query: (s) => ({ measureId: s.measure }) },
  { file: "api/estimates/versions.ts", method: "GET", path: "/api/estimates/versions", audience: ALL_ROLES, outsider: "refused", query: (s) => ({ measureId: s.measure }) },
  { file: "api/ideal-points/import.ts", method: "POST", path: "/api/ideal-points/import", audience: ESTIMATORS, outsider: "own-chamber", raw: () => ({ body: "member,RC 1\nA,yea\nB,nay\n", contentType: "text/csv" }), note: "reads the CSV and answers; nothing is stored" },
  { file: "api/ideal-points/runs/index.ts", method: "POST", path: "/api/ideal-points/runs", audience: ESTIMATORS, outsider: "own-chamber", body: () => ({ dimensions: 1, votes: [{ id: "v1", yea: ["A"], nay: ["B"] }], minVotes: 1, bootstrap: 0 }), note: "an estimate in a worker, held in the server's memory for its author" },
  { file: "api/ideal-points/runs/[id].ts", method: "GET", path: "/api/ideal-points/runs/:id", audience: ESTIMATORS, outsider: "refused", params: { id: "run" }, starterOnly: true, note: "only the person who started it" },
  { file: "api/ideal-points/runs/[id].ts", method: "DELETE", path: "/api/ideal-points/runs/:id", audience: ESTIMATORS, outsider: "refused", params: { id: "run" }, note: "only the person who started it" },
  { file: "api/estimates/import.ts", method: "POST", path: "/api/estimates/import", audience: ESTIMATORS, outsider: "refused", query: (s) => ({ measureId: s.measure, title: "Access import" }), raw: csv },
  { file: "api/estimates/roster.ts", method: "POST", path: "/api/estimates/roster", audience: ESTIMATORS, outsider: "refused", body: (s) => ({ measureId: s.measure, title: "Access roster draft", scope: [] }), note: "an unfilled draft" },
  { file: "api/estimates/[id].ts", method: "GET", path: "/api/estimates/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "estimate" }, note: "private estimates only to their author" },
  { file: "api/estimates/[id]/analysis.ts", method: "GET", path: "/api/estimates/:id/analysis", audience: ALL_ROLES, outsider: "refused", params: { id: "estimate" } },
  { file: "api/estimates/[id]/duplicate.ts", method: "POST", path: "/api/estimates/:id/duplicate", audience: ESTIMATORS, outsider: "refused", params: { id: "estimate" }, body: () => ({}) },
  { file: "api/estimates/[id]/sharing.ts", method: "PUT", path: "/api/estimates/:id/sharing", audience: ESTIMATORS, outsider: "refused", params: { id: "estimate" }, body: () => ({ sharedRoles: [] }), note: "author only" },
  { file: "api/estimates/[id]/versions.ts", method: "POST", path: "/api/estimates/:id/versions", audience: ESTIMATORS, outsider: "refused", params: { id: "estimate" }, body: () => ({ basedOn: 1, scope: [], content: ballots }), note: "author only" },
  { file: "api/analysis/runs/index.ts", method: "POST", path: "/api/analysis/runs", audience: ALL_ROLES, outsider: "refused", body: (s) => ({ estimateId: s.estimate }) },
  { file: "api/analysis/runs/[id].ts", method: "GET", path: "/api/analysis/runs/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "run" } },
  { file: "api/analysis/runs/[id].ts", method: "DELETE", path: "/api/analysis/runs/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "run" }, note: "the person who started it; the chief clerk and clerks any run of the chamber" },
  { file: "api/analysis/runs/[id]/orders.ts", method: "GET", path: "/api/analysis/runs/:id/orders", audience: ALL_ROLES, outsider: "refused", params: { id: "run" } },
  { file: "api/analysis/runs/[id]/walk.ts", method: "GET", path: "/api/analysis/runs/:id/walk?order", audience: ALL_ROLES, outsider: "refused", params: { id: "run" }, query: (s) => ({ order: s.runOrder }) },
  { file: "api/analysis/runs/[id]/script.ts", method: "GET", path: "/api/analysis/runs/:id/script?order", audience: ALL_ROLES, outsider: "refused", params: { id: "run" }, query: (s) => ({ order: s.runOrder }) },

  // rulings and circulation
  { file: "api/rulings/index.ts", method: "GET", path: "/api/rulings", audience: ALL_ROLES, outsider: "own-chamber", note: "?status=draft or all: clerks only; ?motion= takes the motion's id or the name the adopted rulebook gives it; each result carries `motionName`" },
  { file: "api/rulings/index.ts", method: "POST", path: "/api/rulings", audience: CLERKS, outsider: "refused", body: (s) => rulingContent(s), note: "raisedById names a Harrowmere legislator" },
  { file: "api/rulings/options.ts", method: "GET", path: "/api/rulings/options", audience: CLERKS, outsider: "own-chamber", note: "`rulebook.motions`: the adopted rulebook's motions by name" },
  { file: "api/rulings/related.ts", method: "GET", path: "/api/rulings/related", audience: ALL_ROLES, outsider: "own-chamber", query: () => ({ text: "previous question division" }) },
  { file: "api/rulings/[id].ts", method: "GET", path: "/api/rulings/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "issuedRuling" }, note: "drafts only to clerks" },
  { file: "api/rulings/[id].ts", method: "PUT", path: "/api/rulings/:id", audience: CLERKS, outsider: "refused", params: { id: "draftRuling" }, body: (s) => ({ version: 1, content: rulingContent(s) }) },
  { file: "api/rulings/[id]/issue.ts", method: "POST", path: "/api/rulings/:id/issue", audience: CLERKS, outsider: "refused", params: { id: "draftRuling" }, body: () => ({ version: 1 }) },
  { file: "api/rulings/[id]/revisions.ts", method: "POST", path: "/api/rulings/:id/revisions", audience: CLERKS, outsider: "refused", params: { id: "issuedRuling" }, body: (s) => ({ revision: 1, note: "access", content: rulingContent(s) }) },
  { file: "api/circulation/index.ts", method: "GET", path: "/api/circulation", audience: SENDERS, outsider: "own-chamber" },
  { file: "api/circulation/index.ts", method: "POST", path: "/api/circulation", audience: SENDERS, outsider: "refused", body: (s) => ({ rulingId: s.issuedRuling, listId: s.list }) },
  { file: "api/circulation/[id].ts", method: "GET", path: "/api/circulation/:id", audience: SENDERS, outsider: "refused", params: { id: "circulation" } },
  { file: "api/circulation/digest.ts", method: "POST", path: "/api/circulation/digest", audience: SENDERS, outsider: "own-chamber", body: () => ({ sitting: "Access sitting", date: "2026-04-02" }), note: "409 `needs-confirmation` when that sitting's digest already went to the list; `confirm: true` sends it again" },
  { file: "api/circulation/lists/index.ts", method: "GET", path: "/api/circulation/lists", audience: SENDERS, outsider: "own-chamber" },
  { file: "api/circulation/lists/index.ts", method: "POST", path: "/api/circulation/lists", audience: SENDERS, outsider: "own-chamber", body: () => ({ name: "Access list", entries: [] }) },
  { file: "api/circulation/lists/[id].ts", method: "GET", path: "/api/circulation/lists/:id", audience: SENDERS, outsider: "refused", params: { id: "list" } },
  { file: "api/circulation/lists/[id].ts", method: "PUT", path: "/api/circulation/lists/:id", audience: SENDERS, outsider: "refused", params: { id: "list" }, body: () => ({ version: 1, name: "Taken over", entries: [] }) },
  { file: "api/circulation/lists/[id].ts", method: "DELETE", path: "/api/circulation/lists/:id", audience: SENDERS, outsider: "refused", params: { id: "list" } },
  { file: "api/circulation/messages/[id]/retry.ts", method: "POST", path: "/api/circulation/messages/:id/retry", audience: SENDERS, outsider: "refused", params: { id: "message" } },
  { file: "api/circulation/unsubscribe.ts", method: "GET", path: "/api/circulation/unsubscribe?token", audience: "public", outsider: "own-chamber", note: "the signed token is the authority" },
  { file: "api/circulation/unsubscribe.ts", method: "POST", path: "/api/circulation/unsubscribe", audience: "public", outsider: "own-chamber", note: "the signed token is the authority" },
  { file: "api/dev/mail.ts", method: "GET", path: "/api/dev/mail", audience: CHIEF, outsider: "own-chamber", devOnly: true, note: "development only (GAVELWRIGHT_DEV_MAILBOX=1, 404 otherwise): what the local catcher caught for the chief clerk's chamber: mail it sent, and chamber-less mail to its people, invitees or list addresses" },
];

export const PAGE_ROUTES: readonly PageRoute[] = [
  { file: "sign-in.astro", path: "/sign-in", audience: "public", outsider: "own-chamber" },
  { file: "sign-up.astro", path: "/sign-up", audience: "public", outsider: "own-chamber" },
  { file: "forgot-password.astro", path: "/forgot-password", audience: "public", outsider: "own-chamber" },
  { file: "reset-password.astro", path: "/reset-password", audience: "public", outsider: "own-chamber" },
  { file: "unsubscribe/index.astro", path: "/unsubscribe", audience: "public", outsider: "own-chamber", note: "signed token" },
  { file: "invitations/[id].astro", path: "/invitations/:id", audience: "public", outsider: "own-chamber", note: "the invitation id is the secret; accepting needs the invited address" },
  { file: "chambers.astro", path: "/chambers", audience: "signed-in", outsider: "own-chamber" },
  { file: "404.astro", path: "/404", audience: "public", outsider: "own-chamber", note: "the not-found answer inside the layout: for an address no page answers, and rendered in place (answerPage) for a record the chamber does not have or a damaged link; with a title and a way back" },
  { file: "not-permitted.astro", path: "/not-permitted", audience: "signed-in", outsider: "own-chamber", note: "rendered in place (403) by every page a role may not open (guardPage); says which roles may, with a way back" },
  { file: "index.astro", path: "/", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "people.astro", path: "/people", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "people/log.astro", path: "/people/log", audience: CHIEF, outsider: "own-chamber" },
  { file: "rulebooks/index.astro", path: "/rulebooks", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "rulebooks/new.astro", path: "/rulebooks/new", audience: CLERKS, outsider: "own-chamber", note: "other roles get the not-permitted page (403)" },
  { file: "rulebooks/[id].astro", path: "/rulebooks/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "rulebookVersion" } },
  { file: "rulebooks/compare.astro", path: "/rulebooks/compare?from&to", audience: ALL_ROLES, outsider: "refused", query: (s) => ({ from: s.rulebookVersion, to: s.rulebookVersion2 }) },
  { file: "floor/index.astro", path: "/floor", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "floor/moves.astro", path: "/floor/moves", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "floor/[id].astro", path: "/floor/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "sitting" } },
  { file: "floor/[id]/journal.astro", path: "/floor/:id/journal", audience: ALL_ROLES, outsider: "refused", params: { id: "sitting" } },
  { file: "measures/index.astro", path: "/measures", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "measures/[id]/index.astro", path: "/measures/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "measures/[id]/tree.astro", path: "/measures/:id/tree", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "measures/[id]/print.astro", path: "/measures/:id/print", audience: ALL_ROLES, outsider: "refused", params: { id: "measure" } },
  { file: "orders/index.astro", path: "/orders", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "orders/positions.astro", path: "/orders/positions", audience: ESTIMATORS, outsider: "own-chamber" },
  { file: "orders/[id].astro", path: "/orders/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "estimate" } },
  { file: "orders/[id]/script.astro", path: "/orders/:id/script?run&order", audience: ALL_ROLES, outsider: "refused", params: { id: "estimate" }, query: (s) => ({ run: s.run, order: s.runOrder }) },
  { file: "rulings/index.astro", path: "/rulings", audience: ALL_ROLES, outsider: "own-chamber" },
  { file: "rulings/new.astro", path: "/rulings/new", audience: CLERKS, outsider: "own-chamber", note: "other roles get the not-permitted page (403)" },
  { file: "rulings/[id].astro", path: "/rulings/:id", audience: ALL_ROLES, outsider: "refused", params: { id: "issuedRuling" } },
  { file: "circulation/index.astro", path: "/circulation", audience: SENDERS, outsider: "own-chamber" },
  { file: "dev/mail.astro", path: "/dev/mail", audience: CHIEF, outsider: "own-chamber", devOnly: true, note: "development only (GAVELWRIGHT_DEV_MAILBOX=1, 404 otherwise): what the local catcher caught for the chief clerk's chamber: mail it sent, and chamber-less mail to its people, invitees or list addresses" },
];

/** The URL of an entry with its sample params and query filled in. */
export function urlOf(entry: { path: string; params?: Partial<Record<string, SampleKey>>; query?: (s: Samples) => Record<string, string> }, s: Samples): string {
  let path = entry.path.replace(/\?.*$/, "");
  for (const [name, key] of Object.entries(entry.params ?? {})) path = path.replace(`:${name}`, encodeURIComponent(s[key!]));
  const q = entry.query ? new URLSearchParams(entry.query(s)).toString() : "";
  return q ? `${path}?${q}` : path;
}

/** What the other chamber's chief clerk may get from a "refused" entry. */
export function outsiderStatuses(entry: { params?: object }): number[] {
  return entry.params && Object.keys(entry.params).length > 0 ? [403, 404] : [403, 404, 422];
}

/** Roles of the chamber that the entry refuses. */
export function refusedRoles(audience: Audience): ChamberRole[] {
  if (audience === "public" || audience === "signed-in") return [];
  return ALL_ROLES.filter((r) => !audience.includes(r));
}
