/**
 * Worked examples for the continental template (rulebooks/continental.json), taken from the text of
 * the Rules of Procedure of the European Parliament, 8th parliamentary term. The Rules are published
 * one rule per web page, without page numbers; each check names the rule, the paragraph and the text
 * read (the address is given once per rule). Quotations are the Rules' exact words; "paraphrase"
 * marks our wording.
 *  - Rule 170 (July 2018): europarl.europa.eu, RULES-EP 20180731, RULE-170
 *  - Rule 174 (March 2019): europarl.europa.eu/doceo/document/RULES-8-2019-03-25-RULE-174_EN.html
 *  - Rule 185 (February 2019, read in Swedish), Rule 189 (July 2018, read in Swedish)
 *  - Rule 157 of the 7th term (December 2009): europarl.europa.eu, RULES-EP 20091201, RULE-157
 */
import { describe, expect, it } from "vitest";
import type { AmendmentInput, MeasureInput } from "../../../src/lib/amendments/case-schema.ts";
import { validateTree } from "../../../src/lib/amendments/validate-tree.ts";
import { legalMoves, type MotionVerdict } from "../../../src/lib/procedure/legal-moves.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";
import { rawTemplate, template } from "./fixtures.ts";

const ep = template("continental");

async function moves(pending: Array<{ motion: string }>, floor?: Record<string, unknown>) {
  const list = await legalMoves(ep, { pending, floor });
  return Object.fromEntries(list.map((v) => [v.motion, v])) as Record<string, MotionVerdict>;
}
const TEXT = { motion: "main" };

const measure: MeasureInput = {
  id: "R",
  subjects: ["fisheries"],
  sections: [
    { id: "p1", subjects: ["fisheries", "quotas"], lines: 6 },
    { id: "p2", subjects: ["budget"], lines: 4 },
    { id: "p3", subjects: ["fisheries"], status: "struck" },
  ],
};
let n = 0;
const am = (target: string, extra: Partial<AmendmentInput> = {}): AmendmentInput => ({ id: `E${++n}`, target, form: "strike-and-insert", sponsors: ["Group X"], subjects: ["fisheries"], ...extra });
async function findings(amendments: AmendmentInput[]) {
  return (await validateTree({ rulebook: ep, measure, amendments })).findings;
}
const codes = (fs: Array<{ amendment: string; code: string }>, id: string) => fs.filter((f) => f.amendment === id).map((f) => f.code);

describe("continental template: admissibility (EP Rules of Procedure, 8th term, Rule 170, July 2018 text)", () => {
  it("Rule 170(1)(b) — \"it seeks to delete or replace the whole of a text\": a substitute for the whole text is inadmissible, a replacement of one paragraph is not", async () => {
    const whole = am("R", { form: "substitute" });
    const para = am("p1", { form: "substitute" });
    const fs = await findings([whole, para]);
    expect(codes(fs, whole.id)).toContain("whole-text");
    expect(codes(fs, para.id)).not.toContain("whole-text");
  });

  it("Rule 170(1)(b): deleting the whole text is inadmissible too", async () => {
    const del = am("R", { form: "strike" });
    expect(codes(await findings([del]), del.id)).toContain("whole-text");
  });

  it("Rule 170(1)(c) — \"it seeks to amend more than one of the individual articles or paragraphs\": an amendment tabled to the text as a whole is flagged for the President (compromise amendments are excepted)", async () => {
    const broad = am("R", { form: "insert" });
    const f = (await findings([broad])).find((x) => x.amendment === broad.id && x.code === "several-parts");
    expect(f?.severity).toBe("warning");
  });

  it("Rule 170(1)(a) — \"it does not directly relate to the text which it seeks to amend\": relation is judged against the paragraph amended", async () => {
    const off = am("p2", { subjects: ["fisheries"] });
    const on = am("p1", { subjects: ["quotas"] });
    const fs = await findings([off, on]);
    expect(codes(fs, off.id)).toEqual(["not-germane"]);
    expect(codes(fs, on.id)).toEqual([]);
  });

  it("7th term Rule 157(2) — \"An amendment shall fall if it is inconsistent with decisions previously taken on the text during the same vote\": an amendment to a part already struck falls (F25: cited from the admissibility rule)", async () => {
    const late = am("p3");
    const fs = await findings([late]);
    expect(codes(fs, late.id)).toContain("target-closed");
    expect(ep.rules.find((r) => r.id === "target-not-closed")?.citation).toContain("Rule 157(2)");
  });

  it("no written amendment to an amendment in plenary (from memory; French sous-amendements differ, F26): an amendment to an amendment exceeds the degree", async () => {
    const a = am("p1");
    const sub = am(a.id, { form: "insert" });
    expect(codes(await findings([a, sub]), sub.id)).toContain("degree-exceeded");
    expect(rawTemplate("continental").motions.find((m: { id: string }) => m.id === "amend").note).toMatch(/sous-amendements/);
  });
});

