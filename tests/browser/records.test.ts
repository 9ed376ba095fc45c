// Records a clerk can trust, in the browser: filing answers at once with the amendment named in
// words and the tree check's findings, and asks before filing the same thing twice; what cannot be
// undone (withdrawing, issuing a ruling, changing a role, removing a person, cancelling an
// invitation, archiving a measure)
// asks first in a dialog that names the thing, with the focus moved into it, at desktop and phone
// width; sending a ruling to a list that already had it asks first; the people log says who did
// what. Every test makes its own measures, rulings, lists and people. Common practice, no source.
import { describe, expect, it } from "vitest";
import postgres from "postgres";
import { randomUUID } from "node:crypto";
import type { Locator, Page } from "playwright-core";
import { BASE_URL, browserForFile, fitsPhone, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();
const stamp = () => `${Date.now() % 1_000_000}`;

async function api(page: Page, method: "POST" | "GET", path: string, data?: unknown) {
  const res = await page.request.fetch(`${BASE_URL}${path}`, { method, data, headers: { origin: BASE_URL } });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

/** A measure of the test's own, created through the API as the signed-in clerk. */
async function ownMeasure(page: Page, label: string): Promise<{ id: string; number: string; version: number }> {
  const number = `HCR ${label} ${stamp()}`;
  const m = await api(page, "POST", "/api/measures", { number, title: `Quay records ${label}`, subjects: ["harbour"], text: "## Section 1 — Lamps\nSubjects: lighting\nEvery quay shall be lit.\nLamps shall be bright.\n## Section 2 — Funding\nSubjects: finance\nHarbour dues pay for it." });
  return { id: m.id, number, version: m.version };
}

/** The dialog is open, named, says what follows, and has the focus inside it. */
async function expectConfirmDialog(dialog: Locator, title: string | RegExp, says: RegExp): Promise<void> {
  await visible(dialog);
  const heading = await textOf(dialog.getByRole("heading"));
  if (typeof title === "string") expect(heading).toBe(title);
  else expect(heading).toMatch(title);
  expect(await dialog.innerText()).toMatch(says);
  expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
}

async function fillAmendment(page: Page, o: { target: string; title: string; text: string; form?: string }) {
  const form = page.getByTestId("file-amendment");
  await form.getByLabel("Form").selectOption(o.form ?? "insert");
  await form.getByLabel("Amends").selectOption(o.target);
  await form.getByLabel("Short title").fill(o.title);
  await form.getByLabel("Text of the amendment").fill(o.text);
  await form.getByLabel("Subject tags").fill("lighting");
}

/** The confirmation after filing: the page reloads with the new row and the confirmation stays, with the focus on it. */
async function confirmation(page: Page): Promise<string> {
  await page.waitForLoadState("load");
  return textOf(page.getByTestId("filing-confirmation"), 30_000);
}

async function fileAndConfirm(page: Page): Promise<string> {
  await page.getByTestId("file-amendment").getByRole("button", { name: "File amendment" }).click();
  return confirmation(page);
}

describe("filing", () => {
  it("answers at once with the amendment in words and the tree check's findings, and asks before filing the same thing twice", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const m = await ownMeasure(page, "F");
    await page.goto(`${BASE_URL}/measures/${m.id}`);

    await fillAmendment(page, { target: "s1", title: "Brighter lamps", text: "Insert: of at least 4000 lumens." });
    let said = await fileAndConfirm(page);
    expect(said).toContain(`Filed as Amendment A1 to section 1 of ${m.number}.`);
    expect(said).toContain("first degree");
    expect(said).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-/);
    await expect.poll(() => page.evaluate(() => document.activeElement?.closest("[aria-label='Filing confirmation']") !== null)).toBe(true);

    await page.goto(`${BASE_URL}/measures/${m.id}`);
    await fillAmendment(page, { target: "A1", title: "Amber lamps", text: "Insert: amber near nests." });
    said = await fileAndConfirm(page);
    expect(said).toContain(`Filed as Amendment A2 to Amendment A1 to ${m.number}.`);
    expect(said).toContain("second degree");

    // A third-degree amendment is out of order (Robert's Rules of Order Revised, 1915, §33): said at once, not only in the tree.
    await page.goto(`${BASE_URL}/measures/${m.id}`);
    await fillAmendment(page, { target: "A2", title: "Dimmable amber", text: "Insert: dimmable." });
    said = await fileAndConfirm(page);
    expect(said).toContain(`Filed as Amendment A3 to Amendment A2 to ${m.number}.`);
    expect(await textOf(page.getByTestId("filing-findings"))).toMatch(/Out of order:/);
    await shot(page, "records-filing-confirmation");
    // The confirmation itself fits the phone's width (the amendments table above it scrolls on its own).
    await fitsPhone(page, page.getByTestId("filing-confirmation"), "records-filing-confirmation");

    // The same filing again within the hour: the form asks, and nothing is stored until the clerk says so.
    await page.goto(`${BASE_URL}/measures/${m.id}`);
    await fillAmendment(page, { target: "A2", title: "Dimmable amber", text: "Insert: dimmable." });
    await page.getByTestId("file-amendment").getByRole("button", { name: "File amendment" }).click();
    const repeat = page.getByTestId("filing-repeat");
    expect(await textOf(repeat)).toContain(`Amendment A3 to Amendment A2 to ${m.number}`);
    await expect.poll(() => repeat.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    await shot(page, "records-filing-repeat");
    expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments).toHaveLength(3);
    await repeat.getByRole("button", { name: "File it anyway" }).click();
    said = await confirmation(page);
    expect(said).toContain(`Filed as Amendment A4 to Amendment A2 to ${m.number}.`);
    expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments).toHaveLength(4);
    await page.close();
  });

  it("a draft filed later asks first, naming it; the same text again asks before it takes a number; then it answers as a filing does", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const m = await ownMeasure(page, "D");
    const saveDraft = async (title: string) => {
      await page.goto(`${BASE_URL}/measures/${m.id}`);
      await fillAmendment(page, { target: "s2", title, text: "Insert: paid quarterly." });
      await page.getByTestId("file-amendment").getByRole("button", { name: "Save as draft" }).click();
      await page.getByTestId("file-amendment").getByText(/Saved as a draft/).waitFor({ timeout: 30_000 });
    };
    const fileNow = async () => {
      await page.goto(`${BASE_URL}/measures/${m.id}`);
      await page.getByRole("button", { name: "File now…" }).click();
      return page.getByTestId("file-draft-confirm");
    };

    await saveDraft("Quarterly dues");
    let dialog = await fileNow();
    await expectConfirmDialog(dialog, `File the draft amendment to section 2 of ${m.number}?`, /next amendment number.*receipt goes to its sponsors/s);
    await fitsPhone(page, dialog, "records-file-draft-dialog");
    // Cancelling files nothing.
    await dialog.getByRole("button", { name: "Cancel" }).click();
    expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments.map((a: { status: string }) => a.status)).toEqual(["draft"]);
    dialog = await fileNow();
    await dialog.getByRole("button", { name: "File it" }).click();
    let said = await confirmation(page);
    expect(said).toContain(`Filed as Amendment A1 to section 2 of ${m.number}.`);

    // The same text saved again as a draft: filing it asks the repeat question inside the dialog.
    await saveDraft("Quarterly dues");
    dialog = await fileNow();
    await dialog.getByRole("button", { name: "File it" }).click();
    await expect.poll(() => textOf(dialog.getByRole("heading"))).toBe("File the same amendment again?");
    expect(await dialog.innerText()).toContain(`Amendment A1 to section 2 of ${m.number}`);
    await shot(page, "records-draft-repeat");
    expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments.filter((a: { status: string }) => a.status === "draft")).toHaveLength(1);
    await dialog.getByRole("button", { name: "File it anyway" }).click();
    said = await confirmation(page);
    expect(said).toContain(`Filed as Amendment A2 to section 2 of ${m.number}.`);
    await page.close();
  });
});

