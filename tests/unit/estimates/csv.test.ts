// CSV parsing of ballots and ideal points: row-precise errors, encodings, round trip of the template.
// The CSV dialect is RFC 4180 (common practice); the ranking syntax is the product's own (no source).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { isGavelError } from "../../../src/lib/errors.ts";
import { decodeCsv } from "../../../src/lib/estimates/csv-text.ts";
import { parseBallotCsv, parseRankingText, rankingText } from "../../../src/lib/estimates/ballot-csv.ts";
import { parseIdealCsv } from "../../../src/lib/estimates/ideal-csv.ts";
import { ballotTemplate, idealTemplate } from "../../../src/lib/estimates/csv-template.ts";

const V = ["Q", "M", "M+A1", "M+A7"];

function issuesOf(f: () => unknown): Array<{ path: string; message: string }> {
  try {
    f();
  } catch (e) {
    if (isGavelError(e)) return e.issues;
    throw e;
  }
  throw new Error("expected a GavelError");
}

describe("invalid input", () => {
  it("refuses a file that is not UTF-8, and binary data", () => {
    expect(() => decodeCsv(new Uint8Array([0x61, 0xe9, 0x0a]))).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => decodeCsv(new Uint8Array([0x61, 0x00, 0x62]))).toThrow(expect.objectContaining({ code: "invalid-input" }));
    expect(() => decodeCsv(new Uint8Array(600 * 1024))).toThrow(expect.objectContaining({ code: "too-large" }));
  });

  it("refuses wrong columns: missing, unknown, repeated", () => {
    expect(issuesOf(() => parseBallotCsv("member,weight\nA,1\n", V))[0].path).toBe("header");
    expect(issuesOf(() => parseBallotCsv("member,ranking,colour\nA,Q,red\n", V))[0].path).toBe("header.2");
    expect(issuesOf(() => parseBallotCsv("member,ranking,ranking\nA,Q,Q\n", V))[0].path).toBe("header");
  });

  it("names the spreadsheet row and the column of each bad cell", () => {
    const text = ["member,weight,ranking", "a,1,Q", "b,1,Q", "c,1,Q", "d,1,Q", "e,1,Q", "f,1,M > B+Z"].join("\n");
    const issues = issuesOf(() => parseBallotCsv(text, V));
    expect(issues).toEqual([{ path: "rows.7.ranking", message: expect.stringContaining("row 7, column ranking") }]);
    expect(issues[0].message).toContain("B+Z");
    const many = issuesOf(() => parseBallotCsv("member,weight,ranking\n,0,Q > Q\nx,2,M >> Q\n", V));
    expect(many.map((i) => i.path)).toEqual(["rows.2.member", "rows.2.weight", "rows.2.ranking", "rows.3.ranking"]);
  });

  it("refuses a row with more cells than the header", () => {
    expect(issuesOf(() => parseBallotCsv("member,ranking\nA,Q,M\n", V))[0].path).toBe("rows.2");
  });

  it("refuses bad coordinates in ideal points", () => {
    const issues = issuesOf(() => parseIdealCsv("member,x,y\nA,1,2\nB,1,2,5\n", ["x", "y"]));
    expect(issues[0].path).toBe("rows.3");
    expect(issuesOf(() => parseIdealCsv("member,x,y\nA,1,1e3\nB,,2\n", ["x", "y"])).map((i) => i.path)).toEqual(["rows.2.y", "rows.3.x"]);
  });
});

describe("edge cases", () => {
  it("drops a byte-order mark and accepts CRLF, quotes and blank weights", () => {
    const bytes = new TextEncoder().encode('\ufeffmember,bloc,weight,ranking\r\n"Fenwright, Odile",MU,,M = Q > M+A1\r\n');
    const rows = parseBallotCsv(decodeCsv(bytes), V);
    expect(rows).toEqual([{ member: "Fenwright, Odile", bloc: "MU", weight: 1, ranking: [["M", "Q"], "M+A1"] }]);
  });

  it("reads header names case-insensitively", () => {
    expect(parseIdealCsv("Member,Weight,Cost,Reach\nA,2,-1.5,.5\n", ["Cost", "Reach"])).toEqual([{ member: "A", bloc: "", weight: 2, ideal: [-1.5, 0.5] }]);
  });

  it("round-trips ranking text", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.constantFrom(...V), { minLength: 1, maxLength: 2 }), { minLength: 1, maxLength: 4 }), (levels) => {
        const ranking = levels.map((l) => (l.length === 1 ? l[0] : l));
        expect(parseRankingText(rankingText(ranking))).toEqual({ ranking });
      }),
      { numRuns: 200 },
    );
  });
});

describe("templates", () => {
  it("a ballot template parses back: one row per bloc weighted by its size", () => {
    const roster = [{ name: "A", bloc: "North" }, { name: "B", bloc: "North" }, { name: "C", bloc: "South" }];
    const rows = parseBallotCsv(ballotTemplate(V, roster), V);
    expect(rows.map((r) => [r.member, r.weight])).toEqual([["North", 2], ["South", 1]]);
    expect(rows[0].ranking).toEqual(V);
    expect(parseBallotCsv(ballotTemplate(V, roster, true), V)).toHaveLength(3);
  });

  it("an ideal-point template parses back with one coordinate per dimension", () => {
    const rows = parseIdealCsv(idealTemplate(["Cost", "Reach"], [{ name: "A", bloc: "N" }]), ["Cost", "Reach"]);
    expect(rows).toEqual([{ member: "A", bloc: "N", weight: 1, ideal: [0, 0] }]);
  });
});