describe("continental template: order of voting (EP Rules of Procedure, 8th term, Rule 174, March 2019 text)", () => {
  const rulebook = rawTemplate("continental");
  const input = (extra: Record<string, unknown> = {}) => ({
    rulebook,
    measure: { id: "R", title: "Motion for a resolution", sections: [{ id: "p1" }, { id: "p2" }] },
    amendments: [
      { id: "FAR", target: "p1", form: "strike-and-insert", lines: [1, 3], distance: 3 },
      { id: "NEAR", target: "p1", form: "strike-and-insert", lines: [1, 3], distance: 1 },
    ],
    // Every member prefers the far wording to the near one and the near one to the unamended text.
    profile: { ballots: [{ ranking: ["R+FAR", "R+NEAR", "R", "Q"], weight: 300 }] },
    pageSize: 50,
    ...extra,
  });

  it("Rule 174(1) — \"Amendments shall have priority over the text to which they relate and shall be put to the vote before that text\": the text is put last in every legal order", () => {
    const a = analyseOrders(input());
    expect(a.page.orders.length).toBeGreaterThan(0);
    for (const o of a.page.orders) expect(o.questions.at(-1)).toBe("passage");
  });

  it("Rule 174(2)–(3): furthest first is one legal order, and the President's choice to put the closer amendment first is another — both are listed (F24)", () => {
    const a = analyseOrders(input());
    const orders = a.page.orders.map((o) => o.questions.join(" "));
    expect(orders).toEqual(expect.arrayContaining(["FAR NEAR passage", "NEAR FAR passage"]));
    expect(a.orders).toBe(2);
    expect(rulebook.voting.constraints).not.toContain("furthest-first");
  });

  it("Rule 174(2) — \"If it is adopted, the other amendments shall be deemed to have been rejected\": once the furthest amendment is adopted the other is not put", () => {
    const a = analyseOrders(input());
    const far = a.page.orders.find((o) => o.questions[0] === "FAR")!;
    const steps = Object.fromEntries(far.sincereSteps!.map((s) => [s.question, s]));
    expect(steps.FAR.adopted).toBe(true);
    expect(steps.NEAR.adopted).toBeUndefined();
  });
});

describe("continental template: procedural motions, majority, quorum (EP Rules of Procedure, 8th term)", () => {
  it("Rule 185(1), paraphrase: referral back, adjournment of the debate, closure and suspension of the sitting may be moved while the text is under debate", async () => {
    const m = await moves([TEXT]);
    for (const id of ["commit", "postpone-definitely", "previous-question", "recess", "adjourn", "amend"]) expect([id, m[id].inOrder]).toEqual([id, true]);
  });

  it("Rule 185(1), paraphrase: procedural motions have priority over other requests to speak — not over a speech in progress (our reading); a point of order is taken at once", async () => {
    const m = await moves([TEXT], { speakerHasFloor: true });
    expect(m.commit.inOrder).toBe(false);
    expect(m["point-of-order"].inOrder).toBe(true);
  });

  it("Rule 189(1), paraphrase: a proposal to close the debate is put to the vote at once (undebatable)", async () => {
    expect((await moves([TEXT]))["previous-question"].debatable).toBe(false);
  });

  it("no general-parliamentary-law motions are invented for this chamber (F21): no lay on the table, reconsider, rescind or two-thirds thresholds", () => {
    const ids = ep.motions.map((m) => m.id);
    for (const id of ["lay-on-table", "take-from-table", "reconsider", "rescind", "suspend-rules"]) expect(ids).not.toContain(id);
    expect(ep.motions.some((m) => m.vote === "two-thirds")).toBe(false);
  });

  it("TFEU art. 231 — \"the European Parliament shall act by a majority of the votes cast\": texts and amendments pass by a majority", () => {
    expect(ep.motions.find((m) => m.id === "main")?.vote).toBe("majority");
    expect(ep.voting.amendmentThreshold).toBe("majority");
  });

  it("quorum of one third of the component Members (6th term Rule 149; F22): an estimate with 250 of 751 attending gives no outcome, 251 does", () => {
    expect(ep.voting.quorum).toMatchObject({ kind: "fraction", numerator: 1, denominator: 3 });
    const run = (weight: number) =>
      analyseOrders({
        rulebook: rawTemplate("continental"),
        measure: { id: "R", title: "Motion for a resolution", sections: [{ id: "p1" }] },
        amendments: [{ id: "E1", target: "p1", form: "strike-and-insert", lines: [1, 2] }],
        profile: { ballots: [{ ranking: ["R+E1", "R", "Q"], weight }] },
      });
    expect(() => run(250)).toThrow(/quorum/);
    expect(run(251).quorum).toMatchObject({ met: true });
  });

  it("8th term Rule 179a(3) and last paragraph, paraphrase from the Italian text: a tie rejects the text or proposal; the President may vote but has no casting vote", () => {
    expect(ep.voting.tieRule).toBe("chair-votes");
    expect(ep.voting.passageThreshold).toBe("majority");
  });
});
