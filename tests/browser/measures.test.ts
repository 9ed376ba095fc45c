// Measures in the browser: a clerk opens the demo measure's tree, sees its findings on the
// drawing, moves through it by keyboard, records an override with a ruling and prints it; a
// member files an amendment and the receipt arrives in the local mail catcher; a generated
// tree of 160 amendments still draws. The product's own contract (no outside source).
import { describe, expect, it, vi } from "vitest";
import postgres from "postgres";
import type { Page } from "playwright-core";
import { join } from "node:path";
import { BASE_URL, SHOTS, account, browserForFile, pickSponsors, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();

async function openDemoMeasure(page: Page): Promise<string> {
  await page.goto(`${BASE_URL}/measures`);
  await page.getByRole("link", { name: "HCA 12", exact: true }).click();
  await page.waitForURL(/\/measures\/[0-9a-f-]{36}$/);
  return new URL(page.url()).pathname.split("/")[2];
}

describe("the amendment tree", () => {
  it("shows the demo tree's findings on the drawing; a clerk overrides one with a ruling and prints the tree", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const id = await openDemoMeasure(page);
    await page.getByRole("link", { name: "Open the tree" }).click();
    await page.waitForURL(`${BASE_URL}/measures/${id}/tree`);
    const a4 = page.getByTestId("node-A4");
    await visible(a4);
    // Its not-germane finding: open (✕), or overridden (⚖) when this server ran the test before.
    expect(await textOf(a4)).toMatch(/✕ 1|⚖ 1/);
    expect(await textOf(page.getByTestId("node-A8"))).toContain("3°");
    await shot(page, "measures-tree-clerk");

    await a4.click();
    expect(await textOf(page.getByTestId("tree-details"))).toContain("shares no subject with the text it amends");
    await page.keyboard.press("ArrowLeft");
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Section s4");
    await page.keyboard.press("ArrowRight");
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Amendment A4");

    // The first finding not yet overridden (the same server may have run this test before).
    const ruling = `Ruling ${Date.now() % 100000} of the Presiding Officer`;
    let done = false;
    for (const key of ["A4", "A6", "A5", "A8", "A1", "A7", "A3"]) {
      await page.getByTestId("findings-table").getByRole("button", { name: key, exact: true }).first().click();
      const button = page.getByTestId("tree-details").getByRole("button", { name: "Override with a ruling…" }).first();
      if (!(await button.isVisible())) continue;
      await button.click();
      await page.getByLabel("Ruling relied on").fill(ruling);
      await page.getByRole("button", { name: "Record override" }).click();
      expect(await textOf(page.getByRole("status"))).toContain("recorded");
      await expect.poll(() => page.getByTestId("tree-details").innerText(), { timeout: 10_000 }).toContain(ruling);
      done = true;
      break;
    }
    expect(done, "an open finding to override").toBe(true);
    await shot(page, "measures-tree-override");

    await page.getByRole("link", { name: "Printable view" }).click();
    await page.waitForURL(`${BASE_URL}/measures/${id}/print`);
    const outline = await textOf(page.getByTestId("print-outline"));
    expect(outline).toContain("shares no subject with the text it amends");
    expect(outline).not.toContain("not-germane");
    expect(outline).toContain(ruling);
    await page.emulateMedia({ media: "print" });
    await shot(page, "measures-print");
    await page.close();
  });

  it("draws a generated tree of 160 amendments", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const number = `HCA T${Date.now() % 1_000_000}`;
    const text = Array.from({ length: 8 }, (_, i) => `## Section ${i + 1}\nSubjects: lighting\nLine one.\nLine two.`).join("\n");
    const m = await page.request.post(`${BASE_URL}/api/measures`, { data: { number, title: "Generated large tree", subjects: ["lighting"], text } });
    expect(m.status()).toBe(201);
    const { id } = (await m.json()) as { id: string };
    const legislators = ((await (await page.request.get(`${BASE_URL}/api/measures/sponsors`)).json()) as { legislators: Array<{ id: string }> }).legislators;
    for (let i = 1; i <= 160; i++) {
      const target = i <= 60 ? `s${1 + (i % 8)}` : i <= 130 ? `A${1 + (i % 60)}` : `A${61 + (i % 70)}`;
      const r = await page.request.post(`${BASE_URL}/api/measures/${id}/amendments`, { data: { form: "insert", target, subjects: ["lighting"], sponsors: [legislators[i % 40].id, legislators[(i + 1) % 40].id], text: `Generated ${i}` } });
      expect(r.status()).toBe(201);
    }
    await page.goto(`${BASE_URL}/measures/${id}/tree`);
    await visible(page.locator(".react-flow__node").first());
    expect(await page.getByTestId("tree-counts").innerText()).toContain("errors");
    expect(await page.locator(".react-flow__minimap").count()).toBe(1);
    await page.getByTestId("tree-drawing").screenshot({ path: join(SHOTS, "measures-tree-large-drawing.png") });
    await shot(page, "measures-tree-large");
    await page.close();
  }, 240_000);
});

describe("filing", () => {
  it("a member files an amendment and the receipt arrives in the caught mail", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "member");
    await openDemoMeasure(page);
    const title = `Brighter lamps ${Date.now() % 100000}`;
    const form = page.getByTestId("file-amendment");
    await form.getByLabel("Form").selectOption("strike-and-insert");
    await form.getByLabel("Amends").selectOption("s2");
    await form.getByLabel("Lines (sections only)").fill("3-3");
    await form.getByLabel("Short title").fill(title);
    await form.getByLabel("Text of the amendment").fill("Each lamp shall give at least 4000 lumens.");
    await form.getByLabel("Subject tags").fill("lighting");
    await pickSponsors(form, [5, 5]);
    expect(await form.getByTestId("sponsor-chips").locator("input[name=sponsors]").count()).toBe(3);
    await shot(page, "measures-file-form");
    await form.getByRole("button", { name: "File amendment" }).click();
    const status = await textOf(form.getByRole("status"));
    const key = /Amendment (A\d+)/.exec(status)?.[1];
    expect(key, status).toBeTruthy();

    const sql = postgres(process.env.DATABASE_URL!, { max: 1 });
    const subject = await vi
      .waitFor(
        async () => {
          const rows = await sql`SELECT subject FROM caught_mail WHERE "to" LIKE ${"%" + account("member").email + "%"} AND subject = ${`Filing receipt: Amendment ${key} to HCA 12`}`;
          if (!rows[0]) throw new Error("no receipt caught yet");
          return rows[0].subject as string;
        },
        { timeout: 60_000, interval: 250 },
      )
      .finally(() => sql.end());
    expect(subject, "receipt caught").toBe(`Filing receipt: Amendment ${key} to HCA 12`);
    await page.waitForLoadState("load");
    await visible(page.getByTestId("amendments-table").getByText(title));
    await shot(page, "measures-filed");
    await page.close();
  });
});
