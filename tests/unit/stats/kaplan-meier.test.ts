import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { kaplanMeier, kaplanMeierFromCounts, medianConfidence95, medianSurvival, SurvivalInputError } from '../../../shared/stats/kaplan-meier';

// Source: Freireich et al. (1963) 6-MP arm of the leukaemia remission trial, weeks in remission (+ = censored),
// as tabulated in Kleinbaum D. G., Klein M. "Survival Analysis: A Self-Learning Text" (3rd ed.), chapter 2,
// and in Gehan E. A. (1965) Biometrika 52:203–223.
const SIX_MP = '6 6 6 6+ 7 9+ 10 10+ 11+ 13 16 17+ 19+ 20+ 22 23 25+ 32+ 32+ 34+ 35+'
  .split(' ')
  .map((t) => ({ time: Number.parseInt(t, 10), event: !t.endsWith('+') }));

describe('kaplanMeier: the 6-MP remission data', () => {
  const steps = kaplanMeier(SIX_MP);

  it('gives the product-limit table of the textbook', () => {
    // Source: Kleinbaum & Klein, ch. 2, KM table for the 6-MP group (t, n, m, S(t)).
    expect(steps.map((s) => [s.time, s.atRisk, s.events])).toEqual([
      [6, 21, 3],
      [7, 17, 1],
      [10, 15, 1],
      [13, 12, 1],
      [16, 11, 1],
      [22, 7, 1],
      [23, 6, 1],
    ]);
    const expected = [0.8571, 0.8067, 0.7529, 0.6902, 0.6275, 0.5378, 0.4482];
    steps.forEach((s, i) => expect(s.survival).toBeCloseTo(expected[i], 4));
  });

  it('counts the event at 6 weeks before the censoring at 6 weeks (21 at risk, then 17 at 7 weeks)', () => {
    expect(steps[0].atRisk).toBe(21);
    expect(steps[1].atRisk).toBe(17);
  });

  it("gives Greenwood's standard errors", () => {
    // from memory: the standard errors printed for these data by R's survival package (survfit, Gehan's 6-MP arm).
    const expected = [0.0764, 0.0869, 0.0963, 0.1068, 0.1141, 0.1282, 0.1346];
    steps.forEach((s, i) => expect(s.standardError).toBeCloseTo(expected[i], 4));
  });

  it('gives the log-log 95 % band', () => {
    // from memory: survfit(..., conf.type = "log-log") on the 6-MP arm, first step: 0.620 to 0.952.
    expect(steps[0].lower95).toBeCloseTo(0.62, 2);
    expect(steps[0].upper95).toBeCloseTo(0.952, 2);
  });

  it('has median remission 23 weeks', () => {
    // Source: Kleinbaum & Klein, ch. 2: median survival of the 6-MP group is 23 weeks.
    expect(medianSurvival(steps)).toBe(23);
    // Read off our own band (not a published figure): the lower bound first drops to 0.5 at 13 weeks and the upper
    // bound never does within the data, so the median's upper limit is open.
    expect(medianConfidence95(steps)).toEqual({ lower: 13, upper: null });
  });

  it('gives the same curve from grouped counts as from single observations', () => {
    const grouped = kaplanMeierFromCounts([
      { time: 35, events: 0, censored: 1 },
      { time: 6, events: 3, censored: 1 },
      { time: 7, events: 1, censored: 0 },
      { time: 9, events: 0, censored: 1 },
      { time: 10, events: 1, censored: 1 },
      { time: 11, events: 0, censored: 1 },
      { time: 13, events: 1, censored: 0 },
      { time: 16, events: 1, censored: 0 },
      { time: 17, events: 0, censored: 1 },
      { time: 19, events: 0, censored: 1 },
      { time: 20, events: 0, censored: 1 },
      { time: 22, events: 1, censored: 0 },
      { time: 23, events: 1, censored: 0 },
      { time: 25, events: 0, censored: 1 },
      { time: 32, events: 0, censored: 2 },
      { time: 34, events: 0, censored: 1 },
    ]);
    expect(grouped).toEqual(steps);
  });
});

