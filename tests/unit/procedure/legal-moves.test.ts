import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { EMPTY_BOARD, floorStateOf } from "../../../src/lib/server/floor-record.ts";
import { template } from "./fixtures.ts";

const gpl = template("general-parliamentary-law");

async function moves(pending: Array<{ motion: string; degree?: number; independentParts?: boolean; hasBlank?: boolean }>, floor?: Record<string, unknown>) {
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

  // The question an amendment would apply to, as the manual states it: the immediately pending question,
  // except that "To Amend takes precedence of the motion to postpone indefinitely" (§33 p. 134), which
  // "cannot be amended" (§34) — so above it an amendment applies to the question beneath, with the degree
  // it would have there. Computed here from the stack independently of the engine.
  function amendTargetOf(pending: Array<{ motion: string }>): { amendable: boolean; degree: number } {
    const degrees: number[] = [];
    const targetIndex = (upTo: number) => {
      let i = upTo;
      while (i > 0 && pending[i].motion === "postpone-indefinitely") i--;
      return i;
    };
    pending.forEach((p, i) => {
      const t = i === 0 ? -1 : targetIndex(i - 1);
      degrees.push(p.motion === "amend" ? (t >= 0 && pending[t].motion === "amend" ? degrees[t] + 1 : 1) : 0);
    });
    const t = targetIndex(pending.length - 1);
    const id = pending[t].motion;
    const amendable = id === "amend" ? degrees[t] < gpl.amendments.maxDegree : gpl.motions.find((m) => m.id === id)!.amendable;
    return { amendable, degree: id === "amend" ? degrees[t] + 1 : 1 };
  }

  // RONR (1915) Order of Precedence: a motion cannot be made while a higher-ranking question is
  // immediately pending. The exceptions the manual states: amend applies to the question it amends and
  // so takes its precedence (§33), when that question is amendable; and amend "takes precedence of the
  // motion to postpone indefinitely" (§33 p. 134), applying beneath it (covered by the second property).
  it("under general parliamentary law a motion ranked below the immediately pending question is never in order", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.constantFrom(...ranked), { maxLength: 6 }), async (stack) => {
        const pending = [{ motion: "main" }, ...stack.map((motion) => ({ motion }))];
        const list = await legalMoves(gpl, { pending });
        const top = pending[pending.length - 1].motion;
        const target = amendTargetOf(pending);
        for (const v of list) {
          if (v.rank === null || v.rank >= rankOf.get(top)!) continue;
          if (v.motion === "amend" && target.amendable) continue;
          expect(v.inOrder, `${v.motion} with ${top} pending`).toBe(false);
        }
      }),
      { numRuns: 150 },
    );
  });

  it("amend is in order exactly when the question it would apply to can be amended, with that question's degree (§33 pp. 134-135, §34)", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.constantFrom(...ranked, "postpone-indefinitely", "amend"), { maxLength: 6 }), async (stack) => {
        const pending = [{ motion: "main" }, ...stack.map((motion) => ({ motion }))];
        const v = (await legalMoves(gpl, { pending })).find((x) => x.motion === "amend")!;
        const target = amendTargetOf(pending);
        expect(v.degree, JSON.stringify(stack)).toBe(target.degree);
        expect(v.inOrder, JSON.stringify(stack)).toBe(target.amendable);
      }),
      { numRuns: 200 },
    );
  });

  // §13 p. 56: incidental motions "take precedence of and must be decided before the question out of which
  // they rise … They yield to privileged motions, and generally to the motion to lay on the table."
  it("suspend the rules is in order exactly when the immediately pending question is neither privileged nor lay on the table (§13)", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.constantFrom(...ranked), { maxLength: 6 }), async (stack) => {
        const pending = [{ motion: "main" }, ...stack.map((motion) => ({ motion }))];
        const top = gpl.motions.find((m) => m.id === pending[pending.length - 1].motion)!;
        const v = (await legalMoves(gpl, { pending })).find((x) => x.motion === "suspend-rules")!;
        expect(v.inOrder, JSON.stringify(stack)).toBe(!(top.class === "privileged" || top.id === "lay-on-table"));
      }),
      { numRuns: 100 },
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

