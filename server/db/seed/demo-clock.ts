import { instantInTimeZone, todayInTimeZone } from '../../../shared/dates';
import { addDays } from '../../../shared/trade/iso-date';

/** The moment the seed runs, read on one company's clocks: the seed writes nothing after `now`. */
export type DemoClock = {
  now: Date;
  timeZone: string;
  /** The company's date at `now`. */
  today: string;
  /** The instant the company's clocks read `hour:minute` on `date`. */
  at(date: string, hour: number, minute?: number): Date;
  /** The latest day on which `hour:minute` has passed: today, or yesterday early in the day. */
  lastDayAt(hour: number, minute?: number): string;
};

export function demoClock(now: Date, timeZone: string): DemoClock {
  const today = todayInTimeZone(timeZone, now);
  const at = (date: string, hour: number, minute = 0) => instantInTimeZone(timeZone, date, hour, minute);
  return {
    now,
    timeZone,
    today,
    at,
    lastDayAt: (hour, minute = 0) => (at(today, hour, minute) <= now ? today : addDays(today, -1)),
  };
}
