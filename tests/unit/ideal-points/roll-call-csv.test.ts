// Recorded votes from CSV in both usual layouts, with row-precise errors (issue 19, items 1 and 3).
import { describe, expect, it } from "vitest";
import { parseRollCallCsv } from "../../../src/lib/ideal-points/roll-call-csv.ts";
import { isGavelError } from "../../../src/lib/errors.ts";

function issues(text: string) {
  try {
    parseRollCallCsv(text);
  } catch (e) {
    if (isGavelError(e)) return e.issues.map((i) => i.message);
    throw e;
  }
  throw new Error("expected an error");
}

describe("both layouts give the same votes", () => {
  const long = "member,vote,position,bloc\nAda Ferrell,RC 1,Yea,Harbour\nBo Quint,RC 1,nay,Upland\nAda Ferrell,RC 2,no,Harbour\nBo Quint,RC 2,present,Upland\n";
  const matrix = "Member,Bloc,RC 1,RC 2\nAda Ferrell,Harbour,Yea,no\nBo Quint,Upland,nay,present\n";
  it("one row per member per vote", () => {
    const r = parseRollCallCsv(long);
    expect(r.layout).toBe("long");
    expect(r.votes).toEqual([
      { id: "RC 1", yea: ["Ada Ferrell"], nay: ["Bo Quint"], notCounted: 0 },
      { id: "RC 2", yea: [], nay: ["Ada Ferrell"], notCounted: 1 },
    ]);
    expect(r.blocs).toEqual({ "Ada Ferrell": "Harbour", "Bo Quint": "Upland" });
  });
  it("a member × vote matrix (roll-call names keep their case)", () => {
    const r = parseRollCallCsv(matrix);
    expect(r.layout).toBe("matrix");
    expect({ ...r, layout: "long" }).toEqual(parseRollCallCsv(long));
  });
});

describe("row-precise errors", () => {
  it("an unknown position names row and column", () => {
    expect(issues("member,vote,position\nA,RC 1,yea\nB,RC 1,maybe\n")[0]).toMatch(/^row 3, column position: "maybe" is not a recorded position/);
    expect(issues("member,RC 1,RC 2\nA,yea,nay\nB,nay,perhaps\n")[0]).toMatch(/^row 3, column RC 2: "perhaps"/);
  });
  it("a member voting twice on one roll call, a member with two rows, a blank name", () => {
    expect(issues("member,vote,position\nA,RC 1,yea\nA,RC 1,nay\n")[0]).toBe("row 3, column position: A already has a position on RC 1 (row 2)");
    expect(issues("member,RC 1\nA,yea\nA,nay\n")[0]).toBe("row 3, column member: A has two rows");
    expect(issues("member,RC 1\n,yea\n")[0]).toBe("row 2, column member: name the member");
  });
  it("header problems", () => {
    expect(issues("name,RC 1\nA,yea\n")[0]).toMatch(/missing column "member"/);
    expect(issues("member,vote,position,colour\nA,1,yea\n")[0]).toMatch(/unknown column "colour"/);
    expect(issues("member,RC 1,RC 1\nA,yea,nay\n")[0]).toMatch(/"RC 1" has two columns/);
    expect(issues("member\nA\n")[0]).toMatch(/no vote columns/);
  });
});
