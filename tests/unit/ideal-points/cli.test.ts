// CLI contract of `gavelwright ideal-points FILE` (README.md, "Command line", "ideal-points").
import { describe, expect, it } from "vitest";
import { cliSandbox } from "../../support/cli.ts";

const cli = cliSandbox("ideal-cli");
let n = 0;
async function run(content: unknown) {
  const r = await cli.run("ideal-points", cli.file(`in-${n++}.json`, content));
  return { ...r, json: r.code === 0 ? JSON.parse(r.out) : undefined };
}

// Twenty-four members on a line; roll call k splits them after member k (a perfect ordering), so each member has 22+ votes.
const ids = Array.from({ length: 24 }, (_, i) => `Member ${String.fromCharCode(65 + i)} — “${i}”`);
const votes = Array.from({ length: 23 }, (_, k) => ({ id: `roll call ${k + 1}`, yea: ids.slice(0, k + 1), nay: ids.slice(k + 1) }));

describe("gavelwright ideal-points", () => {
  it("reads the documented input and prints members, votes and fit", async () => {
    const r = await run({ dimensions: 1, votes, direction: { left: ids[23], right: ids[0] } });
    expect(r.code).toBe(0);
    const out = r.json;
    expect(out.members.map((m: { id: string }) => m.id)).toEqual(ids); // members taken from the votes, in order of appearance
    for (const m of out.members) {
      expect(m.ideal).toHaveLength(1);
      expect(m.se).toHaveLength(1);
    }
    // direction: the last member left of the first, so the order reverses along the line
    const xs = out.members.map((m: { ideal: number[] }) => m.ideal[0]);
    for (let i = 1; i < xs.length; i++) expect(xs[i]).toBeLessThan(xs[i - 1]);
    // roll call 1 (1 of 24 = 4.2% minority) is used; every roll call reports used
    expect(out.votes.map((v: { id: string; used: boolean }) => [v.id, v.used])).toEqual(votes.map((v) => [v.id, true]));
    // the priors keep the extreme roll calls' cutting points finite, so a few votes at the ends may be misclassified
    expect(out.fit.classification).toBeGreaterThan(0.98);
    expect(out.fit.apre).toBeGreaterThan(0.9);
  });
  it("`members` lists members with no vote, who are then left out and counted", async () => {
    const r = await run({ dimensions: 1, votes, members: [...ids, "Absent"] });
    expect(r.code).toBe(0);
    expect(r.json.excluded.members).toEqual([{ id: "Absent", votes: 0 }]);
  });
  it.each([
    [{ dimensions: 3, votes }, "dimensions"],
    [{ dimensions: 1 }, "votes"],
    [{ dimensions: 1, votes: [{ id: "v", yea: [""], nay: [] }] }, "votes.0.yea.0"],
    [{ dimensions: 1, votes, members: ids.slice(1) }, "votes.0.yea.0"],
    [{ dimensions: 1, votes, direction: { left: ids[0] } }, "direction.right"],
  ])("bad input exits 2 and names the field (%#)", async (input, path) => {
    const r = await run(input);
    expect(r.code).toBe(2);
    expect(r.err).toContain(path);
  });
  it("malformed JSON exits 2", async () => {
    expect((await run("{ nope")).code).toBe(2);
  });
});
