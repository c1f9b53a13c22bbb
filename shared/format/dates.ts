/**
 * The one date formatter for every screen and e-mail. Dates are shown in the company's locale and, for instants,
 * its time zone; calendar dates (yyyy-mm-dd) are shown as written, never shifted by the reader's time zone.
 * Nothing here ever shows an ISO string.
 */
export const COMPANY_LOCALE = 'en-US';

const MS_PER_DAY = 86_400_000;
const formats = new Map<string, Intl.DateTimeFormat>();

function format(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, options);
    formats.set(key, f);
  }
  return f;
}

const dayNumber = (isoDate: string) => {
  const [y, m, d] = isoDate.slice(0, 10).split('-').map(Number);
  return Date.UTC(y, m - 1, d) / MS_PER_DAY;
};

/** "Mon, Nov 23" for a day on the week board. */
export function formatWeekday(isoDate: string, locale = COMPANY_LOCALE): string {
  return format(locale, { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' }).format(new Date(`${isoDate}T00:00:00Z`));
}

/** "Jan 6, 2027" for a calendar date; `long` gives "January 6, 2027". A missing date reads "—". */
export function formatCalendarDate(isoDate: string | null | undefined, opts: { long?: boolean; locale?: string } = {}): string {
  if (!isoDate) return '—';
  const f = format(opts.locale ?? COMPANY_LOCALE, { year: 'numeric', month: opts.long ? 'long' : 'short', day: 'numeric', timeZone: 'UTC' });
  return f.format(new Date(dayNumber(isoDate) * MS_PER_DAY));
}

/** "Jan 6, 2027, 3:05 PM" for an instant, read on the company's clocks. */
export function formatInstant(iso: string | Date, timeZone: string, locale = COMPANY_LOCALE): string {
  const f = format(locale, { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZone });
  return f.format(typeof iso === 'string' ? new Date(iso) : iso);
}

/** "Tuesday, November 24, 2026, 9:00 AM to 11:00 AM": a booked window, read on the company's clocks. */
export function formatVisitWindow(startsAt: string | Date, endsAt: string | Date, timeZone: string, locale = COMPANY_LOCALE): string {
  const day = format(locale, { weekday: 'long', year: 'numeric', month: 'long', day: 'numeric', timeZone });
  const time = format(locale, { hour: 'numeric', minute: '2-digit', timeZone });
  const [start, end] = [startsAt, endsAt].map((d) => (typeof d === 'string' ? new Date(d) : d));
  return `${day.format(start)}, ${time.format(start)} to ${time.format(end)}`;
}

/** Whole days from `today` to `isoDate` (both yyyy-mm-dd): positive in the future. */
export const daysFromToday = (isoDate: string, today: string) => dayNumber(isoDate) - dayNumber(today);

/** "today", "tomorrow", "in 35 days", "3 days ago": relative words, for due dates where they help. */
export function relativeDays(isoDate: string, today: string, locale = COMPANY_LOCALE): string {
  return relativeFormat(locale).format(daysFromToday(isoDate, today), 'day');
}

const relatives = new Map<string, Intl.RelativeTimeFormat>();
function relativeFormat(locale: string) {
  let f = relatives.get(locale);
  if (!f) {
    f = new Intl.RelativeTimeFormat(locale, { numeric: 'auto' });
    relatives.set(locale, f);
  }
  return f;
}

/** "Jan 6, 2027 · in 35 days": a due date with how far off it is. */
export const formatDueDate = (isoDate: string, today: string, locale = COMPANY_LOCALE) =>
  `${formatCalendarDate(isoDate, { locale })} · ${relativeDays(isoDate, today, locale)}`;

/** "7:42 AM": a time of day on the company's clocks (the phone's own zone when the company's is not known yet). */
export function formatClockTime(iso: string | Date, timeZone?: string, locale = COMPANY_LOCALE): string {
  const f = format(locale, { hour: 'numeric', minute: '2-digit', ...(timeZone ? { timeZone } : {}) });
  return f.format(typeof iso === 'string' ? new Date(iso) : iso);
}
