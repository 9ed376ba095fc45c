// The one date module and the one canonical JSON. Dates: the display formats are the house's
// choice (issue 15 item 7: day, month name and year spelt out, 24-hour clock, the chamber's zone);
// zone offsets are from the IANA time zone database (Europe/London is UTC+1 in summer, UTC in
// winter; Pacific/Auckland UTC+12 in its winter), common practice, no further source.
import { describe, expect, it } from "vitest";
import { dateStyleOf, formatDate, formatDateTime, fromZonedInput, isoDateIn, toZonedInput } from "../../../src/lib/text/dates.ts";
import { canonicalJson } from "../../../src/lib/text/canonical-json.ts";
import { analysisResultJsonSchema } from "../../../src/lib/voting/orders-analysis-schema.ts";

describe("dates", () => {
  const london = { timeZone: "Europe/London" };
  it("a date and time in the chamber's zone, with the month spelt out", () => {
    expect(formatDateTime("2026-12-04T15:30:00Z", london)).toBe("4 December 2026, 15:30");
    expect(formatDateTime("2026-07-04T15:30:00Z", london)).toBe("4 July 2026, 16:30");
    expect(formatDateTime(new Date("2026-07-04T00:05:00Z"), { timeZone: "UTC" })).toBe("4 July 2026, 00:05");
  });
  it("the same instant is a different day in another chamber's zone", () => {
    expect(formatDate("2026-07-04T23:30:00Z", london)).toBe("5 July 2026");
    expect(formatDate("2026-07-04T23:30:00Z", { timeZone: "UTC" })).toBe("4 July 2026");
    expect(isoDateIn("2026-07-04T23:30:00Z", { timeZone: "Pacific/Auckland" })).toBe("2026-07-05");
  });
  it("a bare calendar date stays that day in every zone", () => {
    expect(formatDate("2026-12-04", { timeZone: "Pacific/Auckland" })).toBe("4 December 2026");
    expect(formatDate("2026-12-04", { timeZone: "America/Los_Angeles" })).toBe("4 December 2026");
  });
  it("nothing, an invalid date or an unknown zone never throws", () => {
    expect(formatDate(null, london)).toBe("");
    expect(formatDateTime("not a date", london)).toBe("");
    expect(formatDateTime("2026-12-04T15:30:00Z", { timeZone: "Mars/Olympus" })).toBe("4 December 2026, 15:30");
    expect(dateStyleOf(null).timeZone).toBe("UTC");
    expect(dateStyleOf({ timeZone: "Europe/London" }).timeZone).toBe("Europe/London");
  });
});

describe("canonicalJson", () => {
  it("sorts keys at every depth", () => {
    expect(canonicalJson({ b: 1, a: { d: [1, { z: 1, y: 2 }], c: null } })).toBe('{"a":{"c":null,"d":[1,{"y":2,"z":1}]},"b":1}');
  });
  it("follows JSON.stringify on undefined, functions, dates and non-finite numbers", () => {
    const v = { a: undefined, b: [undefined, () => 1, Number.NaN, Number.POSITIVE_INFINITY], c: new Date("2026-12-04T15:30:00Z"), f: () => 1 };
    expect(canonicalJson(v)).toBe(JSON.stringify({ b: [undefined, () => 1, Number.NaN, Number.POSITIVE_INFINITY], c: new Date("2026-12-04T15:30:00Z") }));
    expect(canonicalJson(undefined)).toBe("null");
  });
  it("equal values in any key order print alike; a present null differs from an absent key", () => {
    expect(canonicalJson({ x: 1, y: [2, 3] })).toBe(canonicalJson({ y: [2, 3], x: 1 }));
    expect(canonicalJson({ x: null })).not.toBe(canonicalJson({}));
  });
});

describe("the analysis result schema", () => {
  it("its JSON Schema names every stored field, so a change of shape changes the cache key", () => {
    const text = canonicalJson(analysisResultJsonSchema());
    for (const field of ["condorcetWinner", "banksComplete", "sophisticated", "listing", "statusQuoWinSet"]) expect(text).toContain(`"${field}"`);
  });
});

describe("datetime-local inputs on the chamber's clock", () => {
  // Offsets from the IANA time zone database (Europe/London: UTC+1 from 29 March to 25 October 2026).
  const london = { timeZone: "Europe/London" };
  it("shows an instant on the chamber's clock and reads it back", () => {
    expect(toZonedInput("2026-07-04T15:30:00Z", london)).toBe("2026-07-04T16:30");
    expect(toZonedInput("2026-12-04T15:30:00Z", london)).toBe("2026-12-04T15:30");
    expect(fromZonedInput("2026-07-04T16:30", london)).toBe("2026-07-04T15:30:00.000Z");
    expect(fromZonedInput("2026-12-04T15:30", london)).toBe("2026-12-04T15:30:00.000Z");
    expect(fromZonedInput("2026-07-05T06:00", { timeZone: "Pacific/Auckland" })).toBe("2026-07-04T18:00:00.000Z");
  });
  it("an empty or malformed input is null, not an instant", () => {
    expect(fromZonedInput("", london)).toBeNull();
    expect(fromZonedInput("4 July", london)).toBeNull();
    expect(toZonedInput(null, london)).toBe("");
  });
});
