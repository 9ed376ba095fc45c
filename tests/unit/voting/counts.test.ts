import { describe, expect, it } from "vitest";
import { countToJson } from "../../../src/lib/voting/count-json.ts";
import { countLegalOrders } from "../../../src/lib/voting/count-orders.ts";
import { precedence } from "../../../src/lib/voting/precedence.ts";

describe("exact counts at the JSON edge (issue contract: numbers below 2^53, decimal strings above)", () => {
  it("invalid: more than 30 items is limit-exceeded", () => {
    expect(() => precedence(31, [])).toThrow(expect.objectContaining({ code: "limit-exceeded" }));
  });
  it("2^53 − 1 stays a number, 2^53 becomes a string", () => {
    expect(countToJson(9007199254740991n)).toBe(9007199254740991);
    expect(countToJson(9007199254740992n)).toBe("9007199254740992");
    expect(countToJson(24)).toBe(24);
  });
  it("30 questions in 6 independent chains of 5: 30!/(5!)^6 orders, counted in BigInt (common practice, no source: multinomial)", () => {
    const before: Array<[number, number]> = [];
    for (let c = 0; c < 6; c++) for (let i = 0; i < 4; i++) before.push([c * 5 + i, c * 5 + i + 1]);
    let fact = 1n;
    for (let i = 2n; i <= 30n; i++) fact *= i;
    const expected = fact / 120n ** 6n;
    const count = countLegalOrders(precedence(30, before));
    expect(count).toBe(expected);
    expect(countToJson(count)).toBe(expected.toString());
  });
});