// Robert's Rules of Order Revised (1915) [public domain], read at en.wikisource.org (Page:Robert's Rules of
// Order - 1915.djvu and Page:Roberts Rules of Order Revised 4th Edition (1915).djvu) and bartleby.com/176.
// Quoted words are the manual's; everything else in a test name is our paraphrase.
describe("F8: amend takes precedence of postpone indefinitely (RONR 1915 §33 p. 134, §34)", () => {
  const PI = { motion: "postpone-indefinitely" };
  it('§33 p. 134 "To Amend takes precedence of the motion to postpone indefinitely": with it pending, amend is in order and applies to the main question, degree 1', async () => {
    const v = (await moves([MAIN, PI])).amend;
    expect([v.inOrder, v.degree, v.appliesTo]).toEqual([true, 1, "main"]);
    expect(v.reasons).toEqual([]);
  });
  it("§34 postpone indefinitely \"cannot be amended\", so the amendment is debatable as the main question is (Table of Rules note 4)", async () => {
    const m = await moves([MAIN, PI]);
    expect(m["postpone-indefinitely"].amendable).toBe(false);
    expect(m.amend.debatable).toBe(true);
  });
  it("an amendment made above postpone indefinitely is of the first degree, and one to it of the second (§33 p. 135)", async () => {
    await expect(legalMoves(gpl, { pending: [MAIN, PI, { motion: "amend", degree: 1 }] })).resolves.toBeDefined();
    await expect(legalMoves(gpl, { pending: [MAIN, PI, { motion: "amend", degree: 2 }] })).rejects.toMatchObject({ issues: [{ path: "pending.2.degree" }] });
    const v = (await moves([MAIN, PI, AMEND])).amend;
    expect([v.inOrder, v.degree, v.appliesTo]).toEqual([true, 2, "amend"]);
    const third = (await moves([MAIN, PI, AMEND, AMEND])).amend;
    expect([third.inOrder, third.degree]).toEqual([false, 3]);
  });
  it("the exception is for a motion ranked below amend: the previous question, which outranks amend and cannot be amended (§29), still refuses it", async () => {
    const v = (await moves([MAIN, { motion: "previous-question" }])).amend;
    expect(v.inOrder).toBe(false);
    expect(v.reasons.map((r) => r.rule)).toEqual(expect.arrayContaining(["amend-needs-amendable", "rank-precedence"]));
  });
});

describe("F9: incidental motions yield to privileged motions and to lay on the table (RONR 1915 §13 p. 56)", () => {
  // §13: incidental motions "take precedence of and must be decided before the question out of which they rise
  // … They yield to privileged motions, and generally to the motion to lay on the table."
  for (const top of ["adjourn", "lay-on-table", "recess"]) {
    it(`with ${top} immediately pending, suspend the rules, division of a question and leave to withdraw are out of order`, async () => {
      const m = await moves([MAIN, { motion: top }]);
      for (const id of ["suspend-rules", "division-of-question", "withdraw"]) {
        expect(m[id].inOrder, id).toBe(false);
        expect(m[id].reasons.map((r) => r.rule), id).toContain("incidental-yields-to-privileged");
      }
    });
  }
  it("with only the main question pending, the same incidental motions take precedence of it (§13)", async () => {
    const m = await moves([MAIN]);
    for (const id of ["suspend-rules", "division-of-question", "withdraw"]) expect(m[id].inOrder, id).toBe(true);
  });
  it('a question of order, an appeal from a ruling and a division of the assembly arise out of what is before the assembly and stay in order (§13: "arise out of another question which is pending"; §§21, 25)', async () => {
    const m = await moves([MAIN, { motion: "adjourn" }], { chairHasRuled: true });
    for (const id of ["point-of-order", "appeal", "division-of-assembly"]) expect(m[id].inOrder, id).toBe(true);
  });
  it("leave to withdraw the privileged motion itself arises out of it and is in order (§27(c); floor fact arisesFromPending)", async () => {
    expect((await moves([MAIN, { motion: "adjourn" }], { arisesFromPending: true })).withdraw.inOrder).toBe(true);
  });
});