describe("withdrawing an amendment", () => {
  it("asks in a dialog naming the amendment; cancelling changes nothing; confirming withdraws it (desktop and phone)", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const m = await ownMeasure(page, "W");
    await page.context().clearCookies();
    await signInAs(page, "member");
    await api(page, "POST", `/api/measures/${m.id}/amendments`, { form: "insert", target: "s2", title: "Ring-fenced dues", text: "Insert: in a separate account.", subjects: ["finance"] });
    await page.goto(`${BASE_URL}/measures/${m.id}`);
    const row = page.getByTestId("amendments-table").locator("tr#A1");
    expect(await textOf(row)).toContain("Filed");
    // No select that withdraws on change: a button that asks first.
    expect(await row.locator("select").count()).toBe(0);

    for (const width of [1360, 390]) {
      await page.setViewportSize({ width, height: width === 390 ? 844 : 900 });
      await row.getByRole("button", { name: "Withdraw…" }).click();
      const dialog = page.getByTestId("status-confirm");
      await expectConfirmDialog(dialog, `Withdraw Amendment A1 to section 2 of ${m.number}?`, /cannot be undone/);
      const box = await dialog.boundingBox();
      expect(box!.x).toBeGreaterThanOrEqual(0);
      expect(box!.x + box!.width).toBeLessThanOrEqual(width);
      await shot(page, width === 390 ? "records-withdraw-dialog-phone" : "records-withdraw-dialog");
      await dialog.getByRole("button", { name: "Cancel" }).click();
      await expect.poll(() => dialog.isVisible()).toBe(false);
      expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments[0].status).toBe("filed");
    }
    await page.setViewportSize({ width: 1360, height: 900 });
    await row.getByRole("button", { name: "Withdraw…" }).click();
    await page.getByTestId("status-confirm").getByRole("button", { name: "Withdraw it" }).click();
    await page.waitForLoadState("load");
    await expect.poll(async () => (await page.getByTestId("amendments-table").locator("tr#A1").innerText()).includes("Withdrawn"), { timeout: 30_000 }).toBe(true);
    expect((await api(page, "GET", `/api/measures/${m.id}/amendments`)).amendments[0].status).toBe("withdrawn");
    await page.close();
  });
});

