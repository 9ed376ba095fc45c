/**
 * Legal moves without a quorum (issue 13 item 4; procedure review F29). Robert's Rules of Order Revised
 * (1915) §64 pp. 259–260, paraphrase: without a quorum the assembly may only take measures to obtain a
 * quorum, fix the time to which to adjourn, adjourn, or take a recess; p. 260 (djvu/266), exact words:
 * "no question can be decided in the absence of a quorum excepting those mentioned above".
 * The verdict comes from the template's `no-quorum` rule over the floor fact `quorumPresent` and the
 * motion fact `withoutQuorum` (voting.quorum.withoutQuorum), not from code (decision 0004).
 */
import { describe, expect, it } from "vitest";
import { GavelError } from "../../../src/lib/errors.ts";
import { legalMoves } from "../../../src/lib/procedure/legal-moves.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { rawTemplate, template } from "./fixtures.ts";

const RONR_WITHOUT_QUORUM = ["adjourn", "fix-time-to-adjourn", "recess"];

describe("no quorum present (RONR 1915 §64)", () => {
  for (const id of ["general-parliamentary-law", "demo-chamber"]) {
    it(`${id}: with a question pending and no quorum, only adjourn, fix the time to which to adjourn and recess remain in order`, async () => {
      const rb = template(id);
      const pending = [{ motion: "main" }];
      const without = await legalMoves(rb, { pending, floor: { quorumPresent: false } });
      const inOrder = without.filter((v) => v.inOrder).map((v) => v.motion);
      expect(inOrder.length).toBeGreaterThan(0);
      for (const m of inOrder) expect(RONR_WITHOUT_QUORUM).toContain(m);
      const amend = without.find((v) => v.motion === "amend")!;
      expect(amend.inOrder).toBe(false);
      expect(amend.reasons.map((r) => r.rule)).toContain("no-quorum");
      // With a quorum (the default) the same floor has amend in order, and no verdict cites the quorum rule.
      const withQuorum = await legalMoves(rb, { pending });
      expect(withQuorum.find((v) => v.motion === "amend")!.inOrder).toBe(true);
      expect(withQuorum.flatMap((v) => v.reasons.map((r) => r.rule))).not.toContain("no-quorum");
    });
  }
  it("with nothing pending and no quorum, a main motion is out of order and adjourn is in order", async () => {
    const v = await legalMoves(template("general-parliamentary-law"), { pending: [], floor: { quorumPresent: false } });
    expect(v.find((x) => x.motion === "main")!.inOrder).toBe(false);
    expect(v.find((x) => x.motion === "adjourn")!.inOrder).toBe(true);
  });
  it("withoutQuorum must name catalogue motions, at its exact path", () => {
    const raw = rawTemplate("general-parliamentary-law");
    raw.voting.quorum.withoutQuorum = ["adjourn", "call-of-the-house"];
    try {
      parseRulebook(raw);
      throw new Error("expected a GavelError");
    } catch (e) {
      expect(e).toBeInstanceOf(GavelError);
      expect((e as GavelError).issues.map((i) => i.path)).toContain("voting.quorum.withoutQuorum.1");
    }
  });
  it("a rulebook without the rule is unaffected by quorumPresent (a rulebook saved earlier still gives the same verdicts)", async () => {
    const rb = template("continental-successive");
    const a = await legalMoves(rb, { pending: [{ motion: "main" }] });
    const b = await legalMoves(rb, { pending: [{ motion: "main" }], floor: { quorumPresent: false } });
    expect(b.map((v) => v.inOrder)).toEqual(a.map((v) => v.inOrder));
  });
});
