/** Thrown when a trade computation gets input it cannot honestly compute from. `field` names the offending input. */
export class TradeInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'TradeInputError';
    this.field = field;
  }
}

type Bounds = { min?: number; max?: number; minExclusive?: number; maxExclusive?: number };

/** Returns `value` if it is a finite number within the bounds; otherwise throws TradeInputError for `field`. */
export function requireNumber(field: string, value: unknown, bounds: Bounds = {}): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TradeInputError(field, `must be a finite number, got ${String(value)}`);
  }
  const { min, max, minExclusive, maxExclusive } = bounds;
  if (min !== undefined && value < min) throw new TradeInputError(field, `must be at least ${min}, got ${value}`);
  if (max !== undefined && value > max) throw new TradeInputError(field, `must be at most ${max}, got ${value}`);
  if (minExclusive !== undefined && value <= minExclusive) {
    throw new TradeInputError(field, `must be greater than ${minExclusive}, got ${value}`);
  }
  if (maxExclusive !== undefined && value >= maxExclusive) {
    throw new TradeInputError(field, `must be less than ${maxExclusive}, got ${value}`);
  }
  return value;
}

/** Returns `value` if it is one of `allowed`; otherwise throws TradeInputError for `field`. */
export function requireOneOf<T extends string>(field: string, value: unknown, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new TradeInputError(field, `must be one of ${allowed.join(', ')}, got ${String(value)}`);
  }
  return value as T;
}