describe("rulings", () => {
  it("issuing asks first; sending to a list that already had the ruling asks before sending again", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const options = await api(page, "GET", "/api/rulings/options");
    const draft = await api(page, "POST", "/api/rulings", {
      raisedById: options.legislators[0].id,
      target: { kind: "motion", ref: "previous-question", label: "Previous question" },
      motion: "previous-question",
      question: `Was the records test's question in order (${stamp()})?`,
      decision: "sustained",
      reasoning: "The motion was made in proper form.",
      citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }],
      sitting: "Records sitting",
      sittingDate: "2026-04-02",
    });
    const list = await api(page, "POST", "/api/circulation/lists", { name: `Records desk ${stamp()}`, entries: [{ kind: "address", email: "records-desk@courier.example.org", name: "Records desk" }] });
    await page.goto(`${BASE_URL}/rulings/${draft.id}`);
    await page.getByRole("button", { name: "Issue ruling…" }).click();
    const dialog = page.getByTestId("ruling-confirm");
    await expectConfirmDialog(dialog, /^Issue Ruling \d+\?$/, /cannot be undone/);
    await fitsPhone(page, dialog, "records-issue-dialog");
    await dialog.getByRole("button", { name: "Issue it" }).click();
    await expect.poll(() => page.getByText(/is issued\./).count()).toBe(1);

    const choose = async () => {
      const select = page.getByLabel("Distribution list");
      await expect.poll(() => select.locator("option", { hasText: list.name }).count()).toBe(1);
      await select.selectOption(list.id);
    };
    await choose();
    await page.getByRole("button", { name: "Send by e-mail" }).click();
    await expect.poll(() => page.getByText(/Queued 1 message\./).count()).toBe(1);
    await page.getByRole("button", { name: "Send by e-mail" }).click();
    await expectConfirmDialog(dialog, /^Send Ruling \d+ to this list again\?$/, new RegExp(`already went to “${list.name}”.*get it twice`, "s"));
    expect(await dialog.innerText()).not.toMatch(/\d{4}-\d{2}-\d{2}T/);
    await shot(page, "records-resend-dialog");
    await dialog.getByRole("button", { name: "Cancel" }).click();
    expect((await api(page, "GET", `/api/rulings/${draft.id}`)).circulations).toHaveLength(1);
    await page.getByRole("button", { name: "Send by e-mail" }).click();
    await dialog.getByRole("button", { name: "Send it again" }).click();
    await expect.poll(async () => (await api(page, "GET", `/api/rulings/${draft.id}`)).circulations.length).toBe(2);
    await page.close();
  });
});

