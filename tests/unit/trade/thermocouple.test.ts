import { describe, it, expect } from 'vitest';
import { assessThermocoupleMillivolts, thermocoupleFlags } from '../../../shared/trade/thermocouple';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('assessThermocoupleMillivolts', () => {
  it.each([
    [25, 'typical'],
    [28, 'typical'],
    [30, 'typical'],
    [31, 'above_typical'],
  ])('open circuit %s mV is %s', (openCircuitMv, status) => {
    // Source: Basic HVAC, BCcampus open textbook, ch. 19 (read): "usually around 25 – 30 DC millivolts"
    const result = assessThermocoupleMillivolts({ openCircuitMv });
    expect(result.status).toBe(status);
    expect(result.source).toMatch(/Basic HVAC/);
  });

  it('below about 18 mV open circuit: replace', () => {
    // from memory: replace below about 18 mV open circuit
    expect(assessThermocoupleMillivolts({ openCircuitMv: 17.9 })).toMatchObject({ status: 'replace' });
    expect(assessThermocoupleMillivolts({ openCircuitMv: 17.9 }).source).toMatch(/from memory/);
    expect(assessThermocoupleMillivolts({ openCircuitMv: 18 }).status).toBe('below_typical');
    expect(assessThermocoupleMillivolts({ openCircuitMv: 24.9 }).status).toBe('below_typical');
  });

  it("closed circuit alone is left to the valve manufacturer's instructions", () => {
    // Closed-circuit minimums vary by gas valve: follow the valve's instructions (reference table)
    const result = assessThermocoupleMillivolts({ closedCircuitMv: 9 });
    expect(result.status).toBe('see_manufacturer');
    expect(result.reason).toMatch(/manufacturer/);
  });

  it('open circuit governs when both are given; closed circuit is noted', () => {
    const result = assessThermocoupleMillivolts({ openCircuitMv: 12, closedCircuitMv: 6 });
    expect(result.status).toBe('replace');
    expect(result.reason).toMatch(/Closed circuit 6 mV/);
  });

  it.each([{ openCircuitMv: -1 }, { openCircuitMv: Number.NaN }, { closedCircuitMv: 750 }])('rejects %j', (input) => {
    expect(() => assessThermocoupleMillivolts(input)).toThrow(TradeInputError);
  });
});

describe('thermocoupleFlags', () => {
  it('a thermocouple judged "replace" raises a warning with its reading and the replacement point', () => {
    // from memory: replace below about 18 mV open circuit
    const replace = assessThermocoupleMillivolts({ openCircuitMv: 15 });
    expect(thermocoupleFlags(replace, 15)).toMatchObject([{ code: 'thermocouple_replace', severity: 'warning', value: 15, threshold: 18, unit: 'mV open circuit' }]);
    expect(thermocoupleFlags(replace, 15)[0].source).toMatch(/18 mV/);
  });

  it('no flag for a thermocouple that is not judged "replace"', () => {
    // Source: Basic HVAC, BCcampus open textbook, ch. 19 (read): 25–30 mV typical
    for (const mv of [18, 22, 27, 35]) expect(thermocoupleFlags(assessThermocoupleMillivolts({ openCircuitMv: mv }), mv)).toEqual([]);
    expect(thermocoupleFlags(assessThermocoupleMillivolts({ closedCircuitMv: 5 }), null)).toEqual([]);
  });
});
