// The floor record as a clerk keeps it (issue 15 item 1, issue 16 item 6): record a vote on a
// question the form and the confirmation name, with no default result and the count checked in
// the clerk's words ("abc" abstaining is an error naming the field); the form says so when the
// pending question changes under it; withdraw with a confirmation; correct a vote with a reason
// and see the entry struck through with who and why; move a sitting judged by a superseded
// rulebook version to the version in force. At desktop and phone width.
// Sources for the checks on the count: a majority is of the votes cast and a tie loses (Robert's
// Rules of Order Revised, 1915, §46 pp. 191–192).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { BASE_URL, launch, shot, signInAs, textOf, visible } from "./browser.ts";

type Browser = Awaited<ReturnType<typeof launch>>;
let browser: Browser;
let page: Page;
let sittingId = "";

const MAIN = "That the Assembly approve the Kestrel Lane lighting scheme";
const A1 = "Strike out 'lighting' and insert 'lighting and seating'";
const A2 = "Insert 'and shelters' after 'seating'";

beforeAll(async () => {
  browser = await launch();
  page = await browser.context.newPage();
});
afterAll(async () => {
  await browser.close();
});

const notice = () => page.getByTestId("record-notice");
const history = () => page.getByTestId("history-entry");

async function make(motion: string, ref: string, text: string) {
  await page.getByLabel("Motion", { exact: true }).selectOption(motion);
  await page.getByLabel("Reference (optional, e.g. A2)").fill(ref);
  await page.getByLabel("Wording (optional)").fill(text);
  await page.getByRole("button", { name: "Record motion made" }).click();
  await notice().filter({ hasText: `Recorded: Moved:` }).filter({ hasText: ref }).waitFor();
  await page.getByRole("button", { name: "Seconded" }).click();
  await notice().filter({ hasText: "Recorded: Seconded" }).waitFor();
  await page.getByRole("button", { name: "Stated by the chair" }).click();
  await notice().filter({ hasText: "stated the question" }).waitFor();
}

/** An API call with the clerk's session, as another clerk's desk would make it. */
async function api(method: "GET" | "POST", path: string, body?: unknown) {
  const r = method === "GET" ? await page.request.get(`${BASE_URL}${path}`) : await page.request.post(`${BASE_URL}${path}`, { data: body, headers: { origin: BASE_URL } });
  expect(r.status(), `${method} ${path}: ${await r.text()}`).toBeLessThan(300);
  return r.json();
}

