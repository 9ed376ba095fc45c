// The live floor board in two browsers: a clerk records a motion and a member's board (never
// reloaded) shows the new pending question and the legal moves updating through server-sent
// events. Verdicts follow Robert's Rules of Order Revised (1915) §11: a main motion is in order
// only when no question is pending. Also the hypothetical legal-moves page.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Page } from "playwright-core";
import { BASE_URL, launch, shot, signInAs } from "./browser.ts";

type Browser = Awaited<ReturnType<typeof launch>>;
let clerkBrowser: Browser;
let memberBrowser: Browser;
let clerk: Page;
let member: Page;

const verdictOf = (page: Page, motion: string) => page.getByTestId("legal-moves").locator(`li[data-motion="${motion}"]`).getAttribute("data-in-order");

beforeAll(async () => {
  clerkBrowser = await launch();
  memberBrowser = await launch();
  clerk = await clerkBrowser.context.newPage();
  member = await memberBrowser.context.newPage();
});
afterAll(async () => {
  await clerkBrowser.close();
  await memberBrowser.close();
});

describe("live floor board", () => {
  it("shows a member the stack and legal moves update live when the clerk records a motion", async () => {
    await signInAs(clerk, "clerk");
    await clerk.goto(`${BASE_URL}/floor`);
    const title = `Browser sitting ${Date.now()}`;
    await clerk.getByLabel("Open a new sitting").fill(title);
    await clerk.getByRole("button", { name: "Open sitting" }).click();
    // The new sitting, found by its title (other browser files leave their sittings open), on its own page.
    const sittingId = await vi.waitFor(
      async () => {
        const listed = (await (await clerk.request.get(`${BASE_URL}/api/floor/sittings`)).json()) as { sittings: Array<{ id: string; title: string }> };
        const id = listed.sittings.find((x) => x.title === title)?.id;
        if (!id) throw new Error(`no sitting "${title}" yet`);
        return id;
      },
      { timeout: 15_000, interval: 200 },
    );
    await clerk.goto(`${BASE_URL}/floor/${sittingId}`);
    await clerk.getByTestId("stack-empty").waitFor();

    await signInAs(member, "member");
    await member.goto(`${BASE_URL}/floor/${sittingId}`);
    await member.getByTestId("live-status").filter({ hasText: "Live" }).waitFor();
    await member.getByTestId("stack-empty").waitFor();
    expect(await verdictOf(member, "main")).toBe("yes");
    expect(await member.getByRole("button", { name: "Record motion made" }).count()).toBe(0);

    await clerk.getByLabel("Motion", { exact: true }).selectOption("main");
    await clerk.getByLabel("Wording (optional)").fill("That the Assembly approve the Lantern Quay lighting scheme");
    await clerk.getByLabel("Moved by (optional)").fill("Petra Penhallow");
    await clerk.getByRole("button", { name: "Record motion made" }).click();
    await clerk.getByTestId("record-notice").filter({ hasText: "Recorded" }).waitFor();

    // The member's page is not reloaded: the change arrives by server-sent event.
    await member.getByTestId("pending-stack").locator('li[data-motion="main"]').waitFor({ timeout: 15_000 });
    await expect.poll(() => verdictOf(member, "main"), { timeout: 15_000 }).toBe("no");
    expect(await verdictOf(member, "amend")).toBe("yes");
    await member.getByText("Lantern Quay lighting scheme").first().waitFor();
    await shot(member, "floor-member-live");

    await clerk.getByRole("button", { name: "Seconded" }).click();
    await clerk.getByTestId("record-notice").filter({ hasText: "Seconded" }).waitFor();
    await clerk.getByRole("button", { name: "Stated by the chair" }).click();
    await clerk.getByTestId("record-notice").filter({ hasText: "stated" }).waitFor();
    await member.getByTestId("history").getByText(/stated the question/).waitFor({ timeout: 15_000 });
    await shot(clerk, "floor-clerk-board");
  });

  it("lets a member pose a hypothetical floor without touching the live one", async () => {
    await member.goto(`${BASE_URL}/floor/moves`);
    await member.getByTestId("hyp-empty").waitFor();
    await expect.poll(() => verdictOf(member, "main")).toBe("yes");
    for (const m of ["main", "amend", "amend"]) {
      await member.getByTestId("hyp-choice").selectOption(m);
      await member.getByRole("button", { name: "Push" }).click();
    }
    // A third-degree amendment is out of order (RONR 1915 §33).
    await expect.poll(() => verdictOf(member, "amend")).toBe("no");
    await member.getByTestId("legal-moves").locator('li[data-motion="amend"]').getByText("would be degree 3").waitFor();
    await shot(member, "floor-hypothetical");
    await member.getByRole("button", { name: "Pop" }).click();
    await expect.poll(() => verdictOf(member, "amend")).toBe("yes");
  });
});
