// The two halves of the product must agree (issue 13 item 5): every voting order the engine lists is
// accepted, question by question, by the legal-moves function applied to the floor state at that point.
//
// Floor state (kept simple): the main motion, then the amendments that are pending, bottom to top. An
// amendment is moved when it (or something amending it) is first put, and stays pending until it is voted
// on or falls. A substitute for a first-degree amendment stands in that amendment's place on the stack
// while it and its amendments are dealt with (House Rule XVI cl. 6: "a further amendment by way of
// substitute"; CRS 98-613: "treated as a first-degree amendment"), the amendment staying pending beneath it.
// Moving an amendment must be in order (`amend` inOrder) at the degree the tree gives it (legal moves derives
// the degree from the stack, Robert's Rules of Order Revised 1915 §33); the question put is then
// immediately pending, and passage is put with nothing pending above the main motion.
// Rulebooks: the shipped general-parliamentary-law and four-amendment-legislature templates; the voting
// constraints are the ones this engine offers for them (House Rule XVI cl. 6; RONR 1915 §33 pp. 135–145).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { legalMoves } from "../../../src/lib/procedure/legal-moves.ts";
import type { Rulebook } from "../../../src/lib/procedure/rulebook-schema.ts";
import type { OrderConstraint } from "../../../src/lib/procedure/voting-section.ts";
import { amendmentTreeModel, type AmendmentTreeModel } from "../../../src/lib/voting/amendment-versions.ts";
import { countLegalOrders } from "../../../src/lib/voting/count-orders.ts";
import { legalOrderPage, legalOrders } from "../../../src/lib/voting/legal-orders.ts";
import type { MajorityGraph } from "../../../src/lib/voting/majority-graph.ts";
import { questionPrecedence } from "../../../src/lib/voting/order-constraints.ts";
import { questionAgenda } from "../../../src/lib/voting/question-agenda.ts";
import { template } from "../procedure/fixtures.ts";
import { randomTree } from "./tree-arbitrary.ts";

const BASE: OrderConstraint[] = ["secondary-before-primary", "perfecting-before-substitute", "passage-last", "primary-contiguous"];
const CONSTRAINT_SETS: OrderConstraint[][] = [BASE, [...BASE, "perfecting-after-rejected-substitute"], [...BASE, "textual-order"]];
const RULEBOOKS = ["general-parliamentary-law", "four-amendment-legislature"].map((id) => template(id));
const measure = { id: "B", sections: [{ id: "s1" }, { id: "s2" }, { id: "s3" }] };

/** Memoised `amend` verdict for a stack of `depth` pending amendments above the main motion. */
function amendVerdicts(rulebook: Rulebook) {
  const memo = new Map<number, Promise<{ inOrder: boolean; degree?: number }>>();
  return (depth: number) => {
    let v = memo.get(depth);
    if (!v) {
      const pending = [{ motion: "main" }, ...Array.from({ length: depth }, () => ({ motion: rulebook.amendments.motion }))];
      v = legalMoves(rulebook, { pending }).then((list) => list.find((m) => m.motion === rulebook.amendments.motion)!);
      memo.set(depth, v);
    }
    return v;
  };
}

/**
 * Replays one order with the given votes (adopt[i] for the i-th question put) and returns the first
 * disagreement with legal moves, or null.
 */
