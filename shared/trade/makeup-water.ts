import { dayNumberToIsoDate, isoDateToDayNumber } from './iso-date';
import type { TradeFlag } from './trade-flag';
import { requireNumber, TradeInputError } from './trade-input-error';

export type MakeupWaterEntry =
  /** Cumulative makeup-water meter reading. */
  | { date: string; kind: 'meter_reading'; gallons: number }
  /** Water added by hand (not through the meter); the amount may be unknown. */
  | { date: string; kind: 'added_by_hand'; gallons?: number };

export type MakeupWaterOptions = {
  /** Fills closer together than this, on average, mean "more often than about once a month". common practice */
  frequentFillIntervalDays?: number;
  /** Company default: the latest 30 days count as a sharp rise at this multiple of the earlier 30-day median… */
  sharpRiseFactor?: number;
  /** …and only if it is also at least this many gallons above that median (ignores meter noise). Company default. */
  sharpRiseMinGallons?: number;
  /** Earlier full 30-day windows needed before a rise is judged. Company default. */
  minPreviousWindows?: number;
};

export type MakeupWaterAnalysis = {
  firstDate: string;
  lastDate: string;
  spanDays: number;
  /** Water attributed to the log span; lower bound when some hand fills have no amount. */
  totalGallons: number;
  gallonsPerWeek: number | null;
  gallonsPerMonth: number | null;
  monthly: Array<{ month: string; gallons: number; daysCovered: number }>;
  fillEvents: number;
  fillEventsWithUnknownAmount: number;
  meanDaysBetweenFills: number | null;
  fillEventsPerMonth: number | null;
  latest30DayGallons: number | null;
  previous30DayMedianGallons: number | null;
  flags: TradeFlag[];
};

const DAYS_PER_MONTH = 365.25 / 12;
const WINDOW_DAYS = 30;

/**
 * Reads a makeup-water log. A fill is a hand fill or a meter increase (dated at the reading that shows it). Each
 * fill's gallons are spread evenly over the days since the previous fill, because topping up replaces the water
 * lost since the last top-up; this keeps a steady once-a-quarter top-up from looking like a monthly spike. The first
 * day of the log is the baseline: water logged on it belongs to the time before the log and is not counted.
 */
