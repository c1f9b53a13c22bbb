import type { TradeFlag } from './trade-flag';
import { TradeInputError } from './trade-input-error';

/**
 * On steam heating boilers the lowest visible part of the gauge glass is at least 1 in above the lowest permissible
 * water level. Source: North Carolina boiler rules, 13 NCAC 13 .0408 (read).
 */
export const GAUGE_GLASS_LOWEST_VISIBLE_ABOVE_LOWEST_PERMISSIBLE_IN = 1;
export const GAUGE_GLASS_RULE_SOURCE = '13 NCAC 13 .0408 (North Carolina boiler rules), read';

const WORDS: Readonly<Record<string, number>> = { empty: 0, none: 0, full: 1 };

/**
 * Parses a gauge-glass level written as a fraction of the visible glass: "5/8", "1/2", "0", "0.75", "60%",
 * "empty", "full". Returns 0..1; throws TradeInputError for anything else.
 */
export function parseGaugeGlassLevel(text: string): number {
  if (typeof text !== 'string') throw new TradeInputError('level', `must be text such as "1/2", got ${String(text)}`);
  const t = text.trim().toLowerCase();
  let value: number;
  let match: RegExpExecArray | null;
  if (Object.hasOwn(WORDS, t)) value = WORDS[t];
  else if ((match = /^(\d+)\s*\/\s*(\d+)$/.exec(t))) {
    if (Number(match[2]) === 0) throw new TradeInputError('level', `"${text}" divides by zero`);
    value = Number(match[1]) / Number(match[2]);
  } else if ((match = /^(\d+(?:\.\d+)?)\s*%$/.exec(t))) value = Number(match[1]) / 100;
  else if (/^(\d+(?:\.\d*)?|\.\d+)$/.test(t)) value = Number(t);
  else throw new TradeInputError('level', `"${text}" is not a level; write a fraction of the glass such as 1/2, 5/8 or empty`);
  if (value > 1) throw new TradeInputError('level', `"${text}" is more than a full glass`);
  return value;
}

export type GaugeGlassAssessment = { fraction: number; status: 'ok' | 'warning' | 'stop'; flags: TradeFlag[] };

/** Judges a gauge-glass reading (fraction 0..1 of the visible glass). */
export function assessGaugeGlassLevel(fraction: number): GaugeGlassAssessment {
  if (typeof fraction !== 'number' || !Number.isFinite(fraction) || fraction < 0 || fraction > 1) {
    throw new TradeInputError('fraction', `must be between 0 and 1, got ${String(fraction)}`);
  }
  if (fraction === 0) {
    return {
      fraction,
      status: 'stop',
      flags: [
        {
          code: 'no_water_visible',
          severity: 'stop',
          message:
            'No water visible in the gauge glass. Do not add water to a hot boiler whose water is out of sight: ' +
            'shut off the burner and let the boiler cool.',
          value: 0,
          threshold: 0,
          unit: 'fraction of glass',
          source: 'common practice; boiler-operator guidance says the same',
        },
      ],
    };
  }
  if (fraction === 1) {
    return {
      fraction,
      status: 'warning',
      flags: [
        {
          code: 'glass_full',
          severity: 'warning',
          message: 'Glass full: the water line is above the glass and cannot be seen. Check for an overfilled (flooded) boiler.',
          value: 1,
          threshold: 1,
          unit: 'fraction of glass',
          source: 'common practice',
        },
      ],
    };
  }
  return { fraction, status: 'ok', flags: [] };
}