describe("people", () => {
  it("the chief clerk changes a role, removes and restores a person, each after a dialog, and reads who did what in the people log", async () => {
    // A person of the test's own, added to the chamber directly (never one of the demo accounts).
    const sql = postgres(process.env.DATABASE_URL!, { max: 1 });
    const name = `Rowan Tidewell ${stamp()}`;
    try {
      const [org] = await sql`SELECT id FROM organization WHERE slug = 'harrowmere'`;
      const userId = randomUUID();
      await sql`INSERT INTO "user" (id, name, email, email_verified, created_at, updated_at) VALUES (${userId}, ${name}, ${`rowan.${userId.slice(0, 8)}@harrowmere.example`}, true, now(), now())`;
      await sql`INSERT INTO member (id, organization_id, user_id, role, created_at) VALUES (${randomUUID()}, ${org.id}, ${userId}, 'staff', now())`;
    } finally {
      await sql.end();
    }
    const page = await browser.freshPage();
    await signInAs(page, "chief-clerk");
    await page.goto(`${BASE_URL}/people`);
    const role = page.getByLabel(`Role of ${name}`);
    await visible(role);
    await role.selectOption("clerk");
    const dialog = page.getByTestId("people-confirm");
    await expectConfirmDialog(dialog, `Make ${name} Clerk?`, /cannot be undone/);
    await dialog.getByRole("button", { name: "Change the role" }).click();
    expect(await textOf(page.getByRole("status").filter({ hasText: "is now Clerk" }))).toBe(`${name} is now Clerk. The change is in the people log.`);

    await page.getByRole("button", { name: `Remove ${name}…` }).click();
    await expectConfirmDialog(dialog, `Remove ${name} from the chamber?`, /loses access to the chamber at once/);
    await fitsPhone(page, dialog, "records-remove-dialog");
    await dialog.getByRole("button", { name: "Remove", exact: true }).click();
    await visible(page.getByRole("status").filter({ hasText: "was removed from the chamber" }));
    await expect.poll(() => page.getByLabel(`Role of ${name}`).count()).toBe(0);
    const removed = page.getByTestId("removed-people");
    expect(await textOf(removed)).toContain(name);
    await shot(page, "records-people-removed");

    await removed.getByRole("button", { name: `Restore ${name}…` }).click();
    await expectConfirmDialog(dialog, `Restore ${name} as Clerk?`, /access to the chamber again/);
    await dialog.getByRole("button", { name: "Restore" }).click();
    await visible(page.getByRole("status").filter({ hasText: "is back in the chamber as Clerk" }));
    await visible(page.getByLabel(`Role of ${name}`));

    await page.getByRole("link", { name: /People log/ }).click();
    await page.waitForURL(`${BASE_URL}/people/log`);
    const log = await textOf(page.getByTestId("people-log"));
    expect(log).toContain(`Changed the role of ${name} from Staff to Clerk`);
    expect(log).toContain(`Removed ${name} (Clerk) from the chamber`);
    expect(log).toContain(`Restored ${name} as Clerk`);
    expect(log).toContain("Odile Fenwright");
    expect(log).not.toMatch(/\d{4}-\d{2}-\d{2}T|chief-clerk|role-changed/);
    await shot(page, "records-people-log");
    await page.close();
  });
});

