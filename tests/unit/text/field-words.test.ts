// Field issues in a person's words (issue 15 item 7): paths become the field's name in words and
// validator terms become plain instructions. The product's own contract (no outside source).
import { describe, expect, it } from "vitest";
import { fieldWords, invalidInputWords, issueWords } from "../../../src/lib/text/field-words.ts";

describe("field issues in words", () => {
  it("names fields in words, counting items from 1", () => {
    expect(fieldWords("raisedById")).toBe("Raised by");
    expect(fieldWords("sittingDate")).toBe("Sitting date");
    expect(fieldWords("citations.0.ruleId")).toBe("Citations, item 1: rule");
    expect(fieldWords("sponsorIds")).toBe("Sponsors");
    expect(fieldWords("(root)")).toBe("The form");
  });

  it("replaces validator terms and keeps the product's own messages", () => {
    expect(issueWords("must be an id (uuid)")).toBe("choose one from the list");
    expect(issueWords("must be a version id")).toBe("choose a rulebook version from the list");
    expect(issueWords("Invalid input: expected string, received undefined")).toBe("this is required");
    expect(issueWords("at most 500 characters")).toBe("at most 500 characters");
  });

  it("summarises an invalid input without paths, UUID or field names", () => {
    const s = invalidInputWords([
      { path: "raisedById", message: "must be an id (uuid)" },
      { path: "citations.0.ruleId", message: "Required" },
      { path: "sittingDate", message: "Invalid date" },
    ]);
    expect(s).toBe("Raised by: choose one from the list (2 more fields need attention).");
    expect(s).not.toMatch(/uuid|raisedById|\band \d+ more\)/i);
  });
});