describe('kaplanMeier: hostile and edge inputs', () => {
  it('returns no steps for no observations', () => {
    expect(kaplanMeier([])).toEqual([]);
    expect(medianSurvival([])).toBeNull();
  });

  it('returns no steps when everything is censored', () => {
    const steps = kaplanMeier([1, 2, 3].map((time) => ({ time, event: false })));
    expect(steps).toEqual([]);
    expect(medianSurvival(steps)).toBeNull();
  });

  it('falls to 0 when every part fails, with a closed band', () => {
    const steps = kaplanMeier([{ time: 2, event: true }, { time: 4, event: true }]);
    expect(steps.map((s) => s.survival)).toEqual([0.5, 0]);
    expect(steps[1]).toMatchObject({ lower95: 0, upper95: 0 });
    expect(medianSurvival(steps)).toBe(2);
  });

  it('keeps a part censored at an event time in the risk set of that time', () => {
    // 4 at risk at t=3: 2 fail, 2 are censored at the same age. S = 2/4 (not 2/2 = 0 nor 2/3).
    const steps = kaplanMeier([
      { time: 3, event: false },
      { time: 3, event: true },
      { time: 3, event: false },
      { time: 3, event: true },
    ]);
    expect(steps).toHaveLength(1);
    expect(steps[0]).toMatchObject({ time: 3, atRisk: 4, events: 2, survival: 0.5 });
  });

  it.each([
    [Number.NaN, 'finite'],
    [Number.POSITIVE_INFINITY, 'finite'],
    [-1, 'negative'],
  ])('refuses time %s with a clear error', (time, word) => {
    expect(() => kaplanMeier([{ time: 1, event: true }, { time, event: true }])).toThrow(SurvivalInputError);
    expect(() => kaplanMeier([{ time: 1, event: true }, { time, event: true }])).toThrow(new RegExp(`Observation 1: .*${word}`));
  });

  it('refuses an event that is not a boolean and bad counts', () => {
    expect(() => kaplanMeier([{ time: 1, event: 1 as unknown as boolean }])).toThrow(/event must be true or false/);
    expect(() => kaplanMeierFromCounts([{ time: 1, events: 1.5, censored: 0 }])).toThrow(/whole number/);
    expect(() => kaplanMeierFromCounts([{ time: 1, events: 1, censored: 0 }, { time: 1, events: 1, censored: 0 }])).toThrow(/appears twice/);
  });
});

describe('kaplanMeier: properties', () => {
  const observations = fc.array(fc.record({ time: fc.double({ min: 0, max: 100, noNaN: true }), event: fc.boolean() }), { maxLength: 200 });

  it('is non-increasing, within [0, 1], with the band around the curve', () => {
    fc.assert(
      fc.property(observations, (obs) => {
        const steps = kaplanMeier(obs);
        let previous = 1;
        for (const s of steps) {
          expect(s.survival).toBeLessThanOrEqual(previous);
          expect(s.survival).toBeGreaterThanOrEqual(0);
          expect(s.lower95).toBeGreaterThanOrEqual(0);
          expect(s.upper95).toBeLessThanOrEqual(1);
          expect(s.lower95).toBeLessThanOrEqual(s.survival + 1e-12);
          expect(s.upper95).toBeGreaterThanOrEqual(s.survival - 1e-12);
          previous = s.survival;
        }
        expect(steps.reduce((n, s) => n + s.events, 0)).toBe(obs.filter((o) => o.event).length);
      }),
    );
  });

  it('has a median only once the curve reaches one half, and it is an event time', () => {
    fc.assert(
      fc.property(observations, (obs) => {
        const steps = kaplanMeier(obs);
        const median = medianSurvival(steps);
        if (median === null) expect(steps.every((s) => s.survival > 0.5)).toBe(true);
        else expect(steps.find((s) => s.time === median)!.survival).toBeLessThanOrEqual(0.5);
      }),
    );
  });
});
