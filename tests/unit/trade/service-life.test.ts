import { describe, it, expect } from 'vitest';
import { applianceLifeStatus, medianServiceLifeYears } from '../../../shared/trade/service-life';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('medianServiceLifeYears', () => {
  // Source: ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs", service-life table (1978 survey;
  // medians, not predictions), secondary copy
  it.each([
    ['hot_water_boiler', 'steel_water_tube', 24],
    ['steam_boiler', 'steel_water_tube', 30],
    ['hot_water_boiler', 'steel_fire_tube', 25],
    ['steam_boiler', 'steel_fire_tube', 25],
    ['hot_water_boiler', 'cast_iron', 35],
    ['steam_boiler', 'cast_iron', 30],
    ['hot_water_boiler', 'electric', 15],
    ['steam_boiler', 'electric', 15],
    ['furnace', 'steel_fire_tube', 18],
    ['furnace', 'cast_iron', 18],
  ] as const)('%s, %s: %s years', (kind, construction, years) => {
    const result = medianServiceLifeYears({ kind, construction });
    expect(result).toMatchObject({ years, basis: 'published_median' });
    expect(result.source).toMatch(/ASHRAE/);
    expect(result.source).toMatch(/secondary copy/);
    expect(result.note).toMatch(/not a prediction/);
  });

  it.each([
    ['hot_water_boiler', 'copper'],
    ['hot_water_boiler', 'condensing'],
    ['furnace', 'condensing'],
    ['furnace', 'electric'],
    ['water_heater', 'cast_iron'],
  ] as const)('%s, %s: no published median', (kind, construction) => {
    expect(medianServiceLifeYears({ kind, construction })).toMatchObject({ years: null, basis: 'no_published_median' });
  });

  it('rejects unknown kinds', () => {
    expect(() => medianServiceLifeYears({ kind: 'kettle' as never, construction: 'copper' })).toThrow(TradeInputError);
  });
});

describe('applianceLifeStatus', () => {
  it('within, near and past the median', () => {
    // Median from ASHRAE (secondary copy): cast-iron hot-water boiler 35 years; "near" window 2 years (company default)
    expect(applianceLifeStatus({ installedOn: '2000-06-01', today: '2025-06-01', medianYears: 35 })).toMatchObject({ status: 'within' });
    const near = applianceLifeStatus({ installedOn: '1991-06-01', today: '2025-06-01', medianYears: 35 });
    expect(near.status).toBe('near');
    expect(near.ageYears).toBeCloseTo(34, 2);
    expect(near.remainingYears).toBeCloseTo(1, 2);
    expect(applianceLifeStatus({ installedOn: '1980-01-15', today: '2025-06-01', medianYears: 35 }).status).toBe('past');
  });

  it('honours a custom near window', () => {
    expect(applianceLifeStatus({ installedOn: '2015-06-01', today: '2025-06-01', medianYears: 15, nearWindowYears: 5 }).status).toBe('near');
    expect(applianceLifeStatus({ installedOn: '2015-06-01', today: '2025-06-01', medianYears: 15, nearWindowYears: 4 }).status).toBe('within');
  });

  it('rejects an install date after today, and bad dates', () => {
    expect(() => applianceLifeStatus({ installedOn: '2026-01-01', today: '2025-06-01', medianYears: 20 })).toThrow(TradeInputError);
    expect(() => applianceLifeStatus({ installedOn: '2025-02-30', today: '2025-06-01', medianYears: 20 })).toThrow(TradeInputError);
  });
});