export function analyzeMakeupWater(entries: readonly MakeupWaterEntry[], options: MakeupWaterOptions = {}): MakeupWaterAnalysis {
  const frequentDays = requireNumber('frequentFillIntervalDays', options.frequentFillIntervalDays ?? 30, { minExclusive: 0 });
  const riseFactor = requireNumber('sharpRiseFactor', options.sharpRiseFactor ?? 2, { minExclusive: 1 });
  const riseMin = requireNumber('sharpRiseMinGallons', options.sharpRiseMinGallons ?? 1, { min: 0 });
  const minWindows = requireNumber('minPreviousWindows', options.minPreviousWindows ?? 2, { min: 1 });

  const log = validateAndSort(entries);
  const firstDay = log[0].day;
  const lastDay = log[log.length - 1].day;
  const spanDays = lastDay - firstDay;
  const daily = new Array<number>(spanDays).fill(0); // daily[i] is day firstDay + 1 + i

  const spread = (fromDay: number, toDay: number, gallons: number) => {
    if (toDay === firstDay) return; // baseline
    if (toDay === fromDay) {
      daily[toDay - firstDay - 1] += gallons;
      return;
    }
    for (let day = fromDay + 1; day <= toDay; day++) daily[day - firstDay - 1] += gallons / (toDay - fromDay);
  };

  const fillDays: number[] = [];
  let unknownAmounts = 0;
  let previousReading: number | null = null;
  let previousFillDay = firstDay;
  const fill = (day: number, gallons: number | undefined) => {
    if (gallons === undefined) unknownAmounts++;
    else spread(previousFillDay, day, gallons);
    previousFillDay = day;
    fillDays.push(day);
  };
  for (const entry of log) {
    if (entry.kind === 'added_by_hand') fill(entry.day, entry.gallons);
    else {
      if (previousReading !== null && entry.gallons > previousReading) fill(entry.day, entry.gallons - previousReading);
      previousReading = entry.gallons;
    }
  }

  const totalGallons = daily.reduce((sum, g) => sum + g, 0);
  const fillEvents = fillDays.length;
  // Fill-to-fill spacing, measured to the end of the log so that a quiet spell after the last fill counts too.
  const firstFill = fillEvents > 0 ? Math.min(...fillDays) : lastDay;
  const meanDaysBetweenFills = fillEvents >= 2 && lastDay > firstFill ? (lastDay - firstFill) / (fillEvents - 1) : null;

  const windowTotals: number[] = [];
  for (let end = spanDays; end - WINDOW_DAYS >= 0; end -= WINDOW_DAYS) {
    windowTotals.push(daily.slice(end - WINDOW_DAYS, end).reduce((sum, g) => sum + g, 0));
  }
  const latest30DayGallons = windowTotals.length > 0 ? windowTotals[0] : null;
  const previousMedian = windowTotals.length > minWindows ? median(windowTotals.slice(1)) : null;

  const flags: TradeFlag[] = [];
  if (meanDaysBetweenFills !== null && meanDaysBetweenFills < frequentDays) {
    flags.push({
      code: 'water_added_more_than_monthly',
      severity: 'warning',
      message:
        `Water was added every ${meanDaysBetweenFills.toFixed(0)} days on average, more often than about once a month. ` +
        'Check the boiler and piping for leaks.',
      value: meanDaysBetweenFills,
      threshold: frequentDays,
      unit: 'days between fills',
      source: 'common practice',
    });
  }
  const riseThreshold = previousMedian === null ? null : Math.max(riseFactor * previousMedian, previousMedian + riseMin);
  if (latest30DayGallons !== null && riseThreshold !== null && latest30DayGallons >= riseThreshold) {
    flags.push({
      code: 'sharp_rise',
      severity: 'warning',
      message:
        `${latest30DayGallons.toFixed(1)} gal in the latest 30 days against a median of ${previousMedian!.toFixed(1)} gal ` +
        'in earlier 30-day periods. Look for a new leak.',
      value: latest30DayGallons,
      threshold: riseThreshold,
      unit: 'gal per 30 days',
      source:
        `company default (common practice): latest 30 days ≥ ${riseFactor} × the median of earlier 30-day periods ` +
        `and at least ${riseMin} gal above it, with at least ${minWindows} earlier periods`,
    });
  }
  if (unknownAmounts > 0) {
    flags.push({
      code: 'fill_amounts_unknown',
      severity: 'info',
      message: `${unknownAmounts} hand fill(s) have no amount; the gallon figures are lower bounds.`,
      value: unknownAmounts,
      threshold: null,
      unit: 'fills',
      source: 'makeup-water log',
    });
  }

  return {
    firstDate: dayNumberToIsoDate(firstDay),
    lastDate: dayNumberToIsoDate(lastDay),
    spanDays,
    totalGallons,
    gallonsPerWeek: spanDays > 0 ? (totalGallons / spanDays) * 7 : null,
    gallonsPerMonth: spanDays > 0 ? (totalGallons / spanDays) * DAYS_PER_MONTH : null,
    monthly: monthlySeries(firstDay, daily),
    fillEvents,
    fillEventsWithUnknownAmount: unknownAmounts,
    meanDaysBetweenFills,
    fillEventsPerMonth: meanDaysBetweenFills === null ? null : DAYS_PER_MONTH / meanDaysBetweenFills,
    latest30DayGallons,
    previous30DayMedianGallons: previousMedian,
    flags,
  };
}

type LogEntry = { day: number; index: number } & (
  | { kind: 'meter_reading'; gallons: number }
  | { kind: 'added_by_hand'; gallons?: number }
);

function validateAndSort(entries: readonly MakeupWaterEntry[]): LogEntry[] {
  if (!Array.isArray(entries) || entries.length === 0) throw new TradeInputError('entries', 'the log has no entries');
  const log = entries.map((entry, i): LogEntry => {
    const field = `entries[${i}]`;
    const day = isoDateToDayNumber(`${field}.date`, entry.date);
    if (entry.kind === 'meter_reading') {
      return { index: i, day, kind: entry.kind, gallons: requireNumber(`${field}.gallons`, entry.gallons, { min: 0 }) };
    }
    if (entry.kind === 'added_by_hand') {
      const gallons = entry.gallons === undefined ? undefined : requireNumber(`${field}.gallons`, entry.gallons, { min: 0 });
      return { index: i, day, kind: entry.kind, gallons };
    }
    throw new TradeInputError(`${field}.kind`, `must be meter_reading or added_by_hand, got ${String((entry as { kind: unknown }).kind)}`);
  });
  log.sort((a, b) => a.day - b.day || a.index - b.index);
  let last: { gallons: number } | null = null;
  for (const entry of log) {
    if (entry.kind !== 'meter_reading') continue;
    if (last && entry.gallons < last.gallons) {
      throw new TradeInputError(
        `entries[${entry.index}].gallons`,
        `meter reading ${entry.gallons} is lower than the earlier reading ${last.gallons}; record a meter change as a new log`,
      );
    }
    last = entry;
  }
  return log;
}

function monthlySeries(firstDay: number, daily: number[]): MakeupWaterAnalysis['monthly'] {
  const months: MakeupWaterAnalysis['monthly'] = [];
  daily.forEach((gallons, i) => {
    const month = dayNumberToIsoDate(firstDay + 1 + i).slice(0, 7);
    const current = months[months.length - 1];
    if (current?.month === month) {
      current.gallons += gallons;
      current.daysCovered++;
    } else {
      months.push({ month, gallons, daysCovered: 1 });
    }
  });
  return months;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