describe("the floor record", () => {
  it("records a vote named in the form and the confirmation, with the count checked", async () => {
    await signInAs(page, "clerk");
    await page.goto(`${BASE_URL}/floor`);
    const title = `Record sitting ${Date.now()}`;
    await page.getByLabel("Open a new sitting").fill(title);
    await page.getByRole("button", { name: "Open sitting" }).click();
    await page.getByTestId("sitting-select").locator("option", { hasText: title }).waitFor({ state: "attached" });
    sittingId = await page.getByTestId("sitting-select").inputValue();
    await page.getByTestId("stack-empty").waitFor();

    await make("main", "M1", MAIN);
    await make("amend", "A1", A1);
    await make("amend", "A2", A2);

    expect(await textOf(page.getByTestId("vote-question"))).toBe(`Amendment A2 to Amendment A1 — “${A2}”`);
    // No default result, no default way of deciding.
    const form = page.getByRole("form", { name: /Vote on/ });
    expect(await form.getByRole("radio", { checked: true }).count()).toBe(0);
    const before = await history().count();
    await form.getByRole("button", { name: "Record the vote…" }).click();
    await visible(form.getByText("Result: choose adopted or rejected."));
    await visible(form.getByText("How it was decided: choose how the vote was taken."));

    await form.getByRole("radio", { name: "Rejected" }).check();
    await form.getByRole("radio", { name: "Division (counted)" }).check();
    await form.getByLabel("Ayes").fill("12");
    await form.getByLabel("Noes").fill("20");
    await form.getByLabel(/Abstaining/).fill("abc");
    await form.getByRole("button", { name: "Record the vote…" }).click();
    await visible(form.getByText("Abstaining: “abc” is not a whole number; leave it empty if no one abstained."));
    expect(await form.getByLabel(/Abstaining/).getAttribute("aria-invalid")).toBe("true");
    expect(await history().count()).toBe(before);

    await form.getByLabel(/Abstaining/).fill("3");
    await form.getByRole("button", { name: "Record the vote…" }).click();
    expect(await textOf(page.getByTestId("vote-confirm-text"))).toBe(`Record: Amendment A2 to Amendment A1 — “${A2}” — rejected, 12–20, 3 abstaining?`);
    await shot(page, "floor-record-confirm");
    await page.getByRole("button", { name: "Yes, record it" }).click();
    await notice().filter({ hasText: "Recorded: Voted: Amendment A2 to Amendment A1" }).waitFor();
    expect(await textOf(notice())).toContain("rejected, 12–20, 3 abstaining");

    // The form is now for the next question, empty: nothing carried over from the last vote.
    await page.getByTestId("vote-question").filter({ hasText: `Amendment A1 to Main motion M1` }).waitFor();
    expect(await page.getByRole("form", { name: /Vote on/ }).getByRole("radio", { checked: true }).count()).toBe(0);
  });

  it("says so when the pending question changes while the clerk fills in the vote, and records nothing", async () => {
    const form = page.getByRole("form", { name: /Vote on/ });
    await form.getByRole("radio", { name: "Adopted" }).check();
    // Another clerk's desk records a further amendment to A1 meanwhile.
    const s = await api("GET", `/api/floor/sittings/${sittingId}`);
    await api("POST", `/api/floor/sittings/${sittingId}/events`, { revision: s.sitting.revision, event: { kind: "made", motion: "amend", ref: "A3", text: "Insert 'solar' before 'lighting'" } });
    const warning = page.getByTestId("vote-retarget");
    await visible(warning, 20_000);
    expect(await textOf(warning)).toContain("You began on: Amendment A1 to Main motion M1");
    expect(await textOf(warning)).toContain("Now pending: Amendment A3 to Amendment A1");
    expect(await form.getByRole("button", { name: "Record the vote…" }).isDisabled()).toBe(true);
    await shot(page, "floor-record-retarget");
    await warning.getByRole("button", { name: "Start again on the question now pending" }).click();
    await page.getByTestId("vote-question").filter({ hasText: "Amendment A3 to Amendment A1" }).waitFor();
    expect(await form.getByRole("radio", { checked: true }).count()).toBe(0);

    // Withdrawing reads as an action and asks first, naming the question.
    await page.getByRole("button", { name: "Withdraw Amendment A3…" }).click();
    expect(await textOf(page.getByTestId("withdraw-confirm-text"))).toBe("Withdraw Amendment A3 to Amendment A1 — “Insert 'solar' before 'lighting'”?");
    await page.getByRole("button", { name: "Yes, withdraw it" }).click();
    await notice().filter({ hasText: "Recorded: Withdrawn: Amendment A3" }).waitFor();
    await page.getByTestId("vote-question").filter({ hasText: "Amendment A1 to Main motion M1" }).waitFor();
  });

  it("corrects a vote with a reason: the entry stays, struck through, with who and why, and the board follows", async () => {
    const entry = history().filter({ hasText: "Voted: Amendment A2 to Amendment A1" });
    const seq = await entry.getAttribute("data-seq");
    await page.getByRole("button", { name: `Correct entry ${seq}` }).click();
    const fix = page.getByTestId("correction");
    await fix.getByRole("button", { name: `Strike out entry ${seq}…` }).click();
    await visible(fix.getByText("Reason: say why the entry is struck out (it is kept on the record)."));
    await fix.getByLabel("Reason for the correction (required)").fill("The tellers' figures were read the wrong way round");
    await fix.getByRole("radio", { name: "Adopted" }).check();
    await fix.getByRole("radio", { name: "Division (counted)" }).check();
    await fix.getByLabel("Ayes").fill("20");
    await fix.getByLabel("Noes").fill("12");
    await fix.getByLabel(/Abstaining/).fill("3");
    await fix.getByRole("button", { name: `Strike out entry ${seq}…` }).click();
    const question = await textOf(page.getByTestId("correction-confirm-text"));
    expect(question).toContain(`Strike out entry ${seq}`);
    expect(question).toContain("because “The tellers' figures were read the wrong way round”, and record instead: adopted, 20–12, 3 abstaining?");
    await page.getByRole("button", { name: "Yes, strike it out" }).click();
    await notice().filter({ hasText: `Struck out entry ${seq}` }).waitFor();

    const struck = history().and(page.locator(`[data-seq="${seq}"]`));
    await struck.locator("del").waitFor();
    expect(await struck.getAttribute("data-struck")).toBe("yes");
    const note = await textOf(struck.getByTestId("struck-note"));
    expect(note).toMatch(/^Struck out by entry \d+, by .+, .+\. Reason: The tellers' figures were read the wrong way round$/);
    expect(await textOf(page.getByTestId("history").locator("li").last())).toContain("recorded instead: Amendment A2 to Amendment A1");
    // The board follows the record: the last vote is the corrected one.
    expect(await textOf(page.getByText(/^Amend: adopted/))).toContain("20–12, 3 abstaining");
    await shot(page, "floor-record-corrected");
    await page.setViewportSize({ width: 390, height: 844 });
    await struck.scrollIntoViewIfNeeded();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, "floor-record-corrected-phone");
    await page.setViewportSize({ width: 1360, height: 900 });
  });

  it("warns while the sitting is judged by a superseded version and moves it to the version in force", async () => {
    const s = await api("GET", `/api/floor/sittings/${sittingId}`);
    const version = await api("GET", `/api/rulebooks/${s.rulebook.versionId}`);
    // Saved on top of the chamber's latest version (other browser files may have saved one since the seed).
    const books = await api("GET", "/api/rulebooks");
    const saved = await api("POST", "/api/rulebooks", { basedOn: books.latest.id, note: "Floor test: retitled", document: { ...version.document, title: `${version.document.title} (as amended)` } });
    await api("POST", `/api/rulebooks/${saved.id}/adopt`, { note: "With effect today (browser test)" });

    await page.goto(`${BASE_URL}/floor/${sittingId}`);
    const warning = page.getByTestId("superseded");
    await visible(warning);
    expect(await textOf(warning)).toContain(`follows version ${s.rulebook.number}`);
    expect(await textOf(warning)).toContain(`Version ${saved.number}`);
    await shot(page, "floor-record-superseded");
    await warning.getByRole("button", { name: `Judge this sitting by version ${saved.number}…` }).click();
    expect(await textOf(page.getByTestId("switch-confirm-text"))).toContain(`by rulebook version ${saved.number}`);
    await page.getByRole("button", { name: `Yes, judge it by version ${saved.number}` }).click();
    await notice().filter({ hasText: `judged by rulebook version ${saved.number}` }).waitFor();
    await expect.poll(() => page.getByTestId("superseded").count()).toBe(0);
    await visible(page.getByTestId("history").getByText(`in place of version ${s.rulebook.number}`));
  });

  it("records a recorded vote member by member from the roster, by keyboard, with totals and the quorum", async () => {
    const form = page.getByRole("form", { name: /Vote on/ });
    await page.getByTestId("vote-question").filter({ hasText: "Amendment A1 to Main motion M1" }).waitFor();
    await form.getByRole("radio", { name: "Adopted" }).check();
    await form.getByRole("radio", { name: "Recorded vote (roll call)" }).check();
    const rollCall = page.getByTestId("roll-call");
    await visible(rollCall.locator("[data-roll-row]").first());
    const rows = await rollCall.locator("[data-roll-row]").count();
    expect(rows).toBe(40);
    // Keyboard: Y, N, P answer and move on to the next member.
    const first = await rollCall.locator("[data-roll-row]").first().getAttribute("data-member");
    await rollCall.getByRole("radio", { name: `${first}: Yea` }).focus();
    for (const key of [...Array(21).fill("y"), ...Array(12).fill("n"), ...Array(3).fill("p")]) await page.keyboard.press(key);
    await expect.poll(() => textOf(page.getByTestId("roll-totals"))).toBe("Yea 21 · Nay 12 · Present 3 · Not voting 0 · Recused 0 · No answer yet 4");
    // Not every member has answered: nothing is sent.
    await form.getByRole("button", { name: "Record the vote…" }).click();
    await visible(form.getByText("The roll: 4 members have no answer yet; mark them (“Not voting” for those absent)."));
    await rollCall.getByRole("button", { name: "Mark everyone not yet answered as not voting" }).click();
    expect(await textOf(page.getByTestId("roll-totals"))).toBe("Yea 21 · Nay 12 · Present 3 · Not voting 4 · Recused 0 · No answer yet 0");
    expect(await textOf(page.getByTestId("roll-quorum"))).toBe("36 present of 40; the quorum is 13: a quorum is present.");
    await shot(page, "floor-roll-call");
    await form.getByRole("button", { name: "Record the vote…" }).click();
    expect(await textOf(page.getByTestId("vote-confirm-text"))).toBe(`Record: Amendment A1 to Main motion M1 — “${A1}” — adopted, 21–12, 3 present, 4 not voting (recorded vote)?`);
    await page.getByRole("button", { name: "Yes, record it" }).click();
    await notice().filter({ hasText: "(recorded vote)" }).waitFor();
    const recorded = await api("GET", `/api/floor/recorded-votes?sitting=${sittingId}`);
    expect(recorded.votes.length).toBe(1);
    expect(recorded.votes[0].yea.length).toBe(21);
    expect(recorded.votes[0].nay.length).toBe(12);
  });
});
