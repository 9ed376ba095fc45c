import { describe, expect, it } from "vitest";
import type { AmendmentInput, MeasureInput } from "../../../src/lib/amendments/case-schema.ts";
import { validateTree, type Finding } from "../../../src/lib/amendments/validate-tree.ts";
import { GavelError } from "../../../src/lib/errors.ts";
import { parseRulebook } from "../../../src/lib/procedure/parse-rulebook.ts";
import { rawTemplate, template } from "../procedure/fixtures.ts";

const gpl = template("general-parliamentary-law");
const house = template("four-amendment-legislature");
const continental = template("continental");
const demo = template("demo-chamber");

const measure: MeasureInput = {
  id: "HB-12",
  subjects: ["water"],
  committee: "Public Works",
  sections: [
    { id: "s1", subjects: ["water", "rates"], lines: 20 },
    { id: "s2", subjects: ["audit"], lines: 10 },
    { id: "s3", subjects: ["water"], status: "struck" },
  ],
};

let n = 0;
function am(target: string, extra: Partial<AmendmentInput> = {}): AmendmentInput {
  return { id: `A${++n}`, target, form: "insert", sponsors: ["M. Okafor", "R. Lindqvist"], subjects: ["water"], ...extra };
}

async function check(rulebook = gpl, amendments: AmendmentInput[], extra: Record<string, unknown> = {}) {
  return (await validateTree({ rulebook, measure, amendments, ...extra })).findings;
}
const codes = (fs: Finding[], id: string) => fs.filter((f) => f.amendment === id).map((f) => f.code);

async function errorOf(p: Promise<unknown>): Promise<GavelError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof GavelError) return e;
    throw e;
  }
  throw new Error("expected a GavelError");
}

describe("validateTree: malformed input", () => {
  it("rejects a missing measure and a bad form, naming the paths", async () => {
    const e = await errorOf(validateTree({ rulebook: gpl, amendments: [{ id: "A1", target: "x", form: "rewrite" }] }));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toEqual(expect.arrayContaining(["measure", "amendments.0.form"]));
  });

  it("rejects duplicate amendment ids and ids that collide with a section", async () => {
    const e = await errorOf(validateTree({ rulebook: gpl, measure, amendments: [{ id: "A1", target: "s1", form: "insert" }, { id: "A1", target: "s1", form: "strike" }, { id: "s2", target: "s1", form: "insert" }] }));
    expect(e.code).toBe("invalid-input");
    expect(e.issues.map((i) => i.path)).toEqual(["amendments.1.id", "amendments.2.id"]);
  });

  it("rejects a bad filing time, a bad asOf and an override of an unknown amendment", async () => {
    const a = am("s1", { filedAt: "yesterday" });
    expect((await errorOf(validateTree({ rulebook: gpl, measure, amendments: [a] }))).issues[0].path).toBe("amendments.0.filedAt");
    expect((await errorOf(validateTree({ rulebook: gpl, measure, amendments: [], asOf: "soon" }))).issues[0].path).toBe("asOf");
    const o = await errorOf(validateTree({ rulebook: gpl, measure, amendments: [], overrides: [{ code: "cycle", amendment: "A404", ruling: "R1" }] }));
    expect(o.issues[0].path).toBe("overrides.0.amendment");
  });
});

