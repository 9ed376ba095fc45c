/**
 * `gavelwright rulebook test RULEBOOK [SCENARIOS]` (README, "Command line"): JSON with the scenarios
 * that passed and, for each failure, expected vs got; exit 0 when all pass, 1 when any fails, 2 on bad input.
 * The failing case moves postpone indefinitely above amend, against Robert's Rules of Order Revised
 * (1915), §33 p. 134: "To Amend takes precedence of the motion to postpone indefinitely".
 */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { cliSandbox } from "../../support/cli.ts";
import { rawTemplate, templatePath } from "./fixtures.ts";

const { dir, file, run } = cliSandbox("rulebook-test-cli");
const bench = templatePath("general-parliamentary-law").replace(/\.json$/, ".scenarios.json");

describe("gavelwright rulebook test", () => {
  it("exits 0 and lists every scenario as passed for a template and its shipped bench", async () => {
    const r = await run("rulebook", "test", templatePath("general-parliamentary-law"), bench);
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    const out = JSON.parse(r.out);
    expect(out.failed).toEqual([]);
    expect(out.passed).toContain("amend-over-postpone-indefinitely");
    expect([out.total, out.passedCount, out.failedCount]).toEqual([out.passed.length, out.passed.length, 0]);
  });

  it("a template id without a scenarios file runs the bench shipped beside it (old ids included)", async () => {
    const r = await run("rulebook", "test", "four-amendment-legislature");
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).rulebook.id).toBe("us-house");
  });

  it("exits 1 naming the failed scenario with expected vs got", async () => {
    const raw = rawTemplate("general-parliamentary-law");
    raw.motions = raw.motions.map((m: { id: string }) => (m.id === "postpone-indefinitely" ? { ...m, rank: 100 } : m));
    const r = await run("rulebook", "test", file("changed.json", raw), bench);
    expect(r.code).toBe(1);
    const out = JSON.parse(r.out);
    const failed = out.failed.find((f: { id: string }) => f.id === "amend-over-postpone-indefinitely");
    expect(failed.source).toMatch(/§33/);
    expect(failed.failures).toContainEqual({ path: "motions.amend.inOrder", expected: true, got: false });
    expect(out.passed).toContain("previous-question-two-thirds");
    expect(out.failedCount).toBe(out.failed.length);
  });

  it("exits 2 on bad input, naming the field", async () => {
    expect((await run("rulebook", "test")).code).toBe(2);
    expect((await run("rulebook", "test", join(dir, "nope.json"), bench)).code).toBe(2);
    const bad = await run("rulebook", "test", "general-parliamentary-law", file("bad.json", { format: "gavelwright.scenarios", formatVersion: 1, scenarios: [{ id: "a", kind: "floor", title: "t", state: {}, expect: { motions: { amend: { inOrder: true } } } }] }));
    expect(bad.code).toBe(2);
    expect(bad.err).toContain("scenarios.0.source");
    expect(bad.out).toBe("");
    const rb = await run("rulebook", "test", file("not-a-rulebook.json", { motions: [] }), bench);
    expect(rb.code).toBe(2);
    expect(rb.err).toContain("rulebook.format");
  });
});
