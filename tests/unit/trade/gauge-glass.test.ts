import { describe, it, expect } from 'vitest';
import {
  assessGaugeGlassLevel,
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
    expect(assessGaugeGlassLevel(parseGaugeGlassLevel('5/8'))).toEqual({ fraction: 0.625, status: 'ok', flags: [] });
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