describe("validateTree: malformed trees are reported as errors", () => {
  it("a self-target is a cycle", async () => {
    const a = am("x");
    a.target = a.id;
    const fs = await check(gpl, [a]);
    expect(fs.find((f) => f.code === "cycle")).toMatchObject({ severity: "error", amendment: a.id, related: [a.id] });
  });

  it("a cycle of targets flags each member, and amendments hanging from it", async () => {
    const a = am("x");
    const b = am(a.id);
    a.target = b.id;
    const c = am(a.id);
    const fs = await check(gpl, [a, b, c]);
    expect(codes(fs, a.id)).toContain("cycle");
    expect(codes(fs, b.id)).toContain("cycle");
    expect(fs.find((f) => f.amendment === c.id && f.code === "cycle")?.severity).toBe("warning");
  });

  it("a missing target is target-missing", async () => {
    const a = am("s9");
    expect(codes(await check(gpl, [a]), a.id)).toEqual(["target-missing"]);
  });

  it("structural faults are reported even when the rulebook has no rule for them (common practice, no source)", async () => {
    const bare = { ...gpl, rules: [] };
    const a = am("s9");
    const b = am("x");
    b.target = b.id;
    const fs = await check(bare, [a, b]);
    expect(fs.map((f) => [f.amendment, f.code, f.rule])).toEqual([
      [a.id, "target-missing", "tree-structure"],
      [b.id, "cycle", "tree-structure"],
    ]);
  });
});

