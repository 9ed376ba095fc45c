// CLI contracts of `majority`, `agendas` and `orders` (README.md, "Command line"), through main() with temp files.
import { describe, expect, it } from "vitest";
import { cliSandbox } from "../../support/cli.ts";

const cli = cliSandbox("voting-cli");
let fileNo = 0;
async function run(cmd: string, content: unknown, extraFiles: Record<string, unknown> = {}) {
  for (const [name, value] of Object.entries(extraFiles)) cli.file(name, value);
  const r = await cli.run(cmd, cli.file(`case-${fileNo++}.json`, content));
  return { ...r, json: r.code === 0 ? JSON.parse(r.out) : undefined };
}

const condorcet = { alternatives: ["a", "b", "c"], ballots: [{ ranking: ["a", "b", "c"] }, { ranking: ["b", "c", "a"] }, { ranking: ["c", "a", "b"] }] };

describe("bad input exits 2 and names the field", () => {
  it("majority: unknown alternative in a ranking", async () => {
    const r = await run("majority", { alternatives: ["a", "b"], ballots: [{ ranking: ["a", "z"] }] });
    expect(r.code).toBe(2);
    expect(r.err).toContain("ballots.0.ranking.1");
  });
  it("majority: a negative weight", async () => {
    const r = await run("majority", { alternatives: ["a"], ballots: [{ ranking: ["a"], weight: -1 }] });
    expect(r.code).toBe(2);
    expect(r.err).toContain("ballots.0.weight");
  });
  it("majority: malformed JSON", async () => {
    expect((await run("majority", "{ not json")).code).toBe(2);
  });
  it("agendas: unknown procedure and unknown constrained alternative", async () => {
    const r1 = await run("agendas", { ...condorcet, procedure: "plurality" });
    expect(r1.code).toBe(2);
    expect(r1.err).toContain("procedure");
    const r2 = await run("agendas", { ...condorcet, procedure: "amendment", constraints: { before: [["a", "zz"]] } });
    expect(r2.code).toBe(2);
    expect(r2.err).toContain("constraints.before.0.1");
  });
  it("orders: bad rulebook voting section, missing rulebook file", async () => {
    const r1 = await run("orders", { rulebook: { voting: { procedure: "amendment" } }, measure: { id: "B" }, profile: { ballots: [{ ranking: ["B"] }] } });
    expect(r1.code).toBe(2);
    expect(r1.err).toContain("rulebook.voting.citation");
    const r2 = await run("orders", { rulebook: "missing.json", measure: { id: "B" }, profile: { ballots: [{ ranking: ["B"] }] } });
    expect(r2.code).toBe(2);
    expect(r2.err).toContain("rulebook");
  });
});

describe("majority (Condorcet 1785; DOMAIN §4)", () => {
  it("prints the margins and the sets in input order", async () => {
    const r = await run("majority", condorcet);
    expect(r.code).toBe(0);
    expect(r.json).toEqual({
      margins: { a: { b: 1, c: -1 }, b: { a: -1, c: 1 }, c: { a: 1, b: -1 } },
      condorcetWinner: null,
      topCycle: ["a", "b", "c"],
      schwartzSet: ["a", "b", "c"],
      uncoveredSet: ["a", "b", "c"],
      banksSet: ["a", "b", "c"],
      banksComplete: true,
    });
  });
  it("margins input; pref_voting documentation v1.18.1 four-alternative example", async () => {
    const r = await run("majority", { alternatives: ["0", "1", "2", "3"], margins: { 0: { 2: 1, 3: 1 }, 1: { 0: 1 }, 2: { 1: 1, 3: 1 }, 3: { 1: 1 } } });
    expect(r.json).toMatchObject({ condorcetWinner: null, topCycle: ["0", "1", "2", "3"], uncoveredSet: ["0", "1", "2"], banksSet: ["0", "1", "2"] });
  });
});

