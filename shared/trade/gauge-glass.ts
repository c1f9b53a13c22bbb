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

/** Where the cold water stands against the manufacturer's normal-water-line mark on the glass or jacket. */
export const NORMAL_WATER_LINE_MARKS = ['at', 'below', 'above'] as const;
export type NormalWaterLineMark = (typeof NORMAL_WATER_LINE_MARKS)[number];

/**
 * A cold level below a third of the glass is low. common practice: the cold normal water line is about half to two
 * thirds of the glass unless the boiler maker marks it; below a third little water stands between the burner and the
 * lowest visible part of the glass, where the low-water cutoff must already have stopped it.
 */
export const GAUGE_GLASS_LOW_BELOW_FRACTION = 1 / 3;
const NWL_SOURCE = "common practice: the cold normal water line is about half to two thirds of the glass; the boiler maker's normal-water-line mark governs";

export type GaugeGlassReading = { fraction: number; mark: null } | { fraction: null; mark: NormalWaterLineMark };

const MARK_WORDS: Readonly<Record<string, NormalWaterLineMark>> = {
  'at mark': 'at',
  'at nwl': 'at',
  'below mark': 'below',
  'below nwl': 'below',
  'above mark': 'above',
  'above nwl': 'above',
};

/**
 * A gauge-glass reading as written: a fraction of the visible glass (see parseGaugeGlassLevel) or the level against
 * the maker's normal-water-line mark ("at mark", "below mark", "above mark"; "NWL" for "mark").
 */
export function parseGaugeGlassReading(text: string): GaugeGlassReading {
  if (typeof text === 'string') {
    const t = text.trim().toLowerCase().replace(/\s+/g, ' ');
    if (Object.hasOwn(MARK_WORDS, t)) return { fraction: null, mark: MARK_WORDS[t] };
  }
  try {
    return { fraction: parseGaugeGlassLevel(text), mark: null };
  } catch (e) {
    if (e instanceof TradeInputError && typeof text === 'string' && !/[\d%]/.test(text)) {
      throw new TradeInputError('level', `"${text}" is not a level; write a fraction of the glass such as 1/2, 5/8 or empty, or "at mark", "below mark", "above mark"`);
    }
    throw e;
  }
}

export type GaugeGlassAssessment = {
  /** Fraction of the visible glass, 0..1; null when the level was read against the maker's mark. */
  fraction: number | null;
  mark: NormalWaterLineMark | null;
  status: 'ok' | 'warning' | 'stop';
  flags: TradeFlag[];
};

const lowFlag = (message: string, value: number | null, threshold: number | null): TradeFlag => ({
  code: 'gauge_glass_low',
  severity: 'warning',
  message:
    `${message} Find out why the water is low (a leak, a blowdown left open, a feeder not working) before firing. ` +
    "Add water only to a cold boiler, to the maker's normal water line.",
  value,
  threshold,
  unit: value === null ? null : 'fraction of glass',
  source: NWL_SOURCE,
});

/** Judges the cold water level against the maker's normal-water-line mark. */
export function assessGaugeGlassMark(mark: NormalWaterLineMark): GaugeGlassAssessment {
  if (!NORMAL_WATER_LINE_MARKS.includes(mark)) throw new TradeInputError('mark', `must be one of at, below, above, got ${String(mark)}`);
  if (mark === 'below') {
    return { fraction: null, mark, status: 'warning', flags: [lowFlag("Cold water level below the maker's normal-water-line mark.", null, null)] };
  }
  if (mark === 'above') {
    const flag: TradeFlag = {
      code: 'gauge_glass_above_normal_line',
      severity: 'info',
      message: "Cold water level above the maker's normal-water-line mark: an overfilled steam boiler can carry water into the mains. Check the feeder and drain to the mark.",
      value: null,
      threshold: null,
      unit: null,
      source: NWL_SOURCE,
    };
    return { fraction: null, mark, status: 'ok', flags: [flag] };
  }
  return { fraction: null, mark, status: 'ok', flags: [] };
}

/** Judges a written gauge-glass reading (a fraction of the glass or a level against the maker's mark). */
export function assessGaugeGlassReading(reading: GaugeGlassReading): GaugeGlassAssessment {
  return reading.mark === null ? assessGaugeGlassLevel(reading.fraction) : assessGaugeGlassMark(reading.mark);
}

/** Judges a gauge-glass reading (fraction 0..1 of the visible glass), taken cold. */
export function assessGaugeGlassLevel(fraction: number): GaugeGlassAssessment {
  if (typeof fraction !== 'number' || !Number.isFinite(fraction) || fraction < 0 || fraction > 1) {
    throw new TradeInputError('fraction', `must be between 0 and 1, got ${String(fraction)}`);
  }
  if (fraction === 0) {
    return {
      fraction,
      mark: null,
      status: 'stop',
      flags: [
        {
          code: 'no_water_visible',
          severity: 'stop',
          message:
            'Gauge glass empty: no water visible. Do not fire the boiler. Do not add water to a hot boiler whose water is out of sight: ' +
            'shut off the burner and let the boiler cool.',
          value: 0,
          threshold: 0,
          unit: 'fraction of glass',
          source: 'common practice; boiler-operator guidance says the same',
        },
      ],
    };
  }
  if (fraction < GAUGE_GLASS_LOW_BELOW_FRACTION) {
    const shown = `${Math.round(fraction * 100)} %`;
    return { fraction, mark: null, status: 'warning', flags: [lowFlag(`Cold water level low: ${shown} of the glass, below a third.`, fraction, GAUGE_GLASS_LOW_BELOW_FRACTION)] };
  }
  if (fraction === 1) {
    return {
      fraction,
      mark: null,
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
  return { fraction, mark: null, status: 'ok', flags: [] };
}

const MARK_TEXT: Readonly<Record<NormalWaterLineMark, string>> = {
  at: "at the maker's normal-water-line mark",
  below: "below the maker's normal-water-line mark",
  above: "above the maker's normal-water-line mark",
};

/** "63 % of the glass", "below the maker's normal-water-line mark". */
export function describeGaugeGlassLevel(a: { fraction: number | null; mark?: NormalWaterLineMark | null }): string {
  if (a.fraction !== null) return `${Math.round(a.fraction * 100)} % of the glass`;
  return a.mark ? MARK_TEXT[a.mark] : 'not read';
}
