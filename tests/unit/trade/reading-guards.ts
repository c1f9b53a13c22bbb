import fc from 'fast-check';
import { isInRange, READING_RANGES, TradeInputError, type ReadingName } from '../../../shared/trade/index';

/** The field a trade function refused on, or undefined when it computed. */
export const refusedOn = (call: () => unknown): string | undefined => {
  try {
    call();
  } catch (error) {
    if (error instanceof TradeInputError) return error.field;
    throw error;
  }
  return undefined;
};

const nonFinite = fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY);

/** A number outside the reading's range, or not finite. */
export const outOf = (name: ReadingName) => {
  const r: { min?: number; max?: number; minExclusive?: number; maxExclusive?: number } = READING_RANGES[name];
  const below = r.min !== undefined ? fc.double({ max: r.min, maxExcluded: true, noNaN: true }) : fc.double({ max: r.minExclusive!, noNaN: true });
  const above = r.max !== undefined ? fc.double({ min: r.max, minExcluded: true, noNaN: true }) : fc.double({ min: r.maxExclusive!, noNaN: true });
  return fc.oneof(below, above, nonFinite).filter((v) => !isInRange(READING_RANGES[name], v));
};
