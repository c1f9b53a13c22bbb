/**
 * A timestamp for something known only by its date: now when the date is today in the company's time zone, else
 * noon UTC of that date, which falls on the same calendar date in every time zone from UTC−11 to UTC+11.
 */
export function occurredAtForDate(date: string | null | undefined, today: string, now: Date = new Date()): Date {
  if (!date || date === today) return now;
  return new Date(`${date}T12:00:00Z`);
}
