import { applianceLifeStatus, medianServiceLifeYears } from '../../../shared/trade/index';
import type { ApplianceRecordDto } from '../../../shared/schemas/records';
import type { ApplianceRow } from './appliances.repository';

/** The date age is counted from: the install date, else the first of the month (or year) of manufacture. */
export function ageStartDate(a: Pick<ApplianceRow, 'installedOn' | 'manufacturedYear' | 'manufacturedMonth'>): string | null {
  if (a.installedOn) return a.installedOn;
  if (!a.manufacturedYear) return null;
  return `${String(a.manufacturedYear).padStart(4, '0')}-${String(a.manufacturedMonth ?? 1).padStart(2, '0')}-01`;
}

/** Whole calendar years from `from` to `today` (a birthday-style count). */
export function wholeYearsBetween(from: string, today: string): number {
  const years = Number(today.slice(0, 4)) - Number(from.slice(0, 4));
  return Math.max(0, today.slice(5) < from.slice(5) ? years - 1 : years);
}

export function endOfLifeFor(a: ApplianceRow, today: string): ApplianceRecordDto['endOfLife'] {
  const median = medianServiceLifeYears({ kind: a.kind, construction: a.construction });
  const start = ageStartDate(a);
  if (median.years === null || !start || start > today) {
    return { medianYears: median.years, status: 'unknown', source: median.source };
  }
  const life = applianceLifeStatus({ installedOn: start, today, medianYears: median.years });
  return { medianYears: median.years, status: life.status, source: median.source };
}
