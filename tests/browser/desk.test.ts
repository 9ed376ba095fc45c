// The desk shows today, per role, for the seeded Harrowmere chamber: this file makes its own
// measures (one due at the next sitting, one whose filing deadline runs out within the week and
// whose tree has an open error), issues its own ruling and leaves one undelivered message, then
// reads each role's desk as that person sees it. The filing deadline is the adopted rulebook's
// (Harrowmere Standing Orders, fictional, SO 64: 48 hours before the sitting); the rest is the
// product's own contract (issue 15, item 10), common practice, no source.
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { ACCOUNTS, BASE_URL, browserForFile, fitsPhone, shot, signInAs, textOf } from "./browser.ts";
import { api } from "./samples.ts";

const browser = browserForFile();
const stamp = Date.now().toString(36).slice(-5).toUpperCase();
const HOUR = 3_600_000;
let sql: postgres.Sql;
let clerkCookie = "";
const made = { soon: { id: "", number: `DESK ${stamp}A` }, later: { id: "", number: `DESK ${stamp}B` }, ruling: 0, mailId: "", mailSubject: `Desk notice ${stamp}` };
let rule: { hoursBefore: number; citation: string };
let treeErrors = 0;

async function cookieOf(role: string): Promise<string> {
  const a = ACCOUNTS.find((x) => x.role === role && x.chamber === "harrowmere")!;
  const r = await fetch(`${BASE_URL}/api/auth/sign-in/email`, { method: "POST", headers: { "content-type": "application/json", origin: BASE_URL }, body: JSON.stringify({ email: a.email, password: a.password }) });
  if (!r.ok) throw new Error(`sign-in ${role}: ${r.status}`);
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

beforeAll(async () => {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL (the app's database) is needed");
  sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });
  clerkCookie = await cookieOf("clerk");
  const [h] = await sql`SELECT id FROM organization WHERE slug LIKE 'harrowmere%'`;
  // Due in half an hour: the next sitting (unless another test made an earlier one, which the check allows for).
  const soonAt = new Date(Date.now() + HOUR / 2);
  made.soon.id = (await api("/api/measures", clerkCookie, { number: made.soon.number, title: `Desk soon ${stamp}`, status: "on-floor", subjects: ["harbour"], sittingAt: soonAt.toISOString(), text: "## Section 1 — Quays\nSubjects: harbour\nThe quays shall be swept." })).id;
  // The filing deadline of the rulebook in force (another file may adopt a version with other hours).
  const [rb] = await sql`SELECT v.document->'amendments'->'filingDeadline' AS fd FROM rulebook_adoptions a JOIN rulebook_versions v ON v.id = a.version_id WHERE a.chamber_id = ${h.id} AND a.effective_from <= now() ORDER BY a.effective_from DESC, a.adopted_at DESC LIMIT 1`;
  if (!rb?.fd) throw new Error("the rulebook in force has no filing deadline");
  rule = rb.fd as { hoursBefore: number; citation: string };
  // Its filing deadline falls in a day.
  const laterAt = new Date(Date.now() + (rule.hoursBefore + 24) * HOUR);
  made.later.id = (await api("/api/measures", clerkCookie, { number: made.later.number, title: `Desk later ${stamp}`, status: "on-floor", subjects: ["harbour"], sittingAt: laterAt.toISOString(), text: "## Section 1 — Quays\nSubjects: harbour\nThe quays shall be lit." })).id;
  // An amendment on another subject with no sponsor: open errors in the tree check.
  await api(`/api/measures/${made.later.id}/amendments`, clerkCookie, { form: "insert", target: "s1", subjects: ["fisheries"], sponsors: [], text: "Nets shall be dried on the quay." });
  // The member's own draft, which only the member's desk lists (a draft takes part in the tree check).
  await api(`/api/measures/${made.later.id}/amendments`, await cookieOf("member"), { form: "insert", target: "s1", title: `Desk draft ${stamp}`, subjects: ["harbour"], sponsors: [], text: "The quays shall be swept daily.", draft: true });
  treeErrors = (await api(`/api/measures/${made.later.id}/tree`, clerkCookie)).counts.error;
  const [legislator] = await sql`SELECT id FROM legislators WHERE chamber_id = ${h.id} ORDER BY name LIMIT 1`;
  const draft = await api("/api/rulings", clerkCookie, { raisedById: legislator.id, target: { kind: "motion", ref: "previous-question", label: `Desk ruling ${stamp}` }, motion: "previous-question", question: `Is the desk ruling ${stamp} in order?`, decision: "not-sustained", reasoning: "Common practice.", citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }], sitting: "Desk sitting", sittingDate: "2026-04-02" });
  made.ruling = (await api(`/api/rulings/${draft.id}/issue`, clerkCookie, { version: draft.version })).ruling.number;
  const [mail] = await sql`INSERT INTO outbox (kind, chamber_id, "to", subject, text, status, attempts, last_error) VALUES ('test', ${h.id}, ${`nobody-${stamp.toLowerCase()}@harrowmere.example`}, ${made.mailSubject}, 'x', 'failed', 5, '550 no such mailbox') RETURNING id`;
  made.mailId = mail.id;
}, 120_000);