describe("agendas", () => {
  it("pref_voting documentation v1.18.1: 24 orders, sincere {0:10,1:6,2:6,3:2}, sophisticated {0:12,1:6,2:6}", async () => {
    const r = await run("agendas", { alternatives: ["0", "1", "2", "3"], edges: [["0", "2"], ["0", "3"], ["1", "0"], ["2", "1"], ["2", "3"], ["3", "1"]], procedure: "amendment" });
    expect(r.json).toEqual({ orders: 24, distinctAgendas: 12, sincere: { 0: 10, 1: 6, 2: 6, 3: 2 }, sophisticated: { 0: 12, 1: 6, 2: 6 } });
  });
  it("Condorcet paradox, order (a,b,c): sincere c, sophisticated b, chain [c,b] (DOMAIN §4)", async () => {
    const r = await run("agendas", { ...condorcet, procedure: "amendment", order: ["a", "b", "c"] });
    expect(r.json.order).toMatchObject({ sincere: "c", sophisticated: "b", chain: ["c", "b"] });
  });
  it("constraints: with c last, 2 of the 6 orders remain (common practice, no source)", async () => {
    const r = await run("agendas", { ...condorcet, procedure: "amendment", constraints: { last: "c" } });
    expect(r.json.orders).toBe(2);
  });
  it("successive procedure from edges: sincere voting is undefined without ballots (null)", async () => {
    const r = await run("agendas", { alternatives: ["a", "b", "c"], edges: [["a", "b"], ["b", "c"], ["c", "a"]], procedure: "successive" });
    expect(r.json).toEqual({ orders: 6, sincere: null, sophisticated: { a: 2, b: 2, c: 2 } });
  });
});

describe("orders", () => {
  it("rulebook as a path relative to the case file; page of orders with outcomes", async () => {
    const rb = { voting: { procedure: "amendment", citation: "Fictional Chamber Rule 12" } };
    const r = await run(
      "orders",
      {
        rulebook: "rb.json",
        measure: { id: "B", sections: [{ id: "s1" }] },
        amendments: [{ id: "A", target: "s1", form: "insert", lines: [1, 1] }, { id: "A2", target: "A", form: "strike" }],
        profile: { ballots: [{ ranking: ["B+A", "B", "Q", "B+A+A2"], weight: 2 }, { ranking: ["B+A+A2", "B+A", "B", "Q"] }, { ranking: ["Q", "B"] }] },
      },
      { "rb.json": rb },
    );
    expect(r.code).toBe(0);
    expect(r.json.alternatives.map((a: { id: string }) => a.id)).toEqual(["Q", "B", "B+A", "B+A+A2"]);
    expect(r.json.orders).toBe(1);
    expect(r.json.page.orders[0].questions).toEqual(["A2", "A", "passage"]);
    expect(r.json.sincere).toEqual({ [r.json.page.orders[0].sincere]: 1 });
    expect(r.json.majority.condorcetWinner).toBe("B+A");
  });
  it("a whole rulebook file: membership from chamber.members, passage from the main motion, quorum checked; below quorum exits with unprocessable (decision 0008; RONR 1915 §64)", async () => {
    const { readFileSync } = await import("node:fs");
    const { resolve } = await import("node:path");
    const demo = JSON.parse(readFileSync(resolve(import.meta.dirname, "../../../rulebooks/demo-chamber.json"), "utf8"));
    const base = { rulebook: "demo.json", measure: { id: "B" } };
    const ok = await run("orders", { ...base, profile: { ballots: [{ ranking: ["B", "Q"], weight: 21 }, { ranking: ["Q", "B"], weight: 19 }] } }, { "demo.json": demo });
    expect(ok.code).toBe(0);
    expect(ok.json.thresholds).toEqual({ amendment: "majority", passage: "majority", passageFrom: "main-motion", members: 40, membersFrom: "chamber.members" });
    expect(ok.json.quorum).toEqual({ kind: "number", required: 13, present: 40, met: true });
    expect(ok.json.tieRule).toBe("motion-fails");
    expect(ok.json.chairBallot).toBe(false);
    expect(ok.json.passesAgainstQ).toEqual({ B: true });
    const few = await run("orders", { ...base, profile: { ballots: [{ ranking: ["B", "Q"], weight: 12 }] } }, { "demo.json": demo });
    expect(few.code).toBe(2);
    expect(few.err).toContain("no quorum");
  });
});
