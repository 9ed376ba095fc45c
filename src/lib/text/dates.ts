/**
 * The one way to show a date or a time to a person: pages, islands, e-mails and the CLI all format
 * through here, always in an explicit time zone (the chamber's, `organization.time_zone`) and
 * language, never the server's or the viewer's by accident. Two formats only:
 *
 * - a date: "4 December 2026"
 * - a date and time: "4 December 2026, 15:30" (24-hour clock)
 *
 * Day, month name and year are spelt out, so no reader mistakes 12/11 for 11/12. Machine formats
 * (API JSON, CSV, file names) keep ISO 8601 and do not come here.
 */

/** How dates read in a chamber: its IANA time zone and its language (BCP 47). */
export interface DateStyle {
  timeZone: string;
  locale?: string;
}

export const DEFAULT_TIME_ZONE = "UTC";
export const DEFAULT_LOCALE = "en-GB";

/** True when `zone` is an IANA time zone this runtime knows ("Europe/London", "UTC"). */
export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(style: DateStyle, withTime: boolean): Intl.DateTimeFormat {
  const timeZone = isTimeZone(style.timeZone) ? style.timeZone : DEFAULT_TIME_ZONE;
  const key = `${style.locale ?? DEFAULT_LOCALE}|${timeZone}|${withTime}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(style.locale ?? DEFAULT_LOCALE, {
      timeZone,
      day: "numeric",
      month: "long",
      year: "numeric",
      ...(withTime ? { hour: "2-digit", minute: "2-digit", hourCycle: "h23" } : {}),
    });
    formatters.set(key, f);
  }
  return f;
}

function toDate(d: Date | string | number): Date | null {
  const date = d instanceof Date ? d : new Date(d);
  return Number.isNaN(date.getTime()) ? null : date;
}

/**
 * The parts in the locale's own order (en-GB: day month year), joined with spaces, and the time
 * after a comma: the same text on every runtime, whatever its ICU calls the joiner ("at", ",").
 */
function compose(f: Intl.DateTimeFormat, date: Date, withTime: boolean): string {
  const parts = f.formatToParts(date);
  const datePart = parts.filter((p) => p.type === "day" || p.type === "month" || p.type === "year").map((p) => p.value).join(" ");
  if (!withTime) return datePart;
  const get = (t: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === t)?.value ?? "";
  return `${datePart}, ${get("hour")}:${get("minute")}`;
}

/** "4 December 2026" in the chamber's zone; "" for no date or an invalid one. */
export function formatDate(d: Date | string | number | null | undefined, style: DateStyle): string {
  if (d === null || d === undefined) return "";
  // A bare calendar date ("2026-12-04") is a day, not an instant: never shift it across zones.
  if (typeof d === "string" && /^\d{4}-\d{2}-\d{2}$/.test(d)) return formatDate(`${d}T12:00:00Z`, { ...style, timeZone: "UTC" });
  const date = toDate(d);
  return date ? compose(formatter(style, false), date, false) : "";
}

/** "4 December 2026, 15:30" in the chamber's zone; "" for no date or an invalid one. */
export function formatDateTime(d: Date | string | number | null | undefined, style: DateStyle): string {
  if (d === null || d === undefined) return "";
  const date = toDate(d);
  return date ? compose(formatter(style, true), date, true) : "";
}

/** The calendar date ("2026-12-04") of an instant in the chamber's zone, for date inputs and defaults. */
export function isoDateIn(d: Date | string | number, style: DateStyle): string {
  const date = toDate(d) ?? new Date(0);
  const parts = new Intl.DateTimeFormat("en-CA", { timeZone: isTimeZone(style.timeZone) ? style.timeZone : DEFAULT_TIME_ZONE, year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(date);
  const get = (t: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === t)?.value ?? "";
  return `${get("year")}-${get("month")}-${get("day")}`;
}

/** How dates read in `chamber` (its stored zone; UTC without a chamber). */
export function dateStyleOf(chamber: { timeZone?: string | null } | null | undefined): DateStyle {
  return { timeZone: chamber?.timeZone || DEFAULT_TIME_ZONE, locale: DEFAULT_LOCALE };
}

/** The zone's offset from UTC at `instant`, in minutes (Europe/London in July: 60). */
function offsetMinutes(instant: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat("en-GB", { timeZone, hourCycle: "h23", year: "numeric", month: "numeric", day: "numeric", hour: "numeric", minute: "numeric", second: "numeric" }).formatToParts(new Date(instant));
  const n = (t: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === t)?.value ?? 0);
  return (Date.UTC(n("year"), n("month") - 1, n("day"), n("hour"), n("minute"), n("second")) - Math.floor(instant / 1000) * 1000) / 60_000;
}

/** An instant as a datetime-local input's value ("2026-12-04T15:30") on the chamber's clock; "" for none. */
export function toZonedInput(d: Date | string | null | undefined, style: DateStyle): string {
  const date = d === null || d === undefined ? null : toDate(d);
  if (!date) return "";
  const zone = isTimeZone(style.timeZone) ? style.timeZone : DEFAULT_TIME_ZONE;
  return new Date(date.getTime() + offsetMinutes(date.getTime(), zone) * 60_000).toISOString().slice(0, 16);
}

/** A datetime-local input's value read on the chamber's clock, as an ISO instant; null when empty or invalid. */
export function fromZonedInput(value: string, style: DateStyle): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(value);
  if (!m) return null;
  const zone = isTimeZone(style.timeZone) ? style.timeZone : DEFAULT_TIME_ZONE;
  const wall = Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +(m[6] ?? 0));
  // The offset at the wall time read as UTC, then at the instant that gives (right across a change of clocks).
  let instant = wall - offsetMinutes(wall, zone) * 60_000;
  instant = wall - offsetMinutes(instant, zone) * 60_000;
  return new Date(instant).toISOString();
}