afterAll(async () => {
  if (made.mailId) await sql`DELETE FROM outbox WHERE id = ${made.mailId}`;
  await sql?.end({ timeout: 1 });
});

async function deskAs(role: string): Promise<Page> {
  const page = await browser.freshPage();
  await signInAs(page, role);
  await page.goto(`${BASE_URL}/`);
  return page;
}

describe("the desk", () => {
  for (const role of ["chief-clerk", "clerk", "member", "staff", "observer"] as const) {
    it(`shows today's items to the ${role}`, async () => {
      const page = await deskAs(role);
      const sitting = await textOf(page.getByTestId("desk-sitting"));
      expect(sitting).toContain(made.soon.number);
      expect(sitting).toContain(`Desk soon ${stamp}`);
      expect(sitting).not.toContain(made.later.number);
      const deadlines = await textOf(page.getByTestId("desk-deadlines"));
      expect(deadlines).toContain(made.later.number);
      expect(deadlines).toContain(`${rule.hoursBefore} hours before the sitting`);
      expect(deadlines).toContain(rule.citation);
      expect(deadlines).not.toContain(made.soon.number);
      expect(treeErrors).toBeGreaterThan(0);
      const errors = page.getByTestId("desk-errors").getByRole("listitem").filter({ hasText: made.later.number });
      expect(await textOf(errors)).toContain(`${treeErrors} open error`);
      expect(await page.getByTestId("desk-errors").innerText()).not.toContain(made.soon.number);
      expect(await textOf(page.getByTestId("desk-rulings"))).toContain(`Ruling ${made.ruling}: Is the desk ruling ${stamp} in order?`);
      await textOf(page.getByTestId("desk-analyses"));
      const own = page.getByTestId("desk-own");
      if (role === "member") {
        const text = await textOf(own);
        expect(text).toContain(`A draft amendment to section 1 of ${made.later.number} — “Desk draft ${stamp}” (a draft, not yet filed)`);
      } else if (role === "staff" || role === "observer") {
        expect(await own.count()).toBe(0);
      } else {
        expect(await textOf(own)).not.toContain(`Desk draft ${stamp}`);
      }
      const mail = page.getByTestId("desk-mail");
      if (role === "chief-clerk" || role === "clerk") {
        expect(await textOf(mail)).toContain(`“${made.mailSubject}”`);
        expect(await mail.innerText()).toContain("gave up");
      } else {
        expect(await mail.count()).toBe(0);
      }
      // The deadline link leads to the measure.
      await Promise.all([page.waitForURL(new RegExp(`/measures/${made.later.id}$`)), page.getByTestId("desk-deadlines").getByRole("link", { name: made.later.number }).click()]);
      expect(await textOf(page.locator("h1"))).toContain(made.later.number);
      if (role === "clerk" || role === "member") {
        await page.goto(`${BASE_URL}/`);
        await shot(page, `desk-${role}`);
        if (role === "member") await fitsPhone(page, page.getByTestId("desk-own"), "desk-member-own");
      }
      await page.close();
    });
  }

  it("shows people's e-mail addresses to the chief clerk and clerks only", async () => {
    const clerkEmail = ACCOUNTS.find((a) => a.role === "clerk" && a.chamber === "harrowmere")!.email;
    const memberEmail = ACCOUNTS.find((a) => a.role === "member" && a.chamber === "harrowmere")!.email;
    for (const role of ["chief-clerk", "clerk", "member", "staff", "observer"] as const) {
      const page = await browser.freshPage();
      await signInAs(page, role);
      await page.goto(`${BASE_URL}/people`);
      await textOf(page.getByRole("columnheader", { name: "Role" }));
      const table = page.locator("table").first();
      const text = await table.innerText();
      const headers = await table.getByRole("columnheader").allInnerTexts();
      if (role === "chief-clerk" || role === "clerk") {
        expect(headers, role).toContain("E-mail");
        expect(text, role).toContain(role === "clerk" ? memberEmail : clerkEmail);
      } else {
        expect(headers, role).not.toContain("E-mail");
        expect(text, role).not.toContain(clerkEmail);
        expect(text, role).not.toContain(memberEmail);
      }
      await page.close();
    }
  });
});
