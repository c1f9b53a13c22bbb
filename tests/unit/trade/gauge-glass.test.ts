import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  assessGaugeGlassLevel,
  assessGaugeGlassMark,
  assessGaugeGlassReading,
  describeGaugeGlassLevel,
  GAUGE_GLASS_LOW_BELOW_FRACTION,
  parseGaugeGlassReading,
  GAUGE_GLASS_LOWEST_VISIBLE_ABOVE_LOWEST_PERMISSIBLE_IN,
  GAUGE_GLASS_RULE_SOURCE,
  parseGaugeGlassLevel,
} from '../../../shared/trade/gauge-glass';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('parseGaugeGlassLevel', () => {
  it.each([
    ['5/8', 0.625],
    ['1/2', 0.5],
    [' 3 / 4 ', 0.75],
    ['0', 0],
    ['empty', 0],
    ['EMPTY', 0],
    ['full', 1],
    ['1', 1],
    ['0.4', 0.4],
    ['60%', 0.6],
  ])('%s → %s', (text, fraction) => {
    expect(parseGaugeGlassLevel(text)).toBeCloseTo(fraction, 12);
  });

  it.each(['', 'half', '9/8', '1/0', '-1/2', '150%', 'constructor', '1.2'])('rejects %j', (text) => {
    expect(() => parseGaugeGlassLevel(text)).toThrow(TradeInputError);
  });
});

describe('assessGaugeGlassLevel', () => {
  it('no water visible is a stop, with the do-not-add-water caution', () => {
    // common practice (boiler-operator guidance says the same): do not add water to a hot boiler whose water is out
    // of sight; shut off the burner and let it cool
    const result = assessGaugeGlassLevel(parseGaugeGlassLevel('empty'));
    expect(result.status).toBe('stop');
    expect(result.flags[0]).toMatchObject({ code: 'no_water_visible', severity: 'stop' });
    expect(result.flags[0].message).toMatch(/Do not add water to a hot boiler/);
    expect(result.flags[0].message).toMatch(/shut off the burner and let the boiler cool/);
  });

  it('a full glass hides the water line too', () => {
    // common practice: a full glass means the level is above sight
    expect(assessGaugeGlassLevel(1)).toMatchObject({ status: 'warning', flags: [{ code: 'glass_full' }] });
  });

  it('a visible level is fine', () => {
    expect(assessGaugeGlassLevel(parseGaugeGlassLevel('5/8'))).toEqual({ fraction: 0.625, mark: null, status: 'ok', flags: [] });
  });

  it('states the 1 in rule with its source', () => {
    // Source: 13 NCAC 13 .0408 (read): lowest visible part of the glass at least 1 in above the lowest permissible level
    expect(GAUGE_GLASS_LOWEST_VISIBLE_ABOVE_LOWEST_PERMISSIBLE_IN).toBe(1);
    expect(GAUGE_GLASS_RULE_SOURCE).toMatch(/13 NCAC 13 \.0408/);
  });

  it('rejects fractions outside 0..1', () => {
    expect(() => assessGaugeGlassLevel(1.1)).toThrow(TradeInputError);
    expect(() => assessGaugeGlassLevel(Number.NaN)).toThrow(TradeInputError);
  });
});

describe('the cold water level against the normal water line', () => {
  it('a level below a third of the glass is low, flagged plainly; a sixteenth no longer passes', () => {
    // common practice: the cold normal water line is about half to two thirds of the glass; the maker's mark governs
    expect(GAUGE_GLASS_LOW_BELOW_FRACTION).toBeCloseTo(1 / 3, 12);
    const low = assessGaugeGlassLevel(parseGaugeGlassLevel('1/16'));
    expect(low).toMatchObject({ status: 'warning', flags: [{ code: 'gauge_glass_low', severity: 'warning', value: 0.0625 }] });
    expect(low.flags[0].message).toMatch(/^Cold water level low: 6 % of the glass/);
    expect(low.flags[0].message).toMatch(/Add water only to a cold boiler/);
    expect(assessGaugeGlassLevel(parseGaugeGlassLevel('1/3')).status).toBe('ok');
    expect(assessGaugeGlassLevel(parseGaugeGlassLevel('1/2')).status).toBe('ok');
  });

  it('empty is a stop that says so', () => {
    // common practice (boiler-operator guidance says the same)
    expect(assessGaugeGlassLevel(0).flags[0].message).toMatch(/^Gauge glass empty: no water visible/);
  });

  it('every level maps to one status: empty stop, low warning, visible ok, full warning', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (f) => {
        const { status, flags } = assessGaugeGlassLevel(f);
        const expected = f === 0 ? 'stop' : f < 1 / 3 || f === 1 ? 'warning' : 'ok';
        return status === expected && (status === 'ok') === (flags.length === 0);
      }),
    );
  });

  it.each([
    ['at mark', 'at'],
    ['Below  NWL', 'below'],
    ['above mark', 'above'],
  ])('reads %j against the maker\'s mark', (text, mark) => {
    expect(parseGaugeGlassReading(text)).toEqual({ fraction: null, mark });
  });

  it("judges the level against the maker's mark: below is low, above is an overfill note", () => {
    // common practice: the boiler maker's normal-water-line mark governs the cold level
    expect(assessGaugeGlassMark('at')).toEqual({ fraction: null, mark: 'at', status: 'ok', flags: [] });
    expect(assessGaugeGlassMark('below')).toMatchObject({ status: 'warning', flags: [{ code: 'gauge_glass_low' }] });
    expect(assessGaugeGlassMark('above')).toMatchObject({ status: 'ok', flags: [{ code: 'gauge_glass_above_normal_line', severity: 'info' }] });
    expect(assessGaugeGlassReading(parseGaugeGlassReading('5/8'))).toMatchObject({ fraction: 0.625, mark: null, status: 'ok' });
    expect(describeGaugeGlassLevel(assessGaugeGlassMark('below'))).toBe("below the maker's normal-water-line mark");
    expect(describeGaugeGlassLevel(assessGaugeGlassLevel(0.625))).toBe('63 % of the glass');
  });

  it.each(['half', 'mark', 'under mark', '9/8', ''])('refuses %j, naming both ways to write it', (text) => {
    expect(() => parseGaugeGlassReading(text)).toThrow(TradeInputError);
    expect(() => assessGaugeGlassMark('under' as never)).toThrow(TradeInputError);
  });
});
