/** Today's calendar date (yyyy-mm-dd) in a company's time zone: "due today" means today where the company works. */
export function todayInTimeZone(timeZone: string, now: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now);
  const get = (type: string) => parts.find((p) => p.type === type)?.value;
  return `${get('year')}-${get('month')}-${get('day')}`;
}

const MS_PER_DAY = 86_400_000;

const wallClocks = new Map<string, Intl.DateTimeFormat>();
/** Building a formatter is slow next to using one, and the seed reads thousands of instants. */
function wallClockFormat(timeZone: string): Intl.DateTimeFormat {
  let format = wallClocks.get(timeZone);
  if (!format) {
    const fields = { year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' } as const;
    format = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', ...fields });
    wallClocks.set(timeZone, format);
  }
  return format;
}

/** The wall-clock reading in `timeZone` at `instant`, as if it were UTC (milliseconds, whole seconds). */
function wallClockMs(timeZone: string, instant: number): number {
  const parts = wallClockFormat(timeZone).formatToParts(new Date(instant));
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  return Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
}

/**
 * The instant when the clocks in `timeZone` read `hour:minute` on `date` (yyyy-mm-dd). Where the clocks go back
 * and the reading happens twice, the earlier one; where they jump forward past it, the reading an hour on (02:30 on
 * the spring-forward day in New York is 03:30 daylight time), as a person resetting a clock would read it.
 */
export function instantInTimeZone(timeZone: string, date: string, hour: number, minute = 0): Date {
  const [y, m, d] = date.split('-').map(Number);
  const wall = Date.UTC(y, m - 1, d, hour, minute);
  // The offset a day either side of the reading; a change of clocks lies between them, if any.
  const offsetBefore = wallClockMs(timeZone, wall - MS_PER_DAY) - (wall - MS_PER_DAY);
  const offsetAfter = wallClockMs(timeZone, wall + MS_PER_DAY) - (wall + MS_PER_DAY);
  const candidates = [wall - offsetBefore, wall - offsetAfter].filter((t) => wallClockMs(timeZone, t) === wall).sort((a, b) => a - b);
  return new Date(candidates[0] ?? wall - offsetBefore);
}

/** The instant a company's wall clock reads `local` (yyyy-mm-ddThh:mm), by the rules of instantInTimeZone. */
export function instantOfLocalDateTime(timeZone: string, local: string): Date {
  const [date, time] = local.split('T');
  const [hour, minute] = time.split(':').map(Number);
  return instantInTimeZone(timeZone, date, hour, minute);
}

/** What a wall clock in `timeZone` reads at `instant`, to the minute: yyyy-mm-ddThh:mm. */
export function localDateTimeOf(timeZone: string, instant: Date): string {
  return new Date(wallClockMs(timeZone, instant.getTime())).toISOString().slice(0, 16);
}
