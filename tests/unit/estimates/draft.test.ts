// A roster draft is not analysed until every row is filled in or marked unranked; unranked rows take
// no part in the analysis. The product's own rule (issue 15; no outside source).
import { describe, expect, it } from "vitest";
import { draftGaps, draftMessage, isDraft } from "../../../src/lib/estimates/draft.ts";
import { estimateContentSchema, toOrdersProfile } from "../../../src/lib/estimates/estimate-content.ts";

const ballots = (rows: Array<{ member: string; weight: number; ranking: string[]; unranked?: boolean }>) => estimateContentSchema.parse({ kind: "ballots", partial: "bottom", rows: rows.map((r) => ({ bloc: r.member, ...r })) });

describe("roster drafts", () => {
  it("names the rows still to fill and refuses until they are filled or marked unranked", () => {
    const draft = ballots([{ member: "Moorland Union", weight: 14, ranking: [] }, { member: "Civic Reform", weight: 9, ranking: [] }]);
    expect(isDraft(draft)).toBe(true);
    expect(draftGaps(draft).unfilled).toEqual(["Moorland Union", "Civic Reform"]);
    expect(draftMessage(draft)).toContain("2 of 2 rows have no ranking yet (“Moorland Union”, “Civic Reform”)");
    const half = ballots([{ member: "Moorland Union", weight: 14, ranking: ["Q", "measure"] }, { member: "Civic Reform", weight: 9, ranking: [] }]);
    expect(draftMessage(half)).toContain("1 of 2 rows has no ranking yet (“Civic Reform”)");
    const filled = ballots([{ member: "Moorland Union", weight: 14, ranking: ["Q", "measure"] }, { member: "Civic Reform", weight: 9, ranking: [], unranked: true }]);
    expect(draftMessage(filled)).toBeNull();
    expect(toOrdersProfile(filled)).toEqual({ ballots: [{ ranking: ["Q", "measure"], weight: 14 }], partial: "bottom" });
    const none = ballots([{ member: "Civic Reform", weight: 9, ranking: [], unranked: true }]);
    expect(draftMessage(none)).toMatch(/nothing to analyse/);
  });

  it("shortens a long list of rows", () => {
    const many = ballots(Array.from({ length: 9 }, (_, i) => ({ member: `Bloc ${i + 1}`, weight: 1, ranking: [] })));
    const m = draftMessage(many)!;
    expect(m).toContain("9 of 9 rows");
    expect(m).toContain("and 5 more");
    expect(m).not.toContain("Bloc 9");
  });

  it("treats a spatial estimate with placeholder positions as a draft until saved without the mark", () => {
    const base = { kind: "spatial", dimensions: ["Lighting", "Cost"], statusQuo: [0, 0], measure: [1, 1], effects: {}, members: [{ member: "Moorland Union", bloc: "Moorland Union", weight: 14, ideal: [0, 0] }] };
    expect(draftMessage(estimateContentSchema.parse({ ...base, draft: true }))).toMatch(/placeholders/);
    expect(draftMessage(estimateContentSchema.parse(base))).toBeNull();
  });
});
