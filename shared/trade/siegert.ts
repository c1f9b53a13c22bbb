import { requireFuel, type CombustionFuel } from './fuels';
import { requireReading } from './reading-ranges';
import { TradeInputError } from './trade-input-error';
import { fahrenheitDeltaToKelvin } from './units';

type SiegertCoefficients = { a2: number; b: number; confidence: string };

/**
 * Coefficients of the Siegert formula qA = (tA − tL)·(A2/(21 − O2) + B), from the annex of the German ordinance on
 * small and medium firing installations (1. BImSchV).
 */
export const SIEGERT_COEFFICIENTS: Readonly<Record<CombustionFuel, SiegertCoefficients>> = {
  oil_no2: { a2: 0.68, b: 0.007, confidence: 'heating oil: A2 0.68 and B 0.007 secondary' },
  natural_gas: {
    a2: 0.66,
    b: 0.009,
    confidence: 'natural gas: A2 0.66 secondary (some editions give 0.65; 0.66 used), B 0.009 from memory',
  },
  propane: { a2: 0.63, b: 0.008, confidence: 'LPG: A2 0.63 and B 0.008 from memory' },
};

export const SIEGERT_BASIS = 'net (lower heating value) basis; sensible flue-gas loss only';

export function siegertSource(fuel: CombustionFuel): string {
  return `1. BImSchV (German small firing installations ordinance), annex; ${SIEGERT_COEFFICIENTS[fuel].confidence}`;
}

/** Siegert flue-gas loss qA, % of the lower heating value; temperatures enter as a °C difference. */
export function siegertFlueLossPct(input: { fuel: CombustionFuel; o2Pct: number; flueTempF: number; airTempF: number }): number {
  const { a2, b } = SIEGERT_COEFFICIENTS[requireFuel('fuel', input.fuel)];
  const o2 = requireReading('o2Pct', input.o2Pct);
  const flue = requireReading('flueTempF', input.flueTempF);
  const air = requireReading('airTempF', input.airTempF);
  if (flue < air) throw new TradeInputError('flueTempF', `flue temperature ${flue} °F is below the combustion-air temperature ${air} °F`);
  return fahrenheitDeltaToKelvin(flue - air) * (a2 / (21 - o2) + b);
}
