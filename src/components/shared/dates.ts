/**
 * Dates in the islands: the one date module (src/lib/text/dates.ts) in the chamber's time zone,
 * which the layout writes on the page (`<html data-time-zone>`). An island rendered on the server
 * with dates in its first paint is given the zone as a prop (`timeZone`), so both renders agree.
 */
import { DEFAULT_LOCALE, DEFAULT_TIME_ZONE, formatDate, formatDateTime, fromZonedInput, isoDateIn, toZonedInput, type DateStyle } from "../../lib/text/dates.ts";

/** The chamber's zone and language as the layout wrote them (UTC and en-GB when there is no page). */
export function chamberDateStyle(timeZone?: string): DateStyle {
  if (timeZone) return { timeZone, locale: DEFAULT_LOCALE };
  const html = typeof document === "undefined" ? undefined : document.documentElement;
  return { timeZone: html?.dataset.timeZone || DEFAULT_TIME_ZONE, locale: html?.dataset.locale || DEFAULT_LOCALE };
}

/** "4 December 2026, 15:30" in the chamber's zone. */
export const when = (d: string | Date | null | undefined, timeZone?: string) => formatDateTime(d, chamberDateStyle(timeZone));
/** "4 December 2026" in the chamber's zone (a bare "2026-12-04" stays that day). */
export const day = (d: string | Date | null | undefined, timeZone?: string) => formatDate(d, chamberDateStyle(timeZone));
/** Today's calendar date in the chamber's zone ("2026-12-04"), for date inputs. */
export const today = (timeZone?: string) => isoDateIn(new Date(), chamberDateStyle(timeZone));
/** An instant as a datetime-local input's value on the chamber's clock. */
export const toInput = (d: string | Date | null | undefined, timeZone?: string) => toZonedInput(d, chamberDateStyle(timeZone));
/** A datetime-local input's value, read on the chamber's clock, as an ISO instant (null when empty). */
export const fromInput = (value: string, timeZone?: string) => fromZonedInput(value, chamberDateStyle(timeZone));
/** An instant's calendar date on the chamber's clock ("2026-12-04"), for a date input. */
export const dateInput = (d: string | Date, timeZone?: string) => isoDateIn(d, chamberDateStyle(timeZone));
