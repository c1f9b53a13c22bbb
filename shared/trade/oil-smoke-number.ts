import type { TradeFlag } from './trade-flag';
import { requireReading } from './reading-ranges';
import { requireOneOf, TradeInputError } from './trade-input-error';

export const OIL_BURNER_TYPES = ['flame_retention', 'non_retention'] as const;
export type OilBurnerType = (typeof OIL_BURNER_TYPES)[number];

/**
 * Highest acceptable smoke number on the ASTM D2156 scale, by burner type.
 * from memory: Brookhaven National Laboratory / NORA oilheat service guidance: a flame-retention burner is set for a
 * trace of smoke at most (No. 1), an older non-retention burner for No. 2 or less.
 */
export const SMOKE_LIMITS = { flame_retention: 1, non_retention: 2 } as const satisfies Record<OilBurnerType, number>;
const SOURCE = 'ASTM D2156 smoke scale; limits from memory: Brookhaven National Laboratory / NORA oilheat service guidance';

/** `field` names the reading in the refusal (the visit form calls it smokeSpot). */
export function smokeNumberFlags(input: { smokeNumber: number; burnerType?: OilBurnerType }, field = 'smokeNumber'): TradeFlag[] {
  const smoke = requireReading('smokeNumber', input.smokeNumber, field);
  if (!Number.isInteger(smoke)) throw new TradeInputError(field, `must be a whole number on the 0–9 scale, got ${smoke}`);
  // Without the burner type the stricter (flame-retention) limit is applied and said.
  const burnerType = input.burnerType === undefined ? undefined : requireOneOf('burnerType', input.burnerType, OIL_BURNER_TYPES);
  const limit = SMOKE_LIMITS[burnerType ?? 'flame_retention'];
  if (smoke <= limit) return [];
  const kind = burnerType === 'non_retention' ? 'an older non-retention burner' : 'a flame-retention burner';
  return [
    {
      code: 'smoke_over_limit',
      severity: 'warning',
      message:
        `Smoke No. ${smoke} is over No. ${limit}, the limit for ${kind}${burnerType === undefined ? ' (burner type not given)' : ''}: ` +
        'soot fouls the heat exchanger and flue. Adjust air and check the nozzle per the burner maker’s instructions.',
      value: smoke,
      threshold: limit,
      unit: 'smoke number',
      source: SOURCE,
    },
  ];
}
