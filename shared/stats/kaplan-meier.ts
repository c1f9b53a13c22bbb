/**
 * The Kaplan–Meier product-limit estimator of a survival curve, with a pointwise 95 % confidence band.
 *
 * Kaplan E. L., Meier P. (1958) "Nonparametric estimation from incomplete observations", JASA 53:457–481.
 * Variance by Greenwood's formula (Greenwood M. 1926, "The natural duration of cancer", Reports on Public Health
 * and Medical Subjects 33): Var[S(t)] ≈ S(t)² Σ dⱼ / (nⱼ (nⱼ − dⱼ)).
 * The band uses the log-log ("log minus log") form of that variance, which always stays within [0, 1]:
 * Kalbfleisch J. D., Prentice R. L. (1980) "The Statistical Analysis of Failure Time Data", §1.3; also
 * Collett D. "Modelling Survival Data in Medical Research", §2.2.3:
 *   S(t)^exp(∓1.96 · se), se = √(Σ dⱼ / (nⱼ (nⱼ − dⱼ))) / |ln S(t)|.
 * At a tied time, events are counted before censorings (a part censored at t was still at risk at t).
 */

export type Observation = { time: number; event: boolean };
/** Observations already grouped by distinct time (what a GROUP BY in the database gives). */
export type TimeCount = { time: number; events: number; censored: number };

export type SurvivalStep = {
  time: number;
  atRisk: number;
  events: number;
  survival: number;
  /** Greenwood's standard error of S(t) (plain form), kept for reports. */
  standardError: number;
  lower95: number;
  upper95: number;
};

const Z_95 = 1.959963984540054;

export class SurvivalInputError extends Error {
  constructor(
    message: string,
    readonly index: number,
  ) {
    super(message);
    this.name = 'SurvivalInputError';
  }
}

function checkTime(time: unknown, index: number): number {
  if (typeof time !== 'number' || !Number.isFinite(time)) throw new SurvivalInputError(`Observation ${index}: time must be a finite number.`, index);
  if (time < 0) throw new SurvivalInputError(`Observation ${index}: time cannot be negative (got ${time}).`, index);
  return time;
}

function checkCount(n: unknown, what: string, index: number): number {
  if (typeof n !== 'number' || !Number.isInteger(n) || n < 0) throw new SurvivalInputError(`Row ${index}: ${what} must be a whole number ≥ 0.`, index);
  return n;
}

export function kaplanMeier(observations: readonly Observation[]): SurvivalStep[] {
  if (!Array.isArray(observations)) throw new SurvivalInputError('Observations must be an array.', -1);
  const byTime = new Map<number, TimeCount>();
  observations.forEach((o, i) => {
    if (o === null || typeof o !== 'object') throw new SurvivalInputError(`Observation ${i}: not an object.`, i);
    const time = checkTime(o.time, i);
    if (typeof o.event !== 'boolean') throw new SurvivalInputError(`Observation ${i}: event must be true or false.`, i);
    const row = byTime.get(time) ?? { time, events: 0, censored: 0 };
    if (o.event) row.events += 1;
    else row.censored += 1;
    byTime.set(time, row);
  });
  return kaplanMeierFromCounts([...byTime.values()]);
}

/** The same estimator over counts per distinct time; rows may come in any order, a time at most once. */
export function kaplanMeierFromCounts(rows: readonly TimeCount[]): SurvivalStep[] {
  const seen = new Set<number>();
  rows.forEach((r, i) => {
    checkTime(r.time, i);
    checkCount(r.events, 'events', i);
    checkCount(r.censored, 'censored', i);
    if (seen.has(r.time)) throw new SurvivalInputError(`Row ${i}: time ${r.time} appears twice.`, i);
    seen.add(r.time);
  });
  const sorted = [...rows].sort((a, b) => a.time - b.time);
  let atRisk = sorted.reduce((n, r) => n + r.events + r.censored, 0);
  let survival = 1;
  let greenwoodSum = 0;
  const steps: SurvivalStep[] = [];
  for (const r of sorted) {
    if (r.events > 0) {
      survival *= (atRisk - r.events) / atRisk;
      // When every part at risk fails the sum is infinite; the curve is then 0 with no spread left.
      greenwoodSum += atRisk === r.events ? Infinity : r.events / (atRisk * (atRisk - r.events));
      steps.push({ time: r.time, atRisk, events: r.events, survival, ...band(survival, greenwoodSum) });
    }
    atRisk -= r.events + r.censored;
  }
  return steps;
}

function band(survival: number, greenwoodSum: number): { standardError: number; lower95: number; upper95: number } {
  if (survival <= 0) return { standardError: 0, lower95: 0, upper95: 0 };
  const standardError = survival * Math.sqrt(greenwoodSum);
  if (survival >= 1 || greenwoodSum === 0) return { standardError, lower95: survival, upper95: survival };
  const logS = Math.log(survival);
  const se = Math.sqrt(greenwoodSum) / Math.abs(logS);
  return { standardError, lower95: survival ** Math.exp(Z_95 * se), upper95: survival ** Math.exp(-Z_95 * se) };
}

/** The first time at which the curve is at or below one half, or null when it never gets there. */
export function medianSurvival(steps: readonly Pick<SurvivalStep, 'time' | 'survival'>[]): number | null {
  return steps.find((s) => s.survival <= 0.5)?.time ?? null;
}

/**
 * A 95 % interval for the median read off the band (Brookmeyer R., Crowley J. 1982, Biometrics 38:29–41, as
 * implemented by the usual packages): from the first time the lower bound is ≤ 0.5 to the first time the upper is;
 * null where the band never gets there.
 */
export function medianConfidence95(steps: readonly SurvivalStep[]): { lower: number | null; upper: number | null } {
  return { lower: steps.find((s) => s.lower95 <= 0.5)?.time ?? null, upper: steps.find((s) => s.upper95 <= 0.5)?.time ?? null };
}
