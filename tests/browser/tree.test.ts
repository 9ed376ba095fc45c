// The amendment tree as a clerk reads it (issue 15 item 8): sections top-down in text order and
// amendments in filing order, the text legible at the default fit, one tab stop for the drawing and
// none for its edges or nodes, an outline instead of the drawing on a phone, and a conflict finding
// that names the other amendment. Reading order and legibility: common practice, no source; the
// conflict rule: Harrowmere's fictional Standing Order 65 in rulebooks/demo-chamber.json. Drafts are
// named "Draft", "Draft-1"… wherever a person reads them, never by an internal key (common practice, no source).
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { BASE_URL, browserForFile, shot, signInAs, textOf, visible } from "./browser.ts";

const browser = browserForFile();

async function api(page: Page, path: string, data: unknown) {
  const res = await page.request.post(`${BASE_URL}${path}`, { data, headers: { origin: BASE_URL } });
  expect(res.status(), `${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

/** A measure of three sections with amendments filed out of text order; A2 and A3 change the same line of §1. */
async function conflictingTree(page: Page): Promise<string> {
  const number = `HCA R${Date.now() % 1_000_000}`;
  const text = [1, 2, 3].map((i) => `## Section ${i}\nSubjects: lighting\nLine one of ${i}.\nLine two of ${i}.`).join("\n");
  const m = await api(page, "/api/measures", { number, title: "Reading order ordinance", subjects: ["lighting"], text });
  const { legislators } = (await (await page.request.get(`${BASE_URL}/api/measures/sponsors`)).json()) as { legislators: Array<{ id: string }> };
  const sponsors = [legislators[0].id, legislators[1].id];
  const file = (target: string, lines: [number, number] | null, title: string) => api(page, `/api/measures/${m.id}/amendments`, { form: "strike-and-insert", target, ...(lines ? { lines } : {}), subjects: ["lighting"], sponsors, title, text: title });
  await file("s3", [1, 1], "Third section first");
  await file("s1", [1, 1], "Brighter lamps");
  await file("s1", [1, 1], "Dimmer lamps");
  return m.id as string;
}

const top = async (page: Page, id: string) => (await page.locator(`.react-flow__node[data-id="${id}"]`).boundingBox())!.y;

describe("the tree diagram", () => {
  it("reads top-down, legibly, with one tab stop, and names the other amendment of a conflict", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const id = await conflictingTree(page);
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.goto(`${BASE_URL}/measures/${id}/tree`);
    await visible(page.getByTestId("node-A3"));
    // Reading order: §1, §2, §3 top-down; A2 above A3 (both on §1) above A1 (on §3).
    expect(await top(page, "s1")).toBeLessThan(await top(page, "s2"));
    expect(await top(page, "s2")).toBeLessThan(await top(page, "s3"));
    expect(await top(page, "A2")).toBeLessThan(await top(page, "A3"));
    expect(await top(page, "A3")).toBeLessThan(await top(page, "A1"));
    // Legible at the default fit: the smallest text of a node, as drawn, is at least 11 px.
    const smallest = await page.evaluate(() => {
      const zoom = new DOMMatrix(getComputedStyle(document.querySelector(".react-flow__viewport")!).transform).a;
      const sizes = [...document.querySelectorAll(".react-flow__node *")].filter((e) => (e as HTMLElement).innerText?.trim() && e.children.length === 0).map((e) => parseFloat(getComputedStyle(e).fontSize) * zoom);
      return Math.min(...sizes);
    });
    expect(smallest).toBeGreaterThanOrEqual(11);
    // One tab stop: the drawing itself; nodes and edges are not in the tab order (the zoom buttons are).
    const stops = await page.evaluate(() => {
      const d = document.querySelector("[data-testid=tree-drawing]")!;
      const focusable = [d, ...d.querySelectorAll("a[href], button, input, select, textarea, [tabindex]")].filter((e) => (e as HTMLElement).tabIndex >= 0 && !(e as HTMLButtonElement).disabled && !e.closest(".react-flow__controls"));
      return focusable.length;
    });
    expect(stops).toBe(1);
    await page.getByTestId("tree-drawing").focus();
    await page.keyboard.press("ArrowRight");
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Section s1");
    await page.keyboard.press("ArrowDown");
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Section s2");
    await shot(page, "tree-reading-order");

    // The conflict names the other amendment, in the details and in the table of findings.
    await page.getByTestId("node-A3").click();
    expect(await textOf(page.getByTestId("related-amendments-A3"))).toBe("Other amendments concerned: A2.");
    expect(await textOf(page.getByTestId("findings-table"))).toContain("With: A3");
    expect(await textOf(page.getByTestId("tree-details"))).not.toContain("conflicts-with");

    // A phone: the outline instead of the drawing, in reading order.
    await page.setViewportSize({ width: 390, height: 844 });
    const outline = page.getByTestId("tree-outline");
    await visible(outline);
    expect(await page.getByTestId("tree-drawing").isVisible()).toBe(false);
    const items = (await outline.getByRole("button").allInnerTexts()).map((t) => t.split(" — ")[0]);
    expect(items.slice(0, 6)).toEqual(["HCA" + items[0].slice(3), "§ s1", "Amendment A2", "Amendment A3", "§ s2", "§ s3"]);
    await outline.getByRole("button", { name: /^Amendment A3/ }).click();
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Amendment A3");
    const [w, inner] = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
    expect(w).toBeLessThanOrEqual(inner);
    await shot(page, "tree-phone-outline");
    await page.close();
  });

  it("names drafts as people read them — on the drawing, in the findings and in the outline — never by an internal key", async () => {
    const page = await browser.freshPage();
    await signInAs(page, "clerk");
    const number = `HCA D${Date.now() % 1_000_000}`;
    const m = await api(page, "/api/measures", { number, title: "Draft naming ordinance", subjects: ["lighting"], text: "## Section 1\nSubjects: lighting\nLine one.\nLine two." });
    const { legislators } = (await (await page.request.get(`${BASE_URL}/api/measures/sponsors`)).json()) as { legislators: Array<{ id: string }> };
    const amend = (body: Record<string, unknown>) => api(page, `/api/measures/${m.id}/amendments`, { form: "insert", target: "s1", subjects: ["lighting"], ...body });
    await amend({ sponsors: [legislators[0].id, legislators[1].id], title: "Filed lamps", text: "Filed lamps." });
    // Two drafts with no sponsor: each has a finding on its sponsors (Harrowmere asks for two, rulebooks/demo-chamber.json).
    await amend({ sponsors: [], title: "First draft lamps", text: "First draft lamps.", draft: true });
    await amend({ sponsors: [], title: "Second draft lamps", text: "Second draft lamps.", draft: true });
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.goto(`${BASE_URL}/measures/${m.id}/tree`);
    await visible(page.getByTestId("node-Draft-2"));
    await visible(page.getByTestId("node-Draft-1"));
    await page.getByTestId("node-Draft-1").click();
    expect(await textOf(page.getByTestId("tree-details").locator("h3").first())).toBe("Amendment Draft-1");
    const table = await textOf(page.getByTestId("findings-table"));
    expect(table).toMatch(/Amendment Draft-1 names 0 sponsor/);
    expect(table).toMatch(/Amendment Draft-2 names 0 sponsor/);
    expect(await page.locator("body").innerText()).not.toMatch(/\bD-[0-9a-f]{8}\b/);
    await shot(page, "tree-drafts");

    await page.setViewportSize({ width: 390, height: 844 });
    const outline = page.getByTestId("tree-outline");
    await visible(outline);
    const items = (await outline.getByRole("button").allInnerTexts()).map((t) => t.split(" — ")[0]);
    expect(items.slice(1)).toEqual(["§ s1", "Amendment A1", "Amendment Draft-1", "Amendment Draft-2"]);
    const [w, inner] = await page.evaluate(() => [document.documentElement.scrollWidth, window.innerWidth]);
    expect(w).toBeLessThanOrEqual(inner);
    await shot(page, "tree-drafts-phone");
    await page.close();
  });
});
