// A measure's History in words (issue 15 item 7): labels instead of field names, names instead of
// ids, statuses and forms in words, no finding codes. The product's own contract (no outside source).
import { describe, expect, it } from "vitest";
import { historyAction, historyFieldLabel, historyValue } from "../../../src/lib/measures/history-words.ts";

const ctx = { entity: "amendment", names: new Map([["6f1c2b8e-0000-4000-8000-000000000001", "Ada Marsh"], ["6f1c2b8e-0000-4000-8000-000000000002", "A3"]]), when: (iso: string) => `at ${iso.slice(0, 4)}` };

describe("history in words", () => {
  it("labels fields and shows values without ids or slugs", () => {
    expect(historyFieldLabel("sittingAt")).toBe("On the floor at");
    expect(historyFieldLabel("targetAmendmentId")).toBe("Amendment amended");
    expect(historyFieldLabel("someNewField")).toBe("Some new field");
    expect(historyValue("sponsors", ["6f1c2b8e-0000-4000-8000-000000000001"], ctx)).toBe("Ada Marsh");
    expect(historyValue("targetAmendmentId", "6f1c2b8e-0000-4000-8000-000000000002", ctx)).toBe("A3");
    expect(historyValue("status", "ruled-out", ctx)).toBe("Ruled out of order");
    expect(historyValue("status", "on-floor", { ...ctx, entity: "measure" })).toBe("On the floor");
    expect(historyValue("form", "strike-and-insert", ctx)).toBe("Strike and insert");
    expect(historyValue("filedAt", "2026-12-04T15:30:00.000Z", ctx)).toBe("at 2026");
    expect(historyValue("attachmentId", "6f1c2b8e-0000-4000-8000-000000000009", ctx)).toBe("a document");
    expect(historyValue("lines", [3, 5], ctx)).toBe("3–5");
    expect(historyValue("committee", null, ctx)).toBe("none");
  });

  it("says what was done without finding codes", () => {
    expect(historyAction("override", "overrode not-germane on A4")).toBe("Override · overrode the finding “not germane” on A4");
    expect(historyAction("override", "revoked override of conflicts-with on A2")).toBe("Override · revoked the override of the finding “conflicts with” on A2");
    expect(historyAction("amendment", "filed A3")).toBe("Amendment · filed A3");
  });
});
