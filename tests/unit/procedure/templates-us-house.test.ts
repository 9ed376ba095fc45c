/**
 * Worked examples for the US House template (rulebooks/us-house.json), each taken from the
 * source's own text. Sources: the Rules of the House as annotated in the House Rules Manual
 * (cited by Congress, section and page), House Practice, Deschler's Precedents, the Committee on
 * Rules' "Precedence and Summary of House Motions" (Parliamentary Outreach Program, 111th Cong.),
 * and CRS reports. Quotations are exact; anything else says "paraphrase".
 */
import { describe, expect, it } from "vitest";
import type { AmendmentInput, MeasureInput } from "../../../src/lib/amendments/case-schema.ts";
import { validateTree, type Finding } from "../../../src/lib/amendments/validate-tree.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { canonicalTemplateId } from "../../../src/lib/procedure/template-ids.ts";
import { rawTemplate, template } from "./fixtures.ts";

const house = template("us-house");
const MAIN = { motion: "main" };

async function moves(pending: Array<{ motion: string }>, floor: Record<string, unknown> = {}) {
  const list = await legalMoves(house, { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}
const inOrder = async (pending: Array<{ motion: string }>, floor: Record<string, unknown> = {}) =>
  Object.fromEntries(Object.values(await moves(pending, floor)).map((v) => [v.motion, v.inOrder]));

/**
 * Rule XVI cl. 4(a) as the Committee on Rules lists it: "when a question is under debate only the
 * following motions may be entertained by the Chair (which have precedence in the following order):
 * 1. To Adjourn. 2. To Lay on the Table. 3. For the Previous Question. 4. To Postpone to a Day
 * Certain." and then (paraphrase) 5. to refer, 6. to amend, 7. to postpone indefinitely.
 */
const RULE_XVI_4A = ["adjourn", "lay-on-table", "previous-question", "postpone-definitely", "commit", "amend", "postpone-indefinitely"];

describe("US House: precedence under Rule XVI cl. 4(a)-(c)", () => {
  it("each of the seven motions is in order while any motion listed after it is immediately pending", async () => {
    for (let j = 1; j < RULE_XVI_4A.length; j++) {
      const state = await inOrder([MAIN, { motion: RULE_XVI_4A[j] }]);
      for (let i = 0; i < j; i++) expect(state[RULE_XVI_4A[i]], `${RULE_XVI_4A[i]} over ${RULE_XVI_4A[j]}`).toBe(true);
    }
  });

  it("no listed motion is in order while one listed before it is immediately pending, except an amendment of an amendable motion", async () => {
    for (let i = 0; i < RULE_XVI_4A.length - 1; i++) {
      const top = RULE_XVI_4A[i];
      const state = await inOrder([MAIN, { motion: top }]);
      const amendable = house.motions.find((m) => m.id === top)!.amendable;
      for (const lower of RULE_XVI_4A.slice(i + 1)) {
        expect(state[lower], `${lower} under ${top}`).toBe(lower === "amend" && amendable);
      }
    }
  });

  it("amend (sixth) outranks postpone indefinitely (seventh): with postpone indefinitely pending an amendment is in order, applied to the question beneath it", async () => {
    const m = await moves([MAIN, { motion: "postpone-indefinitely" }]);
    expect([m.amend.inOrder, m.amend.degree]).toEqual([true, 1]);
  });

  it("fix the day and the recess authorisation have the privilege of adjourn: House Rules Manual 112th §585 p. 305, \"a separate motion of equal privilege\"; 113th, annotation to Jefferson §439, \"given an equal privilege\"", async () => {
    const rank = (id: string) => house.motions.find((m) => m.id === id)!.rank;
    expect(rank("fix-time-to-adjourn")).toBe(rank("adjourn"));
    expect(rank("recess")).toBe(rank("adjourn"));
    // Equal privilege: none takes precedence of another, and all three take precedence of lay on the table.
    const overAdjourn = await inOrder([MAIN, { motion: "adjourn" }]);
    expect([overAdjourn["fix-time-to-adjourn"], overAdjourn.recess]).toEqual([false, false]);
    const overTable = await inOrder([MAIN, { motion: "lay-on-table" }]);
    expect([overTable.adjourn, overTable["fix-time-to-adjourn"], overTable.recess]).toEqual([true, true, true]);
  });

  it("adjourn, lay on the table and the previous question are decided without debate (Rule XVI cl. 4(b), paraphrase); the previous question is ordered by a majority (Rule XIX cl. 1, paraphrase)", async () => {
    const m = await moves([MAIN]);
    expect([m.adjourn.debatable, m["lay-on-table"].debatable, m["previous-question"].debatable]).toEqual([false, false, false]);
    expect(m["previous-question"].vote).toBe("majority");
  });
});

describe("US House: seconds and suspension", () => {
  it("no motion needs a second: House Rules Manual 113th §392 p. 201, \"The House has long since dispensed with the requirement of a second for ordinary motions\", and the second for suspension \"was eliminated in the 102d Congress\"", () => {
    expect(house.motions.filter((m) => m.second).map((m) => m.id)).toEqual([]);
  });

  it("suspension: House Practice (2011 ed.) ch. 53 §1, \"It is debatable for 40 minutes, is not amendable, and requires a two-thirds vote for adoption.\"; Rule XV cl. 1(a), \"two-thirds of the Members voting\"", async () => {
    const v = (await moves([]))["suspend-rules"];
    expect([v.debatable, v.amendable, v.vote, v.second]).toEqual([true, false, "two-thirds", false]);
  });
});

describe("US House: quorum", () => {
  it("\"a smaller Number may adjourn from day to day\" (U.S. Const. art. I §5), while the motion for a recess \"is not in order in the absence of a quorum\" (House Rules Manual 112th §586)", async () => {
    const state = await moves([MAIN], { quorumPresent: false });
    expect(state.adjourn.inOrder).toBe(true);
    expect(state.recess.reasons.map((r) => r.rule)).toContain("no-quorum");
    expect(Object.values(state).filter((v) => v.inOrder).map((v) => v.motion)).toEqual(["adjourn"]);
  });
});

describe("US House: reconsider under Rule XIX cl. 3", () => {
  it("\"on the same or succeeding day\" (former rule, House Rules Manual 105th §812 p. 640), by \"any member of the majority\"", async () => {
    const vote = { motion: "main", result: "adopted", day: 4 };
    expect((await moves([], { day: 4, votes: [vote] })).reconsider.inOrder).toBe(true);
    expect((await moves([], { day: 5, votes: [vote] })).reconsider.inOrder).toBe(true);
    const late = await moves([], { day: 6, votes: [vote] });
    expect(late.reconsider.reasons.map((r) => r.rule)).toEqual(["reconsider-time-limit"]);
    const minority = await moves([], { day: 4, votes: [{ ...vote, moverOnPrevailingSide: false }] });
    expect(minority.reconsider.reasons.map((r) => r.rule)).toEqual(["reconsider-prevailing-side"]);
  });
});

describe("US House: the Committee of the Whole (floor fact committeeOfTheWhole)", () => {
  const COW = { committeeOfTheWhole: true };

  it("the motions of the House proper drop out: \"unhampered by roll-calls or the intervention of motions to adjourn, to refer, to postpone, for the previous question, and the like\" (Alexander, History and Procedure of the House, 1916, ch. XIII)", async () => {
    const state = await inOrder([MAIN, { motion: "amend" }], { ...COW, voteTaken: true });
    for (const id of ["adjourn", "commit", "postpone-definitely", "postpone-indefinitely", "previous-question"]) expect(state[id], id).toBe(false);
    // "A motion to \"lay on the table,\" in order only in the House" (Committee on Rules, Precedence and Summary of House Motions).
    expect(state["lay-on-table"]).toBe(false);
    // "The motion is not used in Committee of the Whole" (House Rules Manual 105th §812 p. 641, of reconsider).
    expect(state.reconsider).toBe(false);
    // "The motion is not available in the Committee of the Whole" (House Rules Manual 114th §886, of suspension).
    expect(state["suspend-rules"]).toBe(false);
  });

  it("the motion to rise \"is in order only in the Committee of the Whole during the amendment stage\" (Committee on Rules, Precedence and Summary of House Motions)", async () => {
    expect((await inOrder([MAIN, { motion: "amend" }], COW)).rise).toBe(true);
    const inHouse = await moves([MAIN, { motion: "amend" }]);
    expect(inHouse.rise.inOrder).toBe(false);
    expect(inHouse.rise.reasons.map((r) => r.rule)).toEqual(["only-in-committee-of-the-whole"]);
  });

  it("\"Members might make motions to close or limit five-minute debate\" in the Committee (CRS RL32200), by a majority; in the House the motion is not among Rule XVI cl. 4(a)'s seven", async () => {
    const committee = await moves([MAIN, { motion: "amend" }], COW);
    expect([committee["limit-debate"].inOrder, committee["limit-debate"].vote, committee["limit-debate"].debatable]).toEqual([true, "majority", false]);
    const floor = await moves([MAIN, { motion: "amend" }]);
    expect(floor["limit-debate"].reasons.map((r) => r.rule)).toEqual(["not-entertained"]);
  });

  it("amendments are offered in the Committee as in the House: an amendment and an amendment to it, not a third degree (Rule XVI cl. 6)", async () => {
    const m = await moves([MAIN, { motion: "amend" }], COW);
    expect([m.amend.inOrder, m.amend.degree]).toEqual([true, 2]);
    expect((await moves([MAIN, { motion: "amend" }, { motion: "amend" }], COW)).amend.inOrder).toBe(false);
  });
});

const measure: MeasureInput = {
  id: "B-7",
  subjects: ["harbours", "audit"],
  committee: "Works",
  sections: [
    { id: "sec1", subjects: ["harbours", "dredging"], lines: 30 },
    { id: "sec2", subjects: ["audit"], lines: 12 },
  ],
};
let n = 0;
const am = (target: string, extra: Partial<AmendmentInput> = {}): AmendmentInput => ({ id: `H${++n}`, target, form: "insert", sponsors: ["Member A"], subjects: ["harbours"], ...extra });
const findings = async (amendments: AmendmentInput[]) => (await validateTree({ rulebook: house, measure, amendments })).findings;
const codes = (fs: Finding[], id: string) => fs.filter((f) => f.amendment === id).map((f) => f.code);

describe("US House: the amendment tree (Rule XVI cl. 6) and germaneness (cl. 7)", () => {
  it("Deschler's Precedents ch. 27 §25: \"An amendment in the nature of a substitute for a bill may be proposed before perfecting amendments to the pending portion of the original text have been offered, but may not be voted on until after such perfecting amendments have been disposed of.\"", async () => {
    const s = am("B-7", { form: "in-nature-of-substitute", status: "pending", filedAt: "2026-03-02T10:00:00Z" });
    const p = am("sec1", { status: "pending", filedAt: "2026-03-02T10:05:00Z" });
    const fs = await findings([s, p]);
    expect(fs.filter((f) => f.severity === "error")).toEqual([]);
    expect(fs.find((f) => f.code === "voted-after-perfecting")).toMatchObject({ amendment: s.id, related: [p.id] });
  });

  it("the House tree: an amendment, an amendment to it, a substitute for the amendment and an amendment to the substitute (Rule XVI cl. 6 as quoted by CRS 98-613: \"it also shall be in order to offer a further amendment by way of substitute\"; CRS: the substitute \"is treated as a first-degree amendment\" and \"Like the original first-degree amendment, this one also is subject to second-degree amendments\")", async () => {
    const a = am("sec1", { status: "pending", filedAt: "2026-03-02T10:00:00Z" });
    const a2 = am(a.id, { status: "pending", filedAt: "2026-03-02T10:05:00Z" });
    const s = am(a.id, { form: "substitute", status: "pending", filedAt: "2026-03-02T10:10:00Z" });
    const s2 = am(s.id, { status: "pending", filedAt: "2026-03-02T10:15:00Z" });
    const { findings: fs, tree } = await validateTree({ rulebook: house, measure, amendments: [a, a2, s, s2] });
    expect(fs.filter((f) => f.severity === "error")).toEqual([]);
    expect([a, a2, s, s2].map((x) => tree.nodes[x.id].degree)).toEqual([1, 2, 1, 2]);
    expect(tree.nodes[s.id].role).toBe("substitute-for-amendment");
    // "It is not in order to offer more than one motion to amend of the same nature at a time (V, 5755; VIII, 2831)": a fifth is refused.
    const fifth = am(a.id, { status: "pending", filedAt: "2026-03-02T10:20:00Z" });
    expect(codes(await findings([a, a2, s, s2, fifth]), fifth.id)).toContain("slot-taken");
  });

  it("an amendment to an amendment to an amendment is a third degree and out of order (Rule XVI cl. 6: \"a motion to amend and a motion to amend that amendment shall be in order\", former Rule XIX)", async () => {
    const a = am("sec1");
    const b = am(a.id);
    const c = am(b.id);
    expect(codes(await findings([a, b, c]), c.id)).toEqual(["degree-exceeded"]);
  });

  it("germaneness is to the portion under consideration: an amendment on the bill's subject but not the section's is not germane (Rule XVI cl. 7; CRS 98-995: \"Members must offer their amendments to the appropriate part of a bill when it has been read or designated\")", async () => {
    const toAudit = am("sec2", { subjects: ["harbours"] });
    const toHarbours = am("sec1", { subjects: ["harbours"] });
    const fs = await findings([toAudit, toHarbours]);
    expect(codes(fs, toAudit.id)).toEqual(["not-germane"]);
    expect(codes(fs, toHarbours.id)).toEqual([]);
  });
});

describe("US House: the former id", () => {
  it("four-amendment-legislature names the us-house template (CLI, API and stored origins keep working)", () => {
    expect(canonicalTemplateId("four-amendment-legislature")).toBe("us-house");
    expect(rawTemplate("four-amendment-legislature").id).toBe("us-house");
    expect(canonicalTemplateId("us-house")).toBe("us-house");
  });
});
