/**
 * Dates and moments as the API takes them: ISO 8601 text (RFC 3339 for a moment, with its offset), in the years a
 * season can fall in. The format alone lets through years PostgreSQL cannot store (year 0000) and typos no one
 * means (0026 for 2026); such a value is refused here, at its field, rather than by the database.
 */
import * as z from '../zod';

/** The years a date may have: generous for old records and for plans, and nothing a typo makes. */
export const DATE_YEARS = { min: 1900, max: 2199 } as const;

const yearOf = (iso: string) => Number(iso.slice(0, 4));
const inYears = (iso: string) => yearOf(iso) >= DATE_YEARS.min && yearOf(iso) <= DATE_YEARS.max;
const YEAR_MESSAGE = `Use a year from ${DATE_YEARS.min} to ${DATE_YEARS.max}`;
/** A value that is not a date stops at the format's example (`abort`): only a date has its year judged. */

/** A calendar date, "2026-06-12". */
export function isoDate(error = 'Use a date such as 2026-06-12') {
  return z.iso.date({ error, abort: true }).check(z.refine(inYears, YEAR_MESSAGE));
}

/** A moment with its offset, "2026-06-12T09:30:00Z" or "…+02:00". */
export function isoDateTime(error = 'Use a date and time such as 2026-06-12T09:30:00Z') {
  return z.iso.datetime({ offset: true, error, abort: true }).check(z.refine(inYears, YEAR_MESSAGE));
}