describe("general parliamentary law (Robert's Rules of Order Revised, 1915)", () => {
  it("a clean tree of a primary and a secondary amendment, both pending, has no findings (§33)", async () => {
    const a = am("s1", { status: "pending" });
    const b = am(a.id, { status: "pending" });
    expect(await check(gpl, [a, b])).toEqual([]);
  });

  it("a third-degree amendment is out of order (§33)", async () => {
    const a = am("s1");
    const b = am(a.id);
    const c = am(b.id);
    const fs = await check(gpl, [a, b, c]);
    expect(codes(fs, c.id)).toEqual(["degree-exceeded"]);
    expect(fs[0].citation).toContain("§33");
  });

  it("at most one primary amendment may be pending (§33)", async () => {
    const a = am("s1", { status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const b = am("s2", { status: "pending", filedAt: "2025-03-01T10:00:00Z" });
    const fs = await check(gpl, [b, a]);
    expect(codes(fs, b.id)).toEqual(["slot-taken"]);
    expect(codes(fs, a.id)).toEqual([]);
  });

  it("at most one secondary amendment may be pending on the primary (§33)", async () => {
    const a = am("s1", { status: "pending" });
    const b = am(a.id, { status: "pending" });
    const c = am(a.id, { status: "pending" });
    const fs = await check(gpl, [a, b, c]);
    expect(codes(fs, c.id)).toContain("slot-taken");
    expect(codes(fs, b.id)).not.toContain("slot-taken");
  });

  it("amendments merely filed wait their turn: no slot is taken (§33: one pending at a time)", async () => {
    expect(await check(gpl, [am("s1"), am("s2")])).toEqual([]);
  });

  it("a substitute is voted after the text it replaces is perfected (§33)", async () => {
    const p = am("s1", { lines: [2, 3] });
    const s = am("HB-12", { form: "substitute" });
    const f = (await check(gpl, [p, s])).find((x) => x.code === "voted-after-perfecting");
    expect(f).toMatchObject({ amendment: s.id, severity: "info", related: [p.id] });
  });

  it("an amendment on a different subject is not germane; one without tags needs a ruling (§33)", async () => {
    const a = am("s1", { subjects: ["parking"] });
    const b = am("s2", { subjects: [] });
    const fs = await check(gpl, [a, b]);
    expect(codes(fs, a.id)).toEqual(["not-germane"]);
    expect(codes(fs, b.id)).toEqual(["needs-ruling"]);
  });

  it("a secondary amendment must be germane to the primary it amends (§33)", async () => {
    const a = am("s1", { subjects: ["rates"] });
    const b = am(a.id, { subjects: ["water"] });
    expect(codes(await check(gpl, [a, b]), b.id)).toEqual(["not-germane"]);
  });

  it("text already struck cannot be amended (§33)", async () => {
    const a = am("s3");
    expect(codes(await check(gpl, [a]), a.id)).toEqual(["target-closed"]);
  });

  it("amendments changing the same lines conflict (common practice, no source)", async () => {
    const a = am("s1", { form: "strike", lines: [2, 4] });
    const b = am("s1", { lines: [4, 5] });
    const c = am("s1", { lines: [9, 9] });
    const fs = await check(gpl, [a, b, c]);
    expect(fs.find((f) => f.amendment === a.id)).toMatchObject({ code: "conflicts-with", related: [b.id] });
    expect(codes(fs, c.id)).toEqual([]);
  });

  it("an override marks the finding and keeps it", async () => {
    const a = am("s1", { subjects: ["parking"] });
    const fs = await check(gpl, [a], { overrides: [{ code: "not-germane", amendment: a.id, ruling: "ruling-2025-04" }] });
    expect(fs).toEqual([expect.objectContaining({ code: "not-germane", overridden: true, ruling: "ruling-2025-04" })]);
  });
});

describe("four-amendment tree (US House Rule XVI cl. 6)", () => {
  // The ordinary House tree: A amends a section, A2 amends A, S is a substitute FOR A, S2 amends S.
  // House Rule XVI cl. 6, as quoted by CRS Report 98-613 (Amendments in the House: Types and Forms, 2008,
  // "Degrees of Amendments"): "it also shall be in order to offer a further amendment by way of substitute."
  // CRS 98-613: "Such a substitute is treated as a first-degree amendment, presumably because it is offered in
  // the form of an alternative to the original first-degree amendment rather than an amendment to it. Like the
  // original first-degree amendment, this one also is subject to second-degree amendments."
  // RONR (1915) §33 p. 135 n. 1, quoting the House rule of its day (H. R. Rule 19): "a motion to amend and a
  // motion to amend that amendment shall be in order, and it shall also be in order to offer a further
  // amendment by way of substitute, to which one amendment may be offered, but which shall not be voted on
  // until the original matter is perfected".
  const tree = () => {
    const a = am("s1", { status: "pending" });
    const a2 = am(a.id, { status: "pending" });
    const s = am(a.id, { form: "substitute", status: "pending" });
    const s2 = am(s.id, { status: "pending" });
    return [a, a2, s, s2];
  };

  it("an amendment, an amendment to it, a substitute for the amendment and an amendment to the substitute may all be pending", async () => {
    const rows = tree();
    const { findings, tree: t } = await validateTree({ rulebook: house, measure, amendments: rows });
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    // CRS 98-613: the substitute "is treated as a first-degree amendment" and "is subject to second-degree amendments".
    expect(rows.map((r) => t.nodes[r.id].degree)).toEqual([1, 2, 1, 2]);
    expect(rows.map((r) => t.nodes[r.id].role)).toEqual(["perfecting", "amendment-to-amendment", "substitute-for-amendment", "amendment-to-amendment"]);
    expect(new Set(rows.map((r) => t.nodes[r.id].slot)).size).toBe(4);
  });

  it("a fifth pending amendment exceeds the tree", async () => {
    const rows = tree();
    const fifth = am(rows[0].id, { status: "pending" });
    const fs = await check(house, [...rows, fifth]);
    expect(codes(fs, fifth.id)).toContain("slot-taken");
    expect(fs.filter((f) => f.code === "slot-taken").map((f) => f.amendment)).toEqual([fifth.id]);
  });

  it("a second substitute for the same amendment, or a second amendment to the substitute, takes a place already taken", async () => {
    const rows = tree();
    const sub2 = am(rows[0].id, { form: "substitute", status: "pending" });
    expect(codes(await check(house, [...rows, sub2]), sub2.id)).toContain("slot-taken");
    const rows2 = tree();
    const s3 = am(rows2[2].id, { status: "pending" });
    expect(codes(await check(house, [...rows2, s3]), s3.id)).toContain("slot-taken");
  });

  it("an amendment to the amendment to the substitute is of the third degree (CRS 98-613: the process \"is limited to two degrees\")", async () => {
    const rows = tree();
    const s3 = am(rows[3].id);
    expect(codes(await check(house, [...rows, s3]), s3.id)).toEqual(["degree-exceeded"]);
  });

  it("the substitute is voted after the amendment it would replace is perfected (the House rule as quoted in RONR 1915 §33 p. 135 n. 1: \"shall not be voted on until the original matter is perfected\")", async () => {
    const rows = tree();
    expect((await check(house, rows)).find((f) => f.code === "voted-after-perfecting")).toMatchObject({ amendment: rows[2].id, related: [rows[1].id] });
  });

  it("the substitute-for-the-bill variant: an amendment in the nature of a substitute for the bill beside perfecting amendments to the text (Deschler's Precedents ch. 27 §25)", async () => {
    // Deschler's Precedents vol. 9 ch. 27 §25 p. 7099: "An amendment in the nature of a substitute for a bill may be
    // proposed before perfecting amendments to the pending portion of the original text have been offered, but may
    // not be voted on until after such perfecting amendments have been disposed of."
    const n = am("HB-12", { form: "in-nature-of-substitute", status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const n2 = am(n.id, { status: "pending", filedAt: "2025-03-01T09:10:00Z" });
    const p = am("s1", { status: "pending", filedAt: "2025-03-01T09:20:00Z" });
    const p2 = am(p.id, { status: "pending", filedAt: "2025-03-01T09:30:00Z" });
    const { findings, tree: t } = await validateTree({ rulebook: house, measure, amendments: [n, n2, p, p2] });
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    expect([n, n2, p, p2].map((r) => t.nodes[r.id].degree)).toEqual([1, 2, 1, 2]);
    expect(findings.find((f) => f.code === "voted-after-perfecting")).toMatchObject({ amendment: n.id, related: [p.id] });
  });

  it("a third degree is out of order, and a different subject is not germane (Rule XVI cl. 6, cl. 7)", async () => {
    const a = am("s1");
    const b = am(a.id);
    const c = am(b.id);
    const d = am("s2", { subjects: ["fisheries"] });
    const fs = await check(house, [a, b, c, d]);
    expect(codes(fs, c.id)).toEqual(["degree-exceeded"]);
    expect(codes(fs, d.id)).toEqual(["not-germane"]);
  });
});

describe("general parliamentary law: perfecting the text while a substitute is pending (RONR 1915 §33 pp. 140-142)", () => {
  // RONR (1915) §33 p. 140: "A motion to insert (or add) or to strike out a paragraph, or to substitute one paragraph
  // for another, is an amendment of the first degree, and therefore cannot be made when an amendment is pending."
  // p. 142: the chair first asks for amendments to the paragraph "to be struck out, these amendments being of the
  // second degree. After it is perfected by its friends, the chair asks if there are any amendments proposed to the
  // paragraph to be inserted."
  // p. 135: "While there can be only one amendment of each degree pending at the same time, any number of them may be
  // offered in succession." and "An amendment of the third degree would be too complicated and is not in order."
  const subFirst = () => {
    const s = am("s1", { form: "substitute", status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const p = am("s1", { form: "strike-and-insert", lines: [2, 3], status: "pending", filedAt: "2025-03-01T09:10:00Z" });
    return { s, p };
  };

  it("a perfecting amendment to the paragraph to be struck out, made while the substitute is pending, is a legal second-degree amendment (F1)", async () => {
    const { s, p } = subFirst();
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [s, p] });
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    expect(t.nodes[p.id]).toMatchObject({ degree: 2, role: "perfecting-under-substitute", underSubstitute: s.id, slot: s.id });
    expect(t.nodes[s.id]).toMatchObject({ degree: 1, role: "substitute" });
  });

  it("the same holds for a substitute for the whole measure and an amendment to one of its sections", async () => {
    const s = am("HB-12", { form: "substitute", status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const p = am("s1", { lines: [2, 3], status: "pending", filedAt: "2025-03-01T09:10:00Z" });
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [s, p] });
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
    expect(t.nodes[p.id].degree).toBe(2);
  });

  it("an amendment to that perfecting amendment is of the third degree and out of order (F1)", async () => {
    const { s, p } = subFirst();
    const p2 = am(p.id, { status: "pending", filedAt: "2025-03-01T09:20:00Z" });
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [s, p, p2] });
    expect(t.nodes[p2.id].degree).toBe(3);
    expect(codes(findings, p2.id)).toContain("degree-exceeded");
    expect(findings.filter((f) => f.amendment === p.id && f.severity === "error")).toEqual([]);
  });

  it("the perfecting amendment and an amendment to the substitute are both of the second degree: one pending at a time (p. 135, p. 142)", async () => {
    const { s, p } = subFirst();
    const s2 = am(s.id, { status: "pending", filedAt: "2025-03-01T09:20:00Z" });
    const fs = await check(gpl, [s, p, s2]);
    expect(codes(fs, s2.id)).toContain("slot-taken");
    expect(codes(fs, p.id)).not.toContain("slot-taken");
  });

  it("a substitute made while a perfecting amendment is pending is the second first-degree amendment: out of order (p. 140)", async () => {
    const p = am("s1", { lines: [2, 3], status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const s = am("s1", { form: "substitute", status: "pending", filedAt: "2025-03-01T09:10:00Z" });
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [p, s] });
    expect(codes(findings, s.id)).toContain("slot-taken");
    expect(findings.filter((f) => f.amendment === p.id && f.severity === "error")).toEqual([]);
    expect(t.nodes[p.id]).toMatchObject({ degree: 1, role: "perfecting" });
  });

  it("amendments merely filed keep the degree they will have when offered after the substitute is disposed of (p. 142: after a lost substitute the retained paragraph may \"be further amended\")", async () => {
    const { s } = subFirst();
    const p = am("s1", { lines: [2, 3] });
    const p2 = am(p.id);
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [s, p, p2] });
    expect([t.nodes[p.id].degree, t.nodes[p2.id].degree]).toEqual([1, 2]);
    expect(findings.filter((f) => f.code === "degree-exceeded")).toEqual([]);
  });

  it("the House tree's four pending amendments overflow a general-parliamentary-law tree: A2 is third degree, and A and S2 compete for the one second-degree place (T2)", async () => {
    // Substitute for the bill made first, then A (to s1) and A2 (to A), then S2 (to the substitute).
    const s = am("HB-12", { form: "substitute", status: "pending", filedAt: "2025-03-01T09:00:00Z" });
    const a = am("s1", { status: "pending", filedAt: "2025-03-01T09:10:00Z" });
    const a2 = am(a.id, { status: "pending", filedAt: "2025-03-01T09:20:00Z" });
    const s2 = am(s.id, { status: "pending", filedAt: "2025-03-01T09:30:00Z" });
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [a, a2, s, s2] });
    expect([a, a2, s, s2].map((r) => t.nodes[r.id].degree)).toEqual([2, 3, 1, 2]);
    expect(codes(findings, a2.id)).toContain("degree-exceeded");
    expect(codes(findings, s2.id)).toContain("slot-taken");
    expect(codes(findings, a.id)).not.toContain("slot-taken");
    expect(codes(findings, s.id)).not.toContain("slot-taken");
  });

  it("under general parliamentary law a substitute for a pending amendment is an amendment to it, of the second degree", async () => {
    const a = am("s1", { status: "pending" });
    const s = am(a.id, { form: "substitute", status: "pending" });
    const { findings, tree: t } = await validateTree({ rulebook: gpl, measure, amendments: [a, s] });
    expect(t.nodes[s.id]).toMatchObject({ degree: 2, role: "amendment-to-amendment", slot: a.id });
    expect(findings.filter((f) => f.severity === "error")).toEqual([]);
  });
});

