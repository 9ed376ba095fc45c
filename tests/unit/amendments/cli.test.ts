import { describe, expect, it } from "vitest";
import { cliSandbox } from "../../support/cli.ts";

const { file, run } = cliSandbox("check-cli");

const measure = { id: "HB-12", subjects: ["water"], sections: [{ id: "s1", subjects: ["water"] }, { id: "s2", subjects: ["audit"] }] };

describe("gavelwright check", () => {
  it("exits 2 without a file argument, and on a missing file", async () => {
    expect((await run("check")).code).toBe(2);
    expect((await run("check", "absent.json")).code).toBe(2);
  });

  it("exits 2 naming the path of a malformed amendment", async () => {
    const r = await run("check", file("bad.json", { rulebook: "general-parliamentary-law", measure, amendments: [{ id: "A1", target: "s1", form: "insert" }, { id: "A2", target: "s1" }] }));
    expect(r.code).toBe(2);
    expect(r.err).toContain("amendments.1.form");
    expect(r.out).toBe("");
  });

  it("exits 2 when the rulebook named does not exist", async () => {
    expect((await run("check", file("norb.json", { rulebook: "no-such-rulebook", measure, amendments: [] }))).code).toBe(2);
  });

  // Robert's Rules of Order Revised (1915) §33: a third-degree amendment is out of order.
  it("exits 0 with findings, in the contract's shape", async () => {
    const amendments = [
      { id: "A1", target: "s1", form: "insert", sponsors: ["M. Okafor"], subjects: ["water"] },
      { id: "A2", target: "A1", form: "insert", sponsors: ["M. Okafor"], subjects: ["water"] },
      { id: "A3", target: "A2", form: "strike", sponsors: ["M. Okafor"], subjects: ["water"] },
      { id: "A4", target: "A4", form: "insert", sponsors: ["M. Okafor"] },
      { id: "A5", target: "s7", form: "insert", sponsors: ["M. Okafor"] },
    ];
    const r = await run("check", file("case.json", { rulebook: "general-parliamentary-law", measure, amendments }));
    expect(r.code).toBe(0);
    const { findings } = JSON.parse(r.out) as { findings: Array<Record<string, unknown>> };
    for (const f of findings) expect(Object.keys(f)).toEqual(expect.arrayContaining(["code", "severity", "amendment", "rule", "citation", "message"]));
    expect(findings.map((f) => [f.amendment, f.code])).toEqual([
      ["A3", "degree-exceeded"],
      ["A4", "cycle"],
      ["A5", "target-missing"],
    ]);
  });

  it("prints an empty list for a clean tree", async () => {
    const r = await run("check", file("clean.json", { rulebook: "general-parliamentary-law", measure, amendments: [{ id: "A1", target: "s1", form: "insert", sponsors: ["M. Okafor"], subjects: ["water"] }] }));
    expect([r.code, JSON.parse(r.out)]).toEqual([0, { findings: [], tree: [{ amendment: "A1", degree: 1, role: "perfecting", slot: "HB-12", underSubstitute: null }] }]);
  });

  // US House Rule XVI cl. 6; CRS Report 98-613: a substitute for the amendment "is treated as a first-degree amendment",
  // and "Like the original first-degree amendment, this one also is subject to second-degree amendments."
  it("reports no error on the ordinary House tree and prints the degree and slot of each amendment", async () => {
    const common = { sponsors: ["M. Okafor"], subjects: ["water"], status: "pending" };
    const amendments = [
      { id: "A", target: "s1", form: "insert", ...common },
      { id: "A2", target: "A", form: "insert", ...common },
      { id: "S", target: "A", form: "substitute", ...common },
      { id: "S2", target: "S", form: "insert", ...common },
    ];
    const r = await run("check", file("house.json", { rulebook: "four-amendment-legislature", measure, amendments }));
    expect(r.code).toBe(0);
    const out = JSON.parse(r.out) as { findings: Array<{ severity: string }>; tree: Array<{ amendment: string; degree: number; slot: string }> };
    expect(out.findings.filter((f) => f.severity === "error")).toEqual([]);
    expect(out.tree.map((t) => [t.amendment, t.degree, t.slot])).toEqual([
      ["A", 1, "HB-12/perfecting"],
      ["A2", 2, "A"],
      ["S", 1, "A/substitute"],
      ["S2", 2, "S"],
    ]);
  });
});