async function replay(model: AmendmentTreeModel, order: number[], adopt: boolean[], amend: (depth: number) => Promise<{ inOrder: boolean; degree?: number }>): Promise<string | null> {
  const k = model.amendments.length;
  const qa = questionAgenda(model, { beats: [] } as unknown as MajorityGraph, null, "amendment");
  const id = (x: number) => (x === k ? "passage" : model.amendments[x].id);
  let stack: number[] = [];
  let decided = 0;
  let adopted = 0;
  let put = 0;
  for (const x of order) {
    if (qa.falls(x, decided, adopted)) {
      stack = stack.filter((y) => y !== x);
      decided |= 1 << x;
      continue;
    }
    if (x === k) {
      if (stack.length) return `passage put while ${stack.map(id).join(", ")} pending`;
    } else {
      // Move what is not yet pending of x's line (its ancestors, then x), bottom first.
      const line = [...Array(k).keys()].filter((a) => model.ancestors[x] & (1 << a)).concat(x);
      for (const a of line) if (!stack.includes(a)) stack.push(a);
      // A substitute for a first-degree amendment stands in that amendment's place while it is on the stack.
      const shown = stack.filter((a) => !stack.some((s) => model.substituteFor[s] === a));
      for (let i = 0; i < shown.length; i++) {
        const v = await amend(i);
        if (!v.inOrder) return `moving ${id(shown[i])} on [${shown.slice(0, i).map(id).join(", ")}]: amend is out of order`;
        if (v.degree !== model.degree[shown[i]]) return `moving ${id(shown[i])} on [${shown.slice(0, i).map(id).join(", ")}]: legal moves gives degree ${v.degree}, the tree ${model.degree[shown[i]]}`;
      }
      if (shown[shown.length - 1] !== x) return `${id(x)} is not immediately pending`;
    }
    const yes = adopt[put++ % adopt.length];
    if (yes) adopted = qa.vote(x, adopted).yesState;
    decided |= 1 << x;
    stack = stack.filter((y) => y !== x);
  }
  return null;
}

/** Up to `limit` listed orders: the first page and pages from random ranks. */
function sampleOrders(model: AmendmentTreeModel, constraints: OrderConstraint[], ranks: number[]): number[][] {
  const prec = questionPrecedence(model, constraints);
  const total = Number(countLegalOrders(prec));
  const out = legalOrderPage(prec, 1, 10);
  for (const r of ranks) {
    let n = 0;
    for (const o of legalOrders(prec, BigInt(r % Math.max(total, 1)))) {
      out.push(o);
      if (++n === 3) break;
    }
  }
  return out;
}

// One memo per rulebook for the whole file: the verdict depends only on the stack.
const AMEND = RULEBOOKS.map(amendVerdicts);

describe("every listed order is legal move by move (legal-moves agrees with the voting engine)", () => {
  it("random trees of up to 10 amendments, both templates, every constraint set, random votes", async () => {
    await fc.assert(
      fc.asyncProperty(randomTree(1, 10), fc.array(fc.boolean(), { minLength: 1, maxLength: 12 }), fc.array(fc.nat(1_000_000), { minLength: 1, maxLength: 4 }), async (amendments, adopt, ranks) => {
        const model = amendmentTreeModel({ measure, amendments });
        for (const constraints of CONSTRAINT_SETS) {
          const orders = sampleOrders(model, constraints, ranks);
          expect(orders.length).toBeGreaterThan(0);
          for (const amend of AMEND) {
            for (const o of orders) for (const votes of [adopt, adopt.map((b) => !b)]) expect(await replay(model, o, votes, amend)).toBeNull();
          }
        }
      }),
      { numRuns: 60 },
    );
  });

  it("the check can fail: without primary-contiguous the engine lists A2 C A …, where legal moves would make C a second-degree amendment of A", async () => {
    // The review's F3 example (Robert's Parliamentary Practice 1922 ch. IV; RONR 1915 §33 p. 145).
    const model = amendmentTreeModel({
      measure,
      amendments: [
        { id: "A", target: "s1", form: "strike-and-insert", lines: [1, 3] },
        { id: "A2", target: "A", form: "insert" },
        { id: "C", target: "s2", form: "insert", lines: [4, 4] },
      ],
    });
    const prec = questionPrecedence(model, ["secondary-before-primary", "passage-last"]);
    const orders = [...legalOrders(prec)];
    const amend = AMEND[0];
    const verdicts = await Promise.all(orders.map((o) => replay(model, o, [false], amend)));
    const bad = orders.map((o, i) => [o.map((x) => ["A", "A2", "C", "passage"][x]).join(" "), verdicts[i]]).filter(([, v]) => v !== null);
    expect(bad).toEqual([["A2 C A passage", "moving C on [A]: legal moves gives degree 2, the tree 1"]]);
    // With the constraint, every order passes.
    const good = [...legalOrders(questionPrecedence(model, BASE))];
    for (const o of good) expect(await replay(model, o, [false], amend)).toBeNull();
  });
});
