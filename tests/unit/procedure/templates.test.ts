import { describe, expect, it } from "vitest";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { template, TEMPLATE_IDS } from "./fixtures.ts";

async function moves(id: string, pending: Array<{ motion: string; independentParts?: boolean }>, floor?: Record<string, unknown>) {
  const list = await legalMoves(template(id), { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}
const MAIN = { motion: "main" };

describe("four-amendment legislature (Rules of the US House of Representatives)", () => {
  it("the previous question is ordered by a majority (Rule XIX cl. 1) and is undebatable (Rule XVI cl. 4(b))", async () => {
    const v = (await moves("four-amendment-legislature", [MAIN]))["previous-question"];
    expect([v.vote, v.debatable]).toEqual(["majority", false]);
  });
  it("precedence follows Rule XVI cl. 4(a): with refer pending, postpone to a day certain is in order and amend applies to it", async () => {
    const m = await moves("four-amendment-legislature", [MAIN, { motion: "commit" }]);
    expect(m["postpone-definitely"].inOrder).toBe(true);
    expect(m["postpone-indefinitely"].inOrder).toBe(false);
    expect(m.amend.inOrder).toBe(true);
  });
  it("a motion to limit debate is not among the motions entertained under debate (Rule XVI cl. 4(a))", async () => {
    const v = (await moves("four-amendment-legislature", [MAIN]))["limit-debate"];
    expect(v.inOrder).toBe(false);
    expect(v.reasons.map((r) => r.rule)).toContain("not-entertained");
  });
  it("Rule XVI cl. 4(a) ranks to amend above to postpone indefinitely: with postpone indefinitely pending, an amendment is in order and applies to the bill (F8)", async () => {
    const v = (await moves("four-amendment-legislature", [MAIN, { motion: "postpone-indefinitely" }])).amend;
    expect([v.inOrder, v.degree, v.appliesTo]).toEqual([true, 1, "main"]);
  });
  it("an amendment to an amendment to an amendment is out of order (Rule XVI cl. 6)", async () => {
    const v = (await moves("four-amendment-legislature", [MAIN, { motion: "amend" }, { motion: "amend" }])).amend;
    expect([v.inOrder, v.degree]).toEqual([false, 3]);
  });
});

describe("continental (European Parliament Rules of Procedure, 8th term, Rules 170 and 174; no written sub-amendments in plenary, from memory — T7)", () => {
  it("amendments are to the text only in the EP plenary: an amendment to a pending amendment is out of order", async () => {
    const m = await moves("continental", [MAIN, { motion: "amend" }]);
    expect([m.amend.inOrder, m.amend.degree]).toEqual([false, 2]);
    expect((await moves("continental", [MAIN])).amend.inOrder).toBe(true);
  });
  it("the old id continental-successive still names the template (alias)", async () => {
    expect(template("continental-successive").id).toBe("continental");
  });
});

describe("every template: amend applies beneath postpone indefinitely (RONR 1915 §33 p. 134: \"To Amend takes precedence of the motion to postpone indefinitely\")", () => {
  // Only where the catalogue has postpone indefinitely ranked below amend, as in general parliamentary law:
  // the Senate ranks it above amend (Standing Rules of the Senate, Rule XXII cl. 1), and the Westminster
  // and continental catalogues have no such motion.
  const rankOf = (id: string, motion: string) => template(id).motions.find((m) => m.id === motion)?.rank ?? null;
  const applies = TEMPLATE_IDS.filter((id) => {
    const pi = rankOf(id, "postpone-indefinitely");
    const amend = rankOf(id, "amend");
    return pi !== null && amend !== null && amend > pi;
  });
  it("applies to the general-parliamentary-law family", () => {
    expect(applies).toEqual(expect.arrayContaining(["general-parliamentary-law", "demo-chamber", "us-house"]));
  });
  for (const id of applies) {
    it(id, async () => {
      const v = (await moves(id, [MAIN, { motion: "postpone-indefinitely" }])).amend;
      expect([v.inOrder, v.degree, v.appliesTo]).toEqual([true, 1, "main"]);
    });
  }
});

describe("Harrowmere Assembly (fictional Standing Orders)", () => {
  it("incidental motions yield to adjourn (fictional SO 20, as RONR 1915 §13) and reconsider keeps to its window (fictional SO 50)", async () => {
    expect((await moves("demo-chamber", [MAIN, { motion: "adjourn" }]))["suspend-rules"].inOrder).toBe(false);
    expect((await moves("demo-chamber", [], { day: 3, votes: [{ motion: "main", result: "adopted", day: 1 }] })).reconsider.inOrder).toBe(false);
    expect((await moves("demo-chamber", [], { day: 2, votes: [{ motion: "main", result: "adopted", day: 1 }] })).reconsider.inOrder).toBe(true);
  });
  it("ranks come from the precedence chain of SO 20: lay on the table outranks close debate, postpone indefinitely does not outrank amend", async () => {
    const m = await moves("demo-chamber", [MAIN, { motion: "amend" }]);
    expect(m["postpone-indefinitely"].inOrder).toBe(false);
    expect(m["lay-on-table"].inOrder).toBe(true);
    const top = await moves("demo-chamber", [MAIN, { motion: "lay-on-table" }]);
    expect(top["previous-question"].inOrder).toBe(false);
    expect(top.adjourn.inOrder).toBe(true);
  });
  it("suspending the standing orders takes a majority of all members (SO 42)", async () => {
    expect((await moves("demo-chamber", []))["suspend-rules"].vote).toBe("majority-of-members");
  });
});
