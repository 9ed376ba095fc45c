// Every shipped template (rulebooks/*.json, scenario benches aside) drives the two halves of the
// product: the legal moves of a floor state and the analysis of an amendment tree. The verdicts
// checked here are the ones every Anglo-American and continental text agrees on; each template's own
// worked examples live in templates-*.test.ts with their sources.
//  - With a main motion pending, a second main motion is out of order: RONR 1915 §11 ("a main motion
//    … can be made only when no other question is pending", paraphrase); US House Rule XVI cl. 4(a)
//    and Senate Rule XXII cl. 1 list only subsidiary and privileged motions "when a question is under
//    debate" / "When a question is pending"; Westminster and the European Parliament take one
//    question at a time (common practice, no source).
//  - The analysis counts each legal order once: the sincere and sophisticated outcome counts each add up
//    to the number of legal orders (docs/sources.md §2, counting outcomes without listing orders).
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { legalMoves } from "../../../src/lib/procedure/legal-moves.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { templateIdOfFile } from "../../../src/lib/procedure/template-ids.ts";
import { analyseOrders } from "../../../src/lib/voting/analyse-orders.ts";

const DIR = join(import.meta.dirname, "../../../rulebooks");
const templates = readdirSync(DIR)
  .filter((f) => templateIdOfFile(f) !== null)
  .map((f) => ({ file: f, raw: JSON.parse(readFileSync(join(DIR, f), "utf8")) }));

const sum = (counts: Record<string, number | string>) => Object.values(counts).reduce((a: number, c) => a + Number(c), 0);

describe("every shipped template drives the floor and the analysis", () => {
  it("there are the five templates of the published texts and the demo chamber", () => {
    expect(templates.map((t) => t.raw.id).sort()).toEqual(["continental", "demo-chamber", "general-parliamentary-law", "us-house", "us-senate", "westminster"]);
  });

  for (const { file, raw } of templates) {
    it(`${file}: legal moves with a main motion pending, and an analysis of a two-amendment tree`, async () => {
      const rulebook = parseRulebook(raw);
      const main = rulebook.motions.find((m) => m.class === "main")!;
      expect(main).toBeDefined();
      const verdicts = await legalMoves(rulebook, { pending: [{ motion: main.id }] });
      expect(verdicts.map((v) => v.motion)).toEqual(rulebook.motions.map((m) => m.id));
      expect(verdicts.find((v) => v.motion === main.id)!.inOrder).toBe(false);
      for (const v of verdicts) if (!v.inOrder) expect(v.reasons.length).toBeGreaterThan(0);

      // Two first-degree amendments to two sections; every member present, so any quorum is met.
      const members = rulebook.chamber.members ?? 9;
      const w = Math.ceil(members / 3);
      const analysis = analyseOrders({
        rulebook: { voting: raw.voting, ...(raw.chamber ? { chamber: raw.chamber } : {}), motions: raw.motions },
        membership: members,
        measure: { id: "B", sections: [{ id: "s1", lines: 10 }, { id: "s2", lines: 10 }] },
        amendments: [
          { id: "A1", target: "s1", form: "strike-and-insert", lines: [2, 3] },
          { id: "A2", target: "s2", form: "strike-and-insert", lines: [4, 5] },
        ],
        profile: {
          ballots: [
            { ranking: ["B+A1", "B", "B+A1+A2", "B+A2", "Q"], weight: w },
            { ranking: ["B+A2", "B+A1+A2", "Q", "B", "B+A1"], weight: w },
            { ranking: ["Q", "B+A1+A2", "B+A1", "B+A2", "B"], weight: members - 2 * w },
          ],
        },
      });
      const orders = Number(analysis.orders);
      expect(orders).toBeGreaterThan(0);
      expect(sum(analysis.sincere)).toBe(orders);
      expect(sum(analysis.sophisticated)).toBe(orders);
      expect(analysis.quorum.met).not.toBe(false);
    });
  }
});
