import type { TradeFlag } from './trade-flag';
import { TradeInputError } from './trade-input-error';

/**
 * Where the water stood in the gauge glass when the low-water cutoff stopped the burner: still visible in the glass
 * (at or above its lowest visible part), or already below the lowest visible part (out of sight).
 */
export const CUTOFF_TRIP_POSITIONS = ['water_visible', 'below_visible'] as const;
export type CutoffTripPosition = (typeof CUTOFF_TRIP_POSITIONS)[number];

export const LOW_WATER_CUTOFF_RULE_SOURCE =
  'from memory: ASME Boiler and Pressure Vessel Code, Section IV (heating boilers), low-water fuel cutoff requirement: ' +
  'the fuel is cut off when the water falls to the lowest visible part of the gauge glass; ' +
  '13 NCAC 13 .0408 (read) puts that part at least 1 in above the lowest permissible water level';

const CAUTION = "Do not leave it firing; follow the control manufacturer's instructions, local codes and licensed practice.";

export const LOW_WATER_CUTOFF_FAILED: TradeFlag = {
  code: 'low_water_cutoff_failed',
  severity: 'stop',
  message: `The burner did not stop when the low-water cutoff was tested: the boiler is not protected against firing dry. ${CAUTION}`,
  value: null,
  threshold: null,
  unit: null,
  source: LOW_WATER_CUTOFF_RULE_SOURCE,
};

export const LOW_WATER_CUTOFF_TRIPPED_TOO_LOW: TradeFlag = {
  code: 'low_water_cutoff_tripped_too_low',
  severity: 'stop',
  message:
    'The low-water cutoff stopped the burner only after the water had gone below the lowest visible part of the gauge glass: ' +
    `it must cut off while water is still visible, so it failed its test. Do not add water to a hot boiler whose water is out of sight. ${CAUTION}`,
  value: null,
  threshold: null,
  unit: null,
  source: LOW_WATER_CUTOFF_RULE_SOURCE,
};

export type LowWaterCutoffAssessment = {
  passed: boolean;
  trippedWith: CutoffTripPosition | null;
  reason: string;
  flags: TradeFlag[];
  source: string;
};

/**
 * Judges a low-water cutoff test. It passes only when the burner stopped with water still visible in the glass;
 * a burner that kept firing, or stopped only once the water was out of sight, is a failed test and a stop.
 * Returns null while the test is not complete enough to judge (the burner stopped, position not yet recorded).
 */
export function assessLowWaterCutoff(input: { burnerStopped: boolean; trippedWith?: CutoffTripPosition | null }): LowWaterCutoffAssessment | null {
  if (typeof input.burnerStopped !== 'boolean') throw new TradeInputError('burnerStopped', `must be true or false, got ${String(input.burnerStopped)}`);
  const trippedWith = input.trippedWith ?? null;
  if (trippedWith !== null && !CUTOFF_TRIP_POSITIONS.includes(trippedWith)) {
    throw new TradeInputError('trippedWith', `must be one of ${CUTOFF_TRIP_POSITIONS.join(', ')}, got ${String(trippedWith)}`);
  }
  const base = { trippedWith, source: LOW_WATER_CUTOFF_RULE_SOURCE };
  if (!input.burnerStopped) return { ...base, passed: false, reason: 'The burner kept firing.', flags: [LOW_WATER_CUTOFF_FAILED] };
  if (trippedWith === 'below_visible') {
    return { ...base, passed: false, reason: 'Stopped only with the water below the lowest visible part of the glass.', flags: [LOW_WATER_CUTOFF_TRIPPED_TOO_LOW] };
  }
  if (trippedWith === 'water_visible') return { ...base, passed: true, reason: 'Stopped the burner with water still visible in the glass.', flags: [] };
  return null;
}