describe("F10, F15, F18: reconsider (RONR 1915 §36 p. 156; Table of Rules notes 2, 4, 16)", () => {
  const vote = (motion: string, result: "adopted" | "rejected", day: number, extra: Record<string, unknown> = {}) => ({ motion, result, day, ...extra });
  it('"It can be made only on the day the vote to be reconsidered was taken, or on the next succeeding day"', async () => {
    expect((await moves([], { day: 4, votes: [vote("main", "adopted", 4)] })).reconsider.inOrder).toBe(true);
    expect((await moves([], { day: 5, votes: [vote("main", "adopted", 4)] })).reconsider.inOrder).toBe(true);
    const late = (await moves([], { day: 6, votes: [vote("main", "adopted", 4)] })).reconsider;
    expect(late.inOrder).toBe(false);
    expect(late.reasons.map((r) => r.rule)).toEqual(["reconsider-time-limit"]);
    expect(late.reasons[0].message).toContain("2 days ago");
  });
  it('"It must be made by one who voted with the prevailing side": refused when the mover did not, left to the chair when it is not known', async () => {
    const no = (await moves([], { day: 1, votes: [vote("main", "rejected", 1, { moverOnPrevailingSide: false })] })).reconsider;
    expect(no.reasons.map((r) => r.rule)).toEqual(["reconsider-prevailing-side"]);
    expect((await moves([], { day: 1, votes: [vote("main", "rejected", 1, { moverOnPrevailingSide: true })] })).reconsider.inOrder).toBe(true);
    expect((await moves([], { day: 1, votes: [vote("main", "rejected", 1)] })).reconsider.inOrder).toBe(true);
  });
  it('postpone indefinitely, §34: "An affirmative vote on it may be reconsidered, but not a negative vote."', async () => {
    expect((await moves([], { votes: [vote("postpone-indefinitely", "adopted", 1)] })).reconsider.inOrder).toBe(true);
    const v = (await moves([], { votes: [vote("postpone-indefinitely", "rejected", 1)] })).reconsider;
    expect(v.reasons.map((r) => r.rule)).toEqual(["reconsider-result-not-reconsiderable"]);
  });
  it('lay on the table, Table of Rules note 2: "An affirmative vote on this motion cannot be reconsidered." — a negative one can (F15)', async () => {
    expect((await moves([], { votes: [vote("lay-on-table", "adopted", 1)] })).reconsider.inOrder).toBe(false);
    expect((await moves([], { votes: [vote("lay-on-table", "rejected", 1)] })).reconsider.inOrder).toBe(true);
    expect((await moves([MAIN]))["lay-on-table"].reconsiderable).toBe("negative");
  });
  it("adjourn and suspend the rules cannot be reconsidered (1876 Pocket Manual §27: \"except to Adjourn and to Suspend the Rules\")", async () => {
    for (const id of ["adjourn", "suspend-rules"]) for (const result of ["adopted", "rejected"] as const) {
      expect((await moves([], { votes: [vote(id, result, 1)] })).reconsider.inOrder, `${id} ${result}`).toBe(false);
    }
  });
  it("the vote to reconsider may be named among the recent votes; by default it is the latest", async () => {
    const votes = [vote("main", "adopted", 1), vote("adjourn", "rejected", 1)];
    expect((await moves([], { votes })).reconsider.inOrder).toBe(false);
    expect((await moves([], { votes, reconsiderVote: 0 })).reconsider.inOrder).toBe(true);
  });
  it('reconsider is "Undebatable when the motion to be … reconsidered is undebatable" (Table of Rules note 4)', async () => {
    expect((await moves([], { votes: [vote("previous-question", "adopted", 1)] })).reconsider.debatable).toBe(false);
    expect((await moves([], { votes: [vote("main", "adopted", 1)] })).reconsider.debatable).toBe(true);
  });
  it("the live floor passes the last recorded vote, so an adopted motion to lay on the table is not reconsiderable there (note 2)", async () => {
    const board = { ...EMPTY_BOARD, voteTaken: true, lastVote: { motion: "lay-on-table", name: "Lay on the table", result: "adopted" as const, tally: null } };
    expect((await legalMoves(gpl, floorStateOf(board))).find((v) => v.motion === "reconsider")!.inOrder).toBe(false);
    const main = { ...board, lastVote: { ...board.lastVote, motion: "main", name: "Main motion" } };
    expect((await legalMoves(gpl, floorStateOf(main))).find((v) => v.motion === "reconsider")!.inOrder).toBe(true);
  });
  it("a floor state of an earlier version (voteTaken, no votes listed) answers as before", async () => {
    expect((await moves([], { voteTaken: true })).reconsider.inOrder).toBe(true);
    expect((await moves([])).reconsider.reasons.map((r) => r.rule)).toEqual(["reconsider-needs-vote"]);
  });
  it("refuses votes that name no catalogue motion, a vote after today, and a reconsiderVote beyond the list", async () => {
    await expect(legalMoves(gpl, { floor: { votes: [{ motion: "filibuster", result: "adopted" }] } })).rejects.toMatchObject({ code: "invalid-input", issues: [{ path: "floor.votes.0.motion" }] });
    await expect(legalMoves(gpl, { floor: { day: 2, votes: [vote("main", "adopted", 3)] } })).rejects.toMatchObject({ issues: [{ path: "floor.votes.0.day" }] });
    await expect(legalMoves(gpl, { floor: { votes: [vote("main", "adopted", 1)], reconsiderVote: 1 } })).rejects.toMatchObject({ issues: [{ path: "floor.reconsiderVote" }] });
    await expect(legalMoves(gpl, { floor: { votes: [{ motion: "main", result: "carried" }] } })).rejects.toMatchObject({ issues: [{ path: "floor.votes.0.result" }] });
  });
});

