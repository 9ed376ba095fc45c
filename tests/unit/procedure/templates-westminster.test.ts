/**
 * Worked examples for the Westminster template (rulebooks/westminster.json), from the texts it cites.
 * Erskine May (25th edition) is published online by paragraph, without page numbers; the Standing
 * Orders of the House of Commons by order number. Quotations are exact; "paraphrase" marks our wording.
 *  - Erskine May 20.42 "Order of amendments and effect of earlier amendments" (erskinemay.parliament.uk/section/4781)
 *  - Erskine May 20.53 "The ordinary closure" (section/4792); 20.41 (section/4780); 20.89 "Casting vote of Speaker" (section/4829)
 *  - Standing Orders of the House of Commons 2002, Nos. 31 and 32
 *  - House of Commons, Short guide to procedure and practice (2001), "Closure"
 *  - Standing Orders of the Legislative Assembly of Victoria, SO 106; House of Representatives Practice (Australia), 6th ed., ch. 14, p. 480
 *  - Erskine May 20.59 "Quorum of the House" (section/4798)
 */
import { describe, expect, it } from "vitest";
import type { AmendmentInput, MeasureInput } from "../../../src/lib/amendments/case-schema.ts";
import { validateTree } from "../../../src/lib/amendments/validate-tree.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { rawTemplate, template } from "./fixtures.ts";

