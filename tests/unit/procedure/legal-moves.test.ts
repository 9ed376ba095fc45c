import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { template } from "./fixtures.ts";

const gpl = template("general-parliamentary-law");

async function moves(pending: Array<{ motion: string; degree?: number }>, floor?: Record<string, unknown>) {
  const list = await legalMoves(gpl, { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
  } catch (e) {
    if (e instanceof GavelError) return e.code;
    throw e;
  }
  return "none";
}

const MAIN = { motion: "main" };
const AMEND = { motion: "amend" };

describe("legalMoves: invalid floor states", () => {
  it("rejects a pending motion missing from the catalogue, naming the entry", async () => {
    const p = legalMoves(gpl, { pending: [MAIN, { motion: "filibuster" }] });
    await expect(p).rejects.toMatchObject({ code: "invalid-input", issues: [{ path: "pending.1.motion" }] });
  });

  it("rejects a stated degree that the stack contradicts", async () => {
    await expect(legalMoves(gpl, { pending: [MAIN, { motion: "amend", degree: 2 }] })).rejects.toMatchObject({ issues: [{ path: "pending.1.degree" }] });
    await expect(legalMoves(gpl, { pending: [MAIN, { motion: "commit", degree: 1 }] })).rejects.toMatchObject({ issues: [{ path: "pending.1.degree" }] });
  });

  it("rejects wrong types", async () => {
    expect(await codeOf(legalMoves(gpl, { pending: "main" }))).toBe("invalid-input");
    expect(await codeOf(legalMoves(gpl, { pending: [], floor: { speakerHasFloor: "yes" } }))).toBe("invalid-input");
  });
});

describe("legalMoves: edge cases", () => {
  it("gives one verdict per catalogue motion, in catalogue order", async () => {
    const list = await legalMoves(gpl, {});
    expect(list.map((v) => v.motion)).toEqual(gpl.motions.map((m) => m.id));
  });

  it("gives the amend verdict a degree and nothing else one", async () => {
    const list = await legalMoves(gpl, { pending: [MAIN] });
    expect(list.filter((v) => v.degree !== undefined).map((v) => v.motion)).toEqual(["amend"]);
  });

  it("every reason carries its rule id and citation", async () => {
    for (const v of await legalMoves(gpl, { pending: [MAIN, AMEND, AMEND] })) {
      for (const r of v.reasons) {
        expect(gpl.rules.find((x) => x.id === r.rule)?.citation).toBe(r.citation);
        expect(r.message).not.toMatch(/\{[a-zA-Z.]+\}/);
      }
    }
  });

  it("answers differently when the data differ: dropping the rank rule puts postpone indefinitely in order", async () => {
    const edited = { ...gpl, rules: gpl.rules.filter((r) => r.id !== "rank-precedence") };
    const v = (await legalMoves(edited, { pending: [MAIN, AMEND] })).find((x) => x.motion === "postpone-indefinitely")!;
    expect(v.inOrder).toBe(true);
  });
});

// Each check below names its section of Robert's Rules of Order Revised (1915) [public domain].
describe("general parliamentary law: characteristics (RONR 1915)", () => {
  it("main motion: second, debatable, amendable, majority (§11)", async () => {
    const v = (await moves([])).main;
    expect([v.second, v.debatable, v.amendable, v.vote]).toEqual([true, true, true, "majority"]);
  });
  it("previous question: second, not debatable, not amendable, two-thirds (§29)", async () => {
    const v = (await moves([MAIN]))["previous-question"];
    expect([v.second, v.debatable, v.amendable, v.vote]).toEqual([true, false, false, "two-thirds"]);
  });
  it("lay on the table: not debatable, not amendable, majority (§28)", async () => {
    const v = (await moves([MAIN]))["lay-on-table"];
    expect([v.debatable, v.amendable, v.vote]).toEqual([false, false, "majority"]);
  });
  it("limit debate: not debatable, amendable, two-thirds (§30)", async () => {
    const v = (await moves([MAIN]))["limit-debate"];
    expect([v.debatable, v.amendable, v.vote]).toEqual([false, true, "two-thirds"]);
  });
  it("postpone indefinitely: debatable, not amendable, majority (§34)", async () => {
    const v = (await moves([MAIN]))["postpone-indefinitely"];
    expect([v.debatable, v.amendable, v.vote]).toEqual([true, false, "majority"]);
  });
  it("amend is debatable when the question amended is (§33; Table of Rules note 4)", async () => {
    expect((await moves([MAIN])).amend.debatable).toBe(true);
    expect((await moves([MAIN, { motion: "limit-debate" }])).amend.debatable).toBe(false);
  });
  it("a secondary amendment cannot itself be amended (§33)", async () => {
    const v = (await moves([MAIN, AMEND])).amend;
    expect([v.degree, v.amendable]).toEqual([2, false]);
  });
  it("suspend the rules: two-thirds, not debatable, not amendable (§22)", async () => {
    const v = (await moves([]))["suspend-rules"];
    expect([v.vote, v.debatable, v.amendable]).toEqual(["two-thirds", false, false]);
  });
  it("objection to consideration: no second, two-thirds, may interrupt (§23)", async () => {
    const v = (await moves([MAIN]))["objection-to-consideration"];
    expect([v.second, v.vote, v.interrupt]).toEqual([false, "two-thirds", true]);
  });
  it("leave to withdraw: no second, not debatable, not amendable (§27(c))", async () => {
    const v = (await moves([MAIN])).withdraw;
    expect([v.second, v.debatable, v.amendable]).toEqual([false, false, false]);
  });
  it("question of order: no second, may interrupt, decided by the chair (§21)", async () => {
    const v = (await moves([MAIN]))["point-of-order"];
    expect([v.second, v.interrupt, v.vote]).toEqual([false, true, "none"]);
  });
  it("adjourn: second, not debatable, not amendable (§17)", async () => {
    const v = (await moves([MAIN])).adjourn;
    expect([v.second, v.debatable, v.amendable]).toEqual([true, false, false]);
  });
  it("fix the time to which to adjourn and take a recess are amendable but not debatable (§§16, 18; §14)", async () => {
    const m = await moves([MAIN]);
    expect([m["fix-time-to-adjourn"].amendable, m["fix-time-to-adjourn"].debatable]).toEqual([true, false]);
    expect([m.recess.amendable, m.recess.debatable]).toEqual([true, false]);
  });
  it("commit is debatable and amendable (§32)", async () => {
    const v = (await moves([MAIN])).commit;
    expect([v.debatable, v.amendable]).toEqual([true, true]);
  });
  it("reconsider may be made when another has the floor (§36)", async () => {
    const v = (await moves([MAIN], { speakerHasFloor: true, voteTaken: true })).reconsider;
    expect([v.interrupt, v.inOrder]).toEqual([true, true]);
  });
});

describe("general parliamentary law: verdicts (RONR 1915)", () => {
  it("a main motion is in order only when nothing is pending (§11)", async () => {
    expect((await moves([])).main.inOrder).toBe(true);
    expect((await moves([MAIN])).main.inOrder).toBe(false);
  });
  it("DOMAIN §4 'Procedure': main and primary amendment pending (§§28, 29, 33, 34; Order of Precedence)", async () => {
    const m = await moves([MAIN, AMEND]);
    expect(m["lay-on-table"].inOrder).toBe(true);
    expect(m["previous-question"].inOrder).toBe(true);
    expect(m["postpone-indefinitely"].inOrder).toBe(false);
    expect(m["postpone-indefinitely"].reasons.map((r) => r.rule)).toContain("rank-precedence");
    expect([m.amend.inOrder, m.amend.degree]).toEqual([true, 2]);
  });
  it("DOMAIN §4 'Procedure': an amendment to a secondary amendment is out of order (third degree, §33)", async () => {
    const v = (await moves([MAIN, AMEND, AMEND])).amend;
    expect([v.inOrder, v.degree]).toEqual([false, 3]);
    expect(v.reasons.map((r) => r.rule)).toContain("amend-degree-limit");
  });
  it("a primary amendment is of the first degree (§33)", async () => {
    const v = (await moves([MAIN])).amend;
    expect([v.inOrder, v.degree]).toEqual([true, 1]);
  });
  it("with the previous question pending, lay on the table is in order and limit debate is not (Order of Precedence)", async () => {
    const m = await moves([MAIN, { motion: "previous-question" }]);
    expect(m["lay-on-table"].inOrder).toBe(true);
    expect(m["limit-debate"].inOrder).toBe(false);
    expect(m.commit.inOrder).toBe(false);
  });
  it("the previous question cannot be amended (§29)", async () => {
    const v = (await moves([MAIN, { motion: "previous-question" }])).amend;
    expect(v.inOrder).toBe(false);
    expect(v.reasons.map((r) => r.rule)).toContain("amend-needs-amendable");
  });
  it("adjourn takes precedence of every subsidiary motion (§17)", async () => {
    expect((await moves([MAIN, AMEND, { motion: "lay-on-table" }])).adjourn.inOrder).toBe(true);
  });
  it("while adjourn is pending, fixing the time to adjourn is in order and a recess is not (§§16, 18)", async () => {
    const m = await moves([MAIN, { motion: "adjourn" }]);
    expect(m["fix-time-to-adjourn"].inOrder).toBe(true);
    expect(m.recess.inOrder).toBe(false);
  });
  it("subsidiary motions need a pending question (§12)", async () => {
    const m = await moves([]);
    for (const id of ["postpone-indefinitely", "commit", "previous-question", "lay-on-table"]) expect(m[id].inOrder).toBe(false);
  });
  it("while a member speaks, a question of order is in order and adjourn is not (§§3, 17, 21)", async () => {
    const m = await moves([MAIN], { speakerHasFloor: true });
    expect(m["point-of-order"].inOrder).toBe(true);
    expect(m.adjourn.inOrder).toBe(false);
  });
  it("objection to consideration: in order before debate, not after debate has begun (§23)", async () => {
    expect((await moves([MAIN]))["objection-to-consideration"].inOrder).toBe(true);
    expect((await moves([MAIN], { debateBegun: true }))["objection-to-consideration"].inOrder).toBe(false);
    expect((await moves([MAIN, AMEND]))["objection-to-consideration"].inOrder).toBe(false);
  });
  it("amend applies to an amendable subsidiary motion such as commit (§§32, 33)", async () => {
    const v = (await moves([MAIN, { motion: "commit" }])).amend;
    expect([v.inOrder, v.degree, v.debatable]).toEqual([true, 1, true]);
  });
  it("a call for the orders of the day is in order while commit is pending (§20)", async () => {
    expect((await moves([MAIN, { motion: "commit" }]))["orders-of-the-day"].inOrder).toBe(true);
  });
  it("an appeal lies only when the chair has ruled (§21)", async () => {
    expect((await moves([MAIN])).appeal.inOrder).toBe(false);
    expect((await moves([MAIN], { chairHasRuled: true })).appeal.inOrder).toBe(true);
  });
  it("take from the table: when nothing is pending and a question lies on the table (§35)", async () => {
    expect((await moves([], { tabled: 1 }))["take-from-table"].inOrder).toBe(true);
    expect((await moves([MAIN], { tabled: 1 }))["take-from-table"].inOrder).toBe(false);
    expect((await moves([]))["take-from-table"].inOrder).toBe(false);
  });
});

describe("property: precedence by rank", () => {
  const ranked = gpl.motions.filter((m) => m.rank !== null && m.class !== "main").map((m) => m.id);
  const rankOf = new Map(gpl.motions.map((m) => [m.id, m.rank]));

  // RONR (1915) Order of Precedence: a motion cannot be made while a higher-ranking question is
  // immediately pending. The one exception the manual states: amend applies to the question it
  // amends and so takes its precedence (§33), when that question is amendable.
  it("under general parliamentary law a motion ranked below the immediately pending question is never in order", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.constantFrom(...ranked), { maxLength: 6 }), async (stack) => {
        const pending = [{ motion: "main" }, ...stack.map((motion) => ({ motion }))];
        const list = await legalMoves(gpl, { pending });
        const top = pending[pending.length - 1].motion;
        let topDegree = 0;
        for (const p of pending) topDegree = p.motion === "amend" ? topDegree + 1 : 0;
        const topAmendable = top === "amend" ? topDegree < gpl.amendments.maxDegree : gpl.motions.find((m) => m.id === top)!.amendable;
        for (const v of list) {
          if (v.rank === null || v.rank >= rankOf.get(top)!) continue;
          if (v.motion === "amend" && topAmendable) continue;
          expect(v.inOrder, `${v.motion} with ${top} pending`).toBe(false);
        }
      }),
      { numRuns: 150 },
    );
  });

  it("under any rank-only rulebook, below-rank motions are out of order and above-rank ones in order", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.uniqueArray(fc.integer({ min: 0, max: 50 }), { minLength: 2, maxLength: 8 }),
        fc.array(fc.nat(), { minLength: 1, maxLength: 5 }),
        async (ranks, picks) => {
          const rb = parseRulebook({
            format: "gavelwright.rulebook",
            formatVersion: 1,
            id: "rank-only",
            title: "Rank only",
            chamber: { name: "Test chamber" },
            source: { title: "common practice, no source" },
            motions: ranks.map((rank, i) => ({ id: `m${i}`, name: `M${i}`, class: "subsidiary", rank, second: true, debatable: true, amendable: false, vote: "majority", interrupt: false, reconsiderable: true, citation: "test" })),
            amendments: { motion: "m0", forms: ["insert"], maxDegree: 2, germaneness: { test: "none", citation: "test" }, citation: "test" },
            voting: { procedure: "amendment", citation: "test" },
            rules: [{ id: "rank", scope: "motion", citation: "Order of Precedence", message: "ranks below", conditions: { all: [{ fact: "motion", path: "$.rank", operator: "ranksBelow", value: { fact: "immediatelyPending", path: "$.rank" } }] } }],
          });
          const pending = picks.map((p) => ({ motion: `m${1 + (p % (ranks.length - 1))}` }));
          const topRank = ranks[Number(pending[pending.length - 1].motion.slice(1))];
          for (const v of await legalMoves(rb, { pending })) expect(v.inOrder).toBe(v.rank! >= topRank);
        },
      ),
      { numRuns: 100 },
    );
  });
});