describe("continental template (European Parliament Rules of Procedure, 8th term: Rule 174(2) order of voting, Rule 170(1)(a) admissibility — T6)", () => {
  it("amendments to amendments are not put; mutually exclusive ones are flagged for information", async () => {
    const a = am("s1", { form: "strike", lines: [1, 2], filedAt: "2025-03-01T08:00:00Z" });
    const b = am("s1", { form: "substitute", filedAt: "2025-03-01T08:00:00Z" });
    const c = am(a.id, { filedAt: "2025-03-01T08:00:00Z" });
    const fs = await check(continental, [a, b, c], { asOf: "2025-03-03T09:00:00Z" });
    expect(codes(fs, c.id)).toContain("degree-exceeded");
    expect(fs.find((f) => f.amendment === a.id && f.code === "conflicts-with")?.severity).toBe("info");
    expect(fs.some((f) => f.code === "voted-after-perfecting")).toBe(false);
  });

  it("germaneness is judged against the section amended", async () => {
    const a = am("s2", { subjects: ["water"] });
    expect(codes(await check(continental, [a]), a.id)).toEqual(["not-germane"]);
    expect(codes(await check(gpl, [a]), a.id)).toEqual([]);
  });
});

describe("demo chamber (Harrowmere Assembly Standing Orders, fictional)", () => {
  it("requires two sponsors (SO 63)", async () => {
    const a = am("s1", { sponsors: ["V. Adeyemi"] });
    expect(await check(demo, [a])).toEqual([expect.objectContaining({ code: "sponsors-missing", severity: "error" })]);
  });

  it("flags filing after the 48-hour deadline, only when the sitting time is known (SO 64)", async () => {
    const early = am("s1", { filedAt: "2025-05-01T08:00:00Z" });
    const late = am("s2", { filedAt: "2025-05-02T12:00:00Z", subjects: ["audit"] });
    const fs = await check(demo, [early, late], { asOf: "2025-05-03T10:00:00Z" });
    expect(codes(fs, late.id)).toEqual(["filed-late"]);
    expect(codes(fs, early.id)).toEqual([]);
    expect(await check(demo, [early, late])).toEqual([]);
  });

  it("an amendment with no filing time needs the Clerk's certificate when a deadline applies (SO 64(2))", async () => {
    const a = am("s1");
    expect(codes(await check(demo, [a], { asOf: "2025-05-03T10:00:00Z" }), a.id)).toEqual(["needs-ruling"]);
  });
});