describe("F12, F13: characteristics that depend on the floor state (RONR 1915 §§14, 16; Table of Rules notes 10, 11)", () => {
  it('fix the time to which to adjourn, §16 p. 59: "if made in an assembly when no question is pending, this is a main motion and may be debated"; note 11: "Undebatable if made when another question is before the assembly."', async () => {
    const none = (await moves([]))["fix-time-to-adjourn"];
    expect([none.class, none.debatable, none.inOrder, none.variantsApplied?.length]).toEqual(["main", true, true, 1]);
    const pending = (await moves([MAIN]))["fix-time-to-adjourn"];
    expect([pending.class, pending.debatable, pending.variantsApplied]).toEqual(["privileged", false, []]);
  });
  it('take a recess is privileged "(if made when another question is pending)" (§14 p. 58), otherwise a debatable main motion', async () => {
    expect([(await moves([])).recess.class, (await moves([])).recess.debatable]).toEqual(["main", true]);
    expect([(await moves([MAIN])).recess.class, (await moves([MAIN])).recess.debatable]).toEqual(["privileged", false]);
  });
  it('note 10: propositions on independent subjects "must be divided on the request of a single member, which can be made when another has the floor"', async () => {
    const independent = (await moves([{ motion: "main", independentParts: true }], { speakerHasFloor: true }))["division-of-question"];
    expect([independent.inOrder, independent.second, independent.vote, independent.interrupt]).toEqual([true, false, "none", true]);
  });
  it('note 10: "If they relate to the same subject and yet each part can stand alone, they may be divided only on a regular motion and vote"', async () => {
    const regular = (await moves([MAIN]))["division-of-question"];
    expect([regular.second, regular.vote, regular.interrupt]).toEqual([true, "majority", false]);
    expect((await moves([MAIN], { speakerHasFloor: true }))["division-of-question"].inOrder).toBe(false);
  });
});

describe("F11, F14: thresholds in the alternative or in stated circumstances", () => {
  it('rescind, §63 p. 256: "by a majority vote, if notice … was given …; or, without any notice, … by a majority of the entire membership, or by a two-thirds vote"', async () => {
    const plain = (await moves([])).rescind;
    expect(plain.vote).toBe("two-thirds");
    expect(plain.voteAlternatives?.map((a) => [a.kind, a.vote, a.applies])).toEqual([["or", "majority", false], ["or", "majority-of-members", null]]);
    const noticed = (await moves([], { noticeGiven: true })).rescind;
    expect(noticed.voteAlternatives?.[0]).toMatchObject({ vote: "majority", applies: true });
  });
  it('postpone definitely, §31 p. 121: "When it makes a question a special order it requires a two-thirds vote."', async () => {
    const v = (await moves([MAIN]))["postpone-definitely"];
    expect(v.vote).toBe("majority");
    expect(v.voteAlternatives).toEqual([expect.objectContaining({ kind: "instead", vote: "two-thirds", if: "it makes the question a special order", applies: null })]);
  });
});

describe("filling blanks and nominations (RONR 1915 §33 p. 149, §66 p. 263)", () => {
  it("a proposal to fill a blank needs a pending question with a blank; it takes no second and cannot be amended", async () => {
    const v = (await moves([{ motion: "main", hasBlank: true }]))["fill-blank"];
    expect([v.inOrder, v.second, v.amendable]).toEqual([true, false, false]);
    expect((await moves([MAIN]))["fill-blank"].reasons.map((r) => r.rule)).toEqual(["blank-needs-question-with-blank"]);
  });
  it('§66: "The nomination need not be seconded"; closing nominations takes two-thirds (§25 p. 96)', async () => {
    const m = await moves([{ motion: "main", hasBlank: true }]);
    expect([m.nominate.inOrder, m.nominate.second]).toEqual([true, false]);
    expect([m["close-nominations"].inOrder, m["close-nominations"].vote]).toEqual([true, "two-thirds"]);
  });
});
