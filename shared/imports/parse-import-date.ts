/** The date formats an import file may use; anything else is a row error naming them. */
export const IMPORT_DATE_FORMATS_HINT = 'use YYYY-MM-DD, MM/DD/YYYY or a month name such as Jan 6, 2004';

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];

function isoIfReal(year: number, month: number, day: number): string | null {
  if (!Number.isInteger(year) || year < 1900 || year > 2100 || month < 1 || month > 12 || day < 1) return null;
  const date = new Date(Date.UTC(year, month - 1, day));
  if (date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day) return null;
  return date.toISOString().slice(0, 10);
}

/** "2004-03-31", "03/31/2004", "3/31/2004", "Mar 31, 2004", "31 March 2004" → "2004-03-31"; null when not a real date. */
export function parseImportDate(text: string): string | null {
  const value = text.trim();
  let m = /^(\d{4})-(\d{1,2})-(\d{1,2})$/.exec(value);
  if (m) return isoIfReal(Number(m[1]), Number(m[2]), Number(m[3]));
  m = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/.exec(value);
  if (m) return isoIfReal(Number(m[3]), Number(m[1]), Number(m[2]));
  m = /^([a-z]{3,9})\.? (\d{1,2}),? (\d{4})$/i.exec(value);
  if (m) return monthName(m[1], Number(m[2]), Number(m[3]));
  m = /^(\d{1,2}) ([a-z]{3,9})\.?,? (\d{4})$/i.exec(value);
  if (m) return monthName(m[2], Number(m[1]), Number(m[3]));
  return null;
}

const FULL_MONTHS = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

function monthName(name: string, day: number, year: number): string | null {
  const lower = name.toLowerCase();
  let index = FULL_MONTHS.indexOf(lower);
  if (index < 0) index = lower === 'sept' ? 8 : MONTHS.indexOf(lower);
  return index < 0 ? null : isoIfReal(year, index + 1, day);
}