describe("rules as data: a committee-of-jurisdiction germaneness test", () => {
  const raw = rawTemplate("general-parliamentary-law");
  raw.amendments.germaneness.test = "committee";
  raw.rules = raw.rules.filter((r: { id: string }) => !r.id.startsWith("germane"));
  raw.rules.push(
    { id: "germane-by-committee", scope: "amendment", code: "not-germane", severity: "error", citation: "common practice, no source", message: "different committee", conditions: { all: [{ fact: "germaneness", path: "$.decidable", operator: "equal", value: true }, { fact: "germaneness", path: "$.amendmentCommittee", operator: "notEqual", value: { fact: "germaneness", path: "$.measureCommittee" } }] } },
    { id: "committee-unknown", scope: "amendment", code: "needs-ruling", severity: "warning", citation: "common practice, no source", message: "no committee", conditions: { all: [{ fact: "germaneness", path: "$.decidable", operator: "equal", value: false }] } },
  );
  const byCommittee = parseRulebook(raw);

  it("judges by committee once the rulebook says so", async () => {
    const same = am("s1", { committee: "Public Works" });
    const other = am("s1", { committee: "Finance", lines: [1, 1] });
    const none = am("s2", { lines: [1, 1] });
    const fs = await check(byCommittee, [same, other, none]);
    expect(codes(fs, same.id).filter((c) => c !== "conflicts-with")).toEqual([]);
    expect(codes(fs, other.id)).toContain("not-germane");
    expect(codes(fs, none.id)).toEqual(["needs-ruling"]);
  });
});
