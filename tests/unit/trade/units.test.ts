import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  inWcToPascal,
  kpaToPsi,
  pascalToInWc,
  psiToKpa,
} from '../../../shared/trade/units';

describe('temperature', () => {
  it('converts the boiling and freezing points of water', () => {
    // Source: definition of the Fahrenheit and Celsius scales (212 °F = 100 °C, 32 °F = 0 °C)
    expect(fahrenheitToCelsius(212)).toBeCloseTo(100, 10);
    expect(fahrenheitToCelsius(32)).toBeCloseTo(0, 10);
    expect(celsiusToFahrenheit(100)).toBeCloseTo(212, 10);
    expect(celsiusToFahrenheit(-40)).toBeCloseTo(-40, 10);
  });

  it('round-trips', () => {
    fc.assert(fc.property(fc.double({ min: -500, max: 3000, noNaN: true }), (f) => {
      expect(celsiusToFahrenheit(fahrenheitToCelsius(f))).toBeCloseTo(f, 8);
    }));
  });
});

describe('pressure', () => {
  it('1 in. w.c. is 249.089 Pa', () => {
    // Source: conventional inch of water column at 4 °C, 249.089 Pa (reference table, trade-sources)
    expect(inWcToPascal(1)).toBe(249.089);
    expect(pascalToInWc(249.089)).toBeCloseTo(1, 12);
  });

  it('matches the BPI draft pairs -2.5 Pa ≈ -0.01 in. w.c. and -5 Pa ≈ -0.02 in. w.c.', () => {
    // Source: BPI Technical Standards for the Building Analyst (secondary): "-2.5 to -5 Pascals (-.01 to -.02" wc)"
    expect(pascalToInWc(-2.5)).toBeCloseTo(-0.01, 3);
    expect(pascalToInWc(-5)).toBeCloseTo(-0.02, 3);
  });

  it('1 psi is 6.894757 kPa', () => {
    // from memory: NIST Special Publication 811 (2008), Appendix B
    expect(psiToKpa(1)).toBeCloseTo(6.894757, 6);
    expect(psiToKpa(14.696)).toBeCloseTo(101.325, 2); // standard atmosphere, 101.325 kPa
    expect(kpaToPsi(psiToKpa(30))).toBeCloseTo(30, 10);
  });
});
