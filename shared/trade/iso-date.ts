import { TradeInputError } from './trade-input-error';

/**
 * Calendar arithmetic on date-only ISO strings (yyyy-mm-dd). Every value is handled as a UTC midnight, so the
 * host time zone and daylight-saving changes can never shift a date.
 */

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 for a valid yyyy-mm-dd string; throws TradeInputError for anything else. */
export function isoDateToDayNumber(field: string, iso: unknown): number {
  const match = typeof iso === 'string' ? ISO_DATE.exec(iso) : null;
  if (!match) throw new TradeInputError(field, `must be a date like 2024-10-31, got ${String(iso)}`);
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(year, month - 1, day);
  const back = new Date(ms);
  // Date.UTC rolls 2023-02-30 over to March; a round trip that changes the parts means the date does not exist.
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) {
    throw new TradeInputError(field, `is not a real calendar date: ${String(iso)}`);
  }
  return ms / MS_PER_DAY;
}

export function dayNumberToIsoDate(dayNumber: number): string {
  return new Date(dayNumber * MS_PER_DAY).toISOString().slice(0, 10);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return isoDateToDayNumber('to', to) - isoDateToDayNumber('from', from);
}

export function addDays(iso: string, days: number): string {
  return dayNumberToIsoDate(isoDateToDayNumber('date', iso) + days);
}

/** The Monday of the week holding `iso` (weeks begin on Monday, as ISO 8601 counts them). */
export function mondayOf(iso: string): string {
  const weekday = new Date(`${addDays(iso, 0)}T00:00:00Z`).getUTCDay();
  return addDays(iso, weekday === 0 ? -6 : 1 - weekday);
}

/** Adds calendar months; a day past the end of the target month is clamped (2024-01-31 + 1 month = 2024-02-29). */
export function addMonths(iso: string, months: number): string {
  if (!Number.isInteger(months)) throw new TradeInputError('months', `must be a whole number, got ${months}`);
  const start = new Date(isoDateToDayNumber('date', iso) * MS_PER_DAY);
  const totalMonths = start.getUTCFullYear() * 12 + start.getUTCMonth() + months;
  const year = Math.floor(totalMonths / 12);
  const month = totalMonths - year * 12;
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  return new Date(Date.UTC(year, month, Math.min(start.getUTCDate(), lastDay))).toISOString().slice(0, 10);
}

export function addYears(iso: string, years: number): string {
  return addMonths(iso, years * 12);
}

/** The yyyy-mm month a date falls in. */
export function isoMonthOf(iso: string): string {
  isoDateToDayNumber('date', iso);
  return iso.slice(0, 7);
}
