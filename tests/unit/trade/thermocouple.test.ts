import { describe, it, expect } from 'vitest';
import { assessThermocoupleMillivolts } from '../../../shared/trade/thermocouple';
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
