// Sign-in as each demo role, the navigation each sees, a failed sign-in, and the invitation
// flow end to end through the local mail catcher. The product's own contract (no outside source).
import { describe, expect, it, vi } from "vitest";
import postgres from "postgres";
import { navFor } from "../../src/lib/navigation.ts";
import { CHAMBER_ROLES } from "../../src/lib/permissions.ts";
import { BASE_URL, browserForFile, shot, signIn, signInAs, account, textOf, visible } from "./browser.ts";

const browser = browserForFile();

describe("sign-in and navigation", () => {
  it("shows a clear message for a wrong password", async () => {
    const page = await browser.freshPage();
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel("E-mail").fill(account("clerk").email);
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    expect(await textOf(page.getByRole("alert"))).toContain("do not match");
    await shot(page, "foundation-sign-in-refused");
    await page.close();
  });

  for (const role of CHAMBER_ROLES) {
    it(`signs in as ${role} and shows that role's navigation`, async () => {
      const page = await browser.freshPage();
      await signInAs(page, role);
      expect(await textOf(page.locator("h1"))).toBe("Harrowmere County Assembly");
      const labels = (await page.locator("[data-testid=nav] a").allInnerTexts()).map((t) => t.trim());
      const expected = navFor(role, true).map((i) => i.label);
      expect(labels.slice(0, expected.length)).toEqual(expected);
      await shot(page, `foundation-desk-${role}`);
      await page.close();
    });
  }

  it("redirects an anonymous visitor to sign-in", async () => {
    const page = await browser.freshPage();
    await page.goto(`${BASE_URL}/people`);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.close();
  });
});

describe("invitations", () => {
  it("the chief clerk invites by e-mail; the invitee signs up from the link and joins", async () => {
    const email = `invitee-${Date.now()}@example.org`;
    const page = await browser.freshPage();
    await signInAs(page, "chief-clerk");
    await page.goto(`${BASE_URL}/people`);
    await page.getByLabel("E-mail to invite").fill(email);
    await page.getByLabel("Role", { exact: true }).selectOption("staff");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await visible(page.getByText(`Invitation sent to ${email}.`));
    await shot(page, "foundation-people");

    const sql = postgres(process.env.DATABASE_URL!, { max: 1 });
    const link = await vi
      .waitFor(
        async () => {
          const rows = await sql`SELECT text FROM caught_mail WHERE "to" LIKE ${"%" + email + "%"}`;
          const found = rows[0] ? /https?:\/\/\S+\/invitations\/\S+/.exec(rows[0].text as string)?.[0] : undefined;
          if (!found) throw new Error("no invitation caught yet");
          return found;
        },
        { timeout: 30_000, interval: 250 },
      )
      .finally(() => sql.end());
    expect(link, "invitation mail caught").toBeTruthy();

    await browser.context.clearCookies();
    await page.goto(link!);
    await page.getByRole("link", { name: new RegExp(`create an account with`) }).click();
    await page.getByLabel("Full name").fill("Nim Invitee");
    await page.getByLabel("Password").fill("invitee-password-1");
    await Promise.all([page.waitForURL((u) => u.pathname.startsWith("/invitations/")), page.getByRole("button", { name: "Create account" }).click()]);
    await shot(page, "foundation-invitation");
    await Promise.all([page.waitForURL((u) => u.pathname === "/"), page.getByRole("button", { name: /^Join / }).click()]);
    expect(await textOf(page.locator("h1"))).toBe("Harrowmere County Assembly");
    expect(await textOf(page.getByTestId("signed-in-as"))).toContain("Staff");
    await page.close();
  });

  it("a user of another chamber does not see Harrowmere's people", async () => {
    const page = await browser.freshPage();
    const other = account("chief-clerk", "saltreach");
    await signIn(page, other.email, other.password);
    await page.goto(`${BASE_URL}/people`);
    const table = await textOf(page.getByRole("table"));
    expect(table).toContain(other.email);
    expect(table).not.toContain("harrowmere.example");
    await page.close();
  });
});
