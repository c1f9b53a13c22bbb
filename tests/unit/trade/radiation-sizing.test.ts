import { describe, expect, it } from 'vitest';
import { radiatorEdrSqFt, sizeBoilerFromEdr, TradeInputError, waterBtuhPerSqFtEdr } from '../../../shared/trade/index';

describe('radiatorEdrSqFt', () => {
  it('rates cast-iron column, tube and wall radiators from the tables', () => {
    // from memory: Holohan, "The Lost Art of Steam Heating": 3-column 38 in = 5 sq ft per section.
    expect(radiatorEdrSqFt({ type: 'cast_iron_column', columns: 3, heightIn: 38, sections: 10 })).toBe(50);
    // from memory: same table: 2-column 26 in = 2 2/3 sq ft per section.
    expect(radiatorEdrSqFt({ type: 'cast_iron_column', columns: 2, heightIn: 26, sections: 12 })).toBeCloseTo(31.92, 2);
    // from memory: same book, tube radiators: 4-tube 32 in = 3.5 sq ft per section.
    expect(radiatorEdrSqFt({ type: 'tube', tubes: 4, heightIn: 32, sections: 8 })).toBe(28);
    // from memory: wall radiators are named for their EDR per section (a 9-A section is 9 sq ft).
    expect(radiatorEdrSqFt({ type: 'wall', size: '9-A', sections: 3 })).toBe(27);
    expect(radiatorEdrSqFt({ type: 'convector', ratedEdrSqFt: 42 })).toBe(42);
    expect(radiatorEdrSqFt({ type: 'baseboard', lengthFt: 12, ratedEdrSqFtPerFt: 2.5 })).toBe(30);
  });

  it.each([
    [{ type: 'cast_iron_column' as const, columns: 3, heightIn: 50, sections: 10 }, 'r.heightIn'],
    [{ type: 'cast_iron_column' as const, columns: 9, heightIn: 38, sections: 10 }, 'r.columns'],
    [{ type: 'cast_iron_column' as const, columns: 3, heightIn: 38, sections: 0 }, 'r.sections'],
    [{ type: 'tube' as const, tubes: 4, heightIn: 32, sections: 2.5 }, 'r.sections'],
    [{ type: 'tube' as const, tubes: 4, heightIn: 32, sections: 500 }, 'r.sections'],
    [{ type: 'convector' as const, ratedEdrSqFt: 0 }, 'r.ratedEdrSqFt'],
    [{ type: 'baseboard' as const, lengthFt: Number.NaN, ratedEdrSqFtPerFt: 2 }, 'r.lengthFt'],
  ])('refuses %j naming %s', (radiator, field) => {
    try {
      radiatorEdrSqFt(radiator, 'r');
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(TradeInputError);
      expect((err as TradeInputError).field).toBe(field);
    }
  });
});

describe('sizeBoilerFromEdr', () => {
  it('steam: 240 Btu/h per sq ft EDR net, × 1.333 gross', () => {
    // Source: ASHRAE Handbook, HVAC Systems and Equipment: 1 sq ft EDR = 240 Btu/h of steam.
    // from memory: I=B=R net ratings assume a 1.333 piping and pickup factor for steam.
    const s = sizeBoilerFromEdr({ medium: 'steam', totalEdrSqFt: 350 });
    expect(s.netLoadBtuh).toBe(84_000);
    expect(s.grossOutputBtuh).toBe(111_972);
    expect(s.suitableNetRatingBtuh).toEqual({ min: 84_000, max: 105_000 });
  });

  it('hot water: 150 Btu/h per sq ft EDR at 170 °F average water, × 1.15 gross', () => {
    // from memory: I=B=R: 150 Btu/h per sq ft EDR at 170 °F; net ratings assume a 1.15 factor for water.
    const s = sizeBoilerFromEdr({ medium: 'hot_water', totalEdrSqFt: 400, averageWaterF: 170 });
    expect(s.netLoadBtuh).toBe(60_000);
    expect(s.grossOutputBtuh).toBe(69_000);
  });

  it('scales hot-water output with temperature and meets the steam figure at 215 °F', () => {
    expect(waterBtuhPerSqFtEdr(170)).toBeCloseTo(150, 6);
    // The same radiator law at 215 °F gives within 2 % of the 240 Btu/h steam rating (a check of the exponent).
    expect(waterBtuhPerSqFtEdr(210) / 240).toBeGreaterThan(0.9);
    expect(Math.abs(150 * (145 / 100) ** 1.3 - 240) / 240).toBeLessThan(0.02);
    expect(waterBtuhPerSqFtEdr(140)).toBeLessThan(150);
    expect(() => waterBtuhPerSqFtEdr(300)).toThrow(TradeInputError);
  });

  it('refuses no radiation', () => {
    expect(() => sizeBoilerFromEdr({ medium: 'steam', totalEdrSqFt: 0 })).toThrow(/totalEdrSqFt/);
  });
});
