// The zod building blocks of src/lib/schema-parts.ts: what PostgreSQL refuses never passes.
// Sources: PostgreSQL 16 manual, §8.1 "Numeric Types" table 8.2 (integer: -2147483648 to +2147483647);
// §8.3 "Character Types" (paraphrase: the character with code zero cannot be stored in a text value);
// §8.14 "JSON Types" (paraphrase: \u0000 is not allowed in jsonb, nor an escape that is not a valid
// code point, such as half a surrogate pair). Calendar rules: the proleptic Gregorian calendar of
// ISO 8601 (30 days hath September…; February 29 only in leap years), common knowledge.
import { describe, expect, it } from "vitest";
import { analysisLimits } from "../../../src/lib/server/analysis/limits.ts";
import { calendarDate, count, dateOrDateTime, dateTime, INT4_MAX, INT4_MIN, int4, queryInt, required, storableText, stringIssues, text, textProblem, version } from "../../../src/lib/schema-parts.ts";

const ok = (s: { safeParse(v: unknown): { success: boolean } }, v: unknown) => s.safeParse(v).success;

describe("text", () => {
  it("refuses NUL, other control characters, a lone CR and half a surrogate pair; keeps tab and newlines", () => {
    for (const bad of ["a\u0000b", "\u0001", "bell\u0007", "esc\u001b[31m", "del\u007f", "form\ffeed", "v\vtab", "lone\rcr", "half \ud800 pair", "low \udc00 first"]) expect(ok(text(100), bad), JSON.stringify(bad)).toBe(false);
    for (const good of ["plain", "tab\there", "line\nbreak", "crlf\r\nbreak", "émigré — “quoted” 🏛️", ""]) expect(ok(text(100), good), JSON.stringify(good)).toBe(true);
    expect(textProblem("a\u0000")).toMatch(/NUL/);
  });

  it("trims and requires content where asked", () => {
    expect(required(10).parse("  x  ")).toBe("x");
    expect(ok(required(10), "   ")).toBe(false);
    expect(ok(required(10), "\u0000")).toBe(false);
  });

  it("stringIssues names the path of every bad string, keys included, and survives deep nesting", () => {
    const issues = stringIssues({ title: "ok", sections: [{ heading: "x\u0000" }], ["k\u0000"]: 1 });
    expect(issues.map((i) => i.path).sort()).toEqual(["(key)", "sections.0.heading"]);
    let deep: unknown = "\u0000";
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(stringIssues(deep)).toHaveLength(1);
  });

  it("storableText keeps an uploaded document's words and drops what cannot be stored", () => {
    expect(storableText("one\r\ntwo\rthree\ffour\u0000five\ud800")).toBe("one\ntwo\nthree\nfourfive\ufffd");
    expect(textProblem(storableText("a\u0000\u0007\r\ud800"))).toBeNull();
  });
});

describe("integers within int4", () => {
  it("accepts the ends of the range and refuses one past them (PostgreSQL table 8.2)", () => {
    expect(ok(int4(), INT4_MAX)).toBe(true);
    expect(ok(int4(), INT4_MIN)).toBe(true);
    expect(ok(int4(), 2 ** 31)).toBe(false);
    expect(ok(int4(), -(2 ** 31) - 1)).toBe(false);
    expect(ok(version(), 2 ** 53 - 1)).toBe(false);
    expect(ok(version(), 0)).toBe(false);
    expect(ok(count(), 0)).toBe(true);
    expect(ok(queryInt(), "2147483648")).toBe(false);
    expect(ok(queryInt(), "12")).toBe(true);
  });
});

describe("dates that exist", () => {
  it("refuses 30 February, 31 April, 29 February in a common year and year 0000; accepts 29 February 2028", () => {
    for (const bad of ["2026-02-30", "2026-04-31", "2026-02-29", "0000-01-01", "2026-13-01", "2026-00-10", "20260402", "last tuesday", "99999-01-01"]) expect(ok(calendarDate(), bad), bad).toBe(false);
    for (const good of ["2026-04-02", "2028-02-29", "2000-02-29", "1800-01-01", "2999-12-31"]) expect(ok(calendarDate(), good), good).toBe(true);
    expect(ok(calendarDate(), "1900-02-29")).toBe(false); // 1900 is not a leap year (divisible by 100, not by 400)
  });

  it("date and time: the day must exist and an offset is required", () => {
    expect(ok(dateTime(), "2026-04-02T14:30:00Z")).toBe(true);
    expect(ok(dateTime(), "2026-04-02T14:30:00.123+01:00")).toBe(true);
    for (const bad of ["2026-02-30T10:00:00Z", "0000-01-01T00:00:00Z", "2026-04-02T24:00:00Z", "2026-04-02T10:00:00", "2026-04-02"]) expect(ok(dateTime(), bad), bad).toBe(false);
    expect(ok(dateOrDateTime(), "2026-04-02")).toBe(true);
    expect(ok(dateOrDateTime(), "2026-02-30")).toBe(false);
  });
});

describe("analysis limits from the environment (defaults: common practice, no source)", () => {
  it("defaults: two workers, one per chamber, 120 s, 1024 MB; settings override; nonsense falls back", () => {
    expect(analysisLimits({})).toEqual({ workers: 2, chamberShare: 1, timeMs: 120_000, memoryMb: 1024 });
    expect(analysisLimits({ GAVELWRIGHT_ANALYSIS_WORKERS: "6", GAVELWRIGHT_ANALYSIS_TIME_LIMIT: "30", GAVELWRIGHT_ANALYSIS_MEMORY_MB: "256" })).toEqual({ workers: 6, chamberShare: 3, timeMs: 30_000, memoryMb: 256 });
    expect(analysisLimits({ GAVELWRIGHT_ANALYSIS_WORKERS: "2", GAVELWRIGHT_ANALYSIS_CHAMBER_SHARE: "5" }).chamberShare).toBe(2);
    expect(analysisLimits({ GAVELWRIGHT_ANALYSIS_TIME_LIMIT: "soon" }).timeMs).toBe(120_000);
  });
});