const wm = template("westminster");
async function moves(pending: Array<{ motion: string }>, floor?: Record<string, unknown>) {
  const list = await legalMoves(wm, { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}
const MOTION = { motion: "main" };

describe("Westminster template: closure and 'no longer heard' (Erskine May 20.53; Short guide 2001; Victoria SO 106)", () => {
  it("Short guide, 'Closure': the closure may be moved \"if necessary interrupting the Member speaking\"; an amendment or a dilatory motion may not", async () => {
    const m = await moves([MOTION], { speakerHasFloor: true });
    expect(m["previous-question"].inOrder).toBe(true);
    expect(m.amend.inOrder).toBe(false);
    expect(m["adjourn-debate"].inOrder).toBe(false);
  });

  it("Erskine May 20.53, paraphrase: the closure is put forthwith, without amendment or debate", async () => {
    const v = (await moves([MOTION]))["previous-question"];
    expect([v.debatable, v.amendable]).toEqual([false, false]);
  });

  it("Erskine May 20.53, paraphrase: the closure is moved after a question has been proposed — not with nothing before the House", async () => {
    expect((await moves([]))["previous-question"].inOrder).toBe(false);
  });

  it("House of Representatives Practice (Australia) ch. 14 p. 480 — SO 80 motion \"must be moved without comment and must be put immediately and resolved without amendment\"; Victoria SO 106: moved against a member who is speaking", async () => {
    expect((await moves([MOTION], { speakerHasFloor: true }))["member-no-longer-heard"].inOrder).toBe(true);
    const idle = (await moves([MOTION], { speakerHasFloor: false }))["member-no-longer-heard"];
    expect(idle.inOrder).toBe(false);
    expect([idle.debatable, idle.amendable]).toEqual([false, false]);
  });
});

describe("Westminster template: amendments (Erskine May 20.41, 20.42; Standing Orders 31, 32)", () => {
  it("Erskine May 20.41, paraphrase: amendments to a motion for the adjournment of the debate are out of order", async () => {
    expect((await moves([MOTION, { motion: "adjourn-debate" }])).amend.inOrder).toBe(false);
  });

  it("Erskine May 20.33, paraphrase: an amendment may be proposed to an amendment", async () => {
    const v = (await moves([MOTION, { motion: "amend" }])).amend;
    expect([v.inOrder, v.degree]).toEqual([true, 2]);
  });

  const measure: MeasureInput = {
    id: "M",
    subjects: ["harbours"],
    sections: [
      { id: "w1", subjects: ["harbours"], lines: 3 },
      { id: "w2", subjects: ["harbours"], lines: 3 },
      { id: "w3", subjects: ["harbours"], status: "adopted" },
    ],
  };
  let n = 0;
  const am = (target: string, extra: Partial<AmendmentInput> = {}): AmendmentInput => ({ id: `W${++n}`, target, form: "strike-and-insert", sponsors: ["A. Member"], subjects: ["harbours"], ...extra });
  const codes = (fs: Array<{ amendment: string; code: string }>, id: string) => fs.filter((f) => f.amendment === id).map((f) => f.code);

  it("Erskine May 20.42: \"no other amendment to the main question can be moved until the amendment under consideration has been disposed of\"", async () => {
    const first = am("w1", { status: "pending", filedAt: "2026-01-05T10:00:00Z" });
    const second = am("w1", { status: "pending", filedAt: "2026-01-05T10:05:00Z" });
    const fs = (await validateTree({ rulebook: wm, measure, amendments: [first, second] })).findings;
    expect(codes(fs, second.id)).toContain("slot-taken");
    expect(codes(fs, first.id)).not.toContain("slot-taken");
  });

  it("Erskine May 20.42, paraphrase: words already agreed to are not amended again", async () => {
    const late = am("w3");
    expect(codes((await validateTree({ rulebook: wm, measure, amendments: [late] })).findings, late.id)).toContain("target-closed");
  });

  it("SO 32(1): the Speaker \"shall have power to select the amendments … to be proposed\" — every amendment is flagged as subject to selection", async () => {
    const a = am("w2");
    const f = (await validateTree({ rulebook: wm, measure, amendments: [a] })).findings.find((x) => x.code === "needs-selection");
    expect(f?.severity).toBe("info");
  });

  it("Erskine May 20.42 — \"Each amendment should be proposed in the order in which, if agreed to, it would stand in the amended question\": amendments to a later part are never put before those to an earlier part", () => {
    const a = analyseOrders({
      rulebook: rawTemplate("westminster"),
      measure: { id: "M", title: "Motion", sections: [{ id: "w1" }, { id: "w2" }] },
      amendments: [
        { id: "LATER", target: "w2", form: "insert" },
        { id: "EARLIER", target: "w1", form: "insert" },
      ],
      profile: { ballots: [{ ranking: ["M+LATER+EARLIER", "M+EARLIER", "M+LATER", "M", "Q"], weight: 60 }] },
      pageSize: 20,
    });
    expect(a.page.orders.map((o) => o.questions.join(" "))).toEqual(["EARLIER LATER passage"]);
  });

  it("SO 31(2)(a) (2002): \"That the original words stand part of the question\", then \"That the proposed words be there inserted (or added)\" — a leave-out-and-insert amendment is flagged as a two-part question; an insertion is not", async () => {
    const swap = am("w1", { form: "strike-and-insert" });
    const add = am("w2", { form: "insert" });
    const fs = (await validateTree({ rulebook: wm, measure, amendments: [swap, add] })).findings;
    expect(fs.find((f) => f.amendment === swap.id && f.code === "two-part-question")?.severity).toBe("info");
    expect(codes(fs, add.id)).not.toContain("two-part-question");
  });

  it("SO 31 (2002): the question on an amendment is \"That the amendment be made\" — one question per amendment; the two-part 'stand part' form is listed for the clerk to verify", () => {
    const raw = rawTemplate("westminster");
    expect(raw.source.verify.some((v: string) => /two-part/i.test(v))).toBe(true);
    expect(raw.motions.find((m: { id: string }) => m.id === "amend").note).toMatch(/stand part of the question/);
  });
});

describe("Westminster template: seconders, casting vote, quorum", () => {
  it("Erskine May 20.12, paraphrase: a question decided in the session may not be brought forward again — no motion to reconsider, and no vote is reconsiderable", () => {
    expect(wm.motions.map((m) => m.id)).not.toContain("reconsider");
    expect(new Set(wm.motions.map((m) => m.reconsiderable))).toEqual(new Set(["neither"]));
  });

  it("Halsbury's Laws para. 767, paraphrase: in the Commons no motion or amendment needs a seconder", () => {
    expect(wm.motions.filter((m) => m.second)).toEqual([]);
  });

  it("Erskine May 20.89 — \"If the numbers in a division are equal, the Speaker must give the casting vote\": 25 to 25 on an amendment is decided by the chair's ballot", () => {
    expect(wm.voting.tieRule).toBe("chair-casting-vote");
    const tie = (chairFor: boolean) =>
      analyseOrders({
        rulebook: rawTemplate("westminster"),
        measure: { id: "M", title: "Motion", sections: [{ id: "w1" }] },
        amendments: [{ id: "A", target: "w1", form: "insert" }],
        profile: { ballots: [
          { ranking: ["M+A", "M", "Q"], weight: 25 },
          { ranking: ["M", "M+A", "Q"], weight: 25 },
          { ranking: chairFor ? ["M+A", "M", "Q"] : ["M", "M+A", "Q"], weight: 1, chair: true },
        ] },
      }).page.orders[0]!.sincereSteps!.find((x) => x.question === "A")!.adopted;
    expect(tie(true)).toBe(true);
    // Speaker Denison's convention (against the change where no further discussion is possible): the chair's ballot against the amendment.
    expect(tie(false)).toBe(false);
  });

  it("Erskine May 20.59: \"Forty Members, including the Speaker, form the quorum of the House\" (SO No. 41: a division with fewer than forty leaves the business to stand over)", () => {
    expect(wm.voting.quorum).toMatchObject({ kind: "number", value: 40 });
  });
});