describe("invitations", () => {
  it("cancelling an invitation asks first, naming the address; keeping it changes nothing", async () => {
    const email = `withdrawn-${stamp()}@example.org`;
    const page = await browser.freshPage();
    await signInAs(page, "chief-clerk");
    await page.goto(`${BASE_URL}/people`);
    await page.getByLabel("E-mail to invite").fill(email);
    await page.getByRole("button", { name: "Send invitation" }).click();
    await visible(page.getByText(`Invitation sent to ${email}.`));
    const cancel = page.getByRole("button", { name: `Cancel the invitation to ${email}…` });
    const dialog = page.getByTestId("people-confirm");

    await cancel.click();
    await expectConfirmDialog(dialog, `Cancel the invitation to ${email}?`, /stops working at once; this cannot be undone/);
    await dialog.getByRole("button", { name: "Keep it" }).click();
    await expect.poll(() => dialog.isVisible()).toBe(false);
    expect(await cancel.count(), "kept: the invitation is still listed").toBe(1);

    await cancel.click();
    await shot(page, "records-cancel-invitation");
    await fitsPhone(page, dialog, "records-cancel-invitation");
    await dialog.getByRole("button", { name: "Cancel the invitation" }).click();
    await visible(page.getByRole("status").filter({ hasText: `Invitation to ${email} cancelled.` }));
    await expect.poll(() => cancel.count()).toBe(0);
    await page.close();
  });
});

describe("archiving a measure", () => {
  it("asks first, then the measure leaves the list, stays readable and offers no forms", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const m = await ownMeasure(page, "X");
    // An amendment on another subject with no sponsor: findings a clerk may override, until the measure is archived.
    await api(page, "POST", `/api/measures/${m.id}/amendments`, { form: "insert", target: "s1", subjects: ["fisheries"], sponsors: [], text: "Nets shall be dried on the quay." });
    const overrideOffers = async () => {
      await page.goto(`${BASE_URL}/measures/${m.id}/tree`);
      await page.getByRole("button", { name: "A1", exact: true }).first().click();
      await visible(page.getByTestId(/^finding-A1-/).first());
      return page.getByRole("button", { name: "Override with a ruling…" }).count();
    };
    expect(await overrideOffers()).toBeGreaterThan(0);
    await page.goto(`${BASE_URL}/measures/${m.id}`);
    await page.getByText("Edit this measure's fields and sections…").click();
    await page.getByRole("button", { name: "Archive this measure…" }).click();
    const dialog = page.getByTestId("archive-confirm");
    await expectConfirmDialog(dialog, `Archive ${m.number} — Quay records X?`, /cannot be undone/);
    await dialog.getByRole("button", { name: "Archive it" }).click();
    await page.waitForLoadState("load");
    expect(await textOf(page.getByTestId("archived-notice"), 30_000)).toMatch(/^Archived on \d{1,2} [A-Z][a-z]+ \d{4}, \d{2}:\d{2}\. It can be read here/);
    expect(await page.getByTestId("file-amendment").count()).toBe(0);
    expect(await page.getByRole("button", { name: "Archive this measure…" }).count()).toBe(0);
    await shot(page, "records-archived-measure");
    await page.goto(`${BASE_URL}/measures`);
    expect(await page.getByTestId("measures-table").getByRole("link", { name: m.number, exact: true }).count()).toBe(0);
    await page.getByTestId("archived-measures").locator("summary").click();
    await page.getByTestId("archived-measures").getByRole("link", { name: new RegExp(m.number) }).click();
    await page.waitForURL(`${BASE_URL}/measures/${m.id}`);
    await visible(page.getByTestId("archived-notice"));
    // Its tree can be read, with a notice, and offers no override.
    expect(await overrideOffers()).toBe(0);
    await visible(page.getByTestId("archived-notice"));
    await page.close();
  });
});
