import type { ReadingKey } from '../schemas/visits';

/** What each readings block is called in lists of what is missing, on the visit and in the template editor. */
export const READING_LABELS: Record<ReadingKey, string> = {
  combustion: 'Combustion test',
  gasInput: 'Gas input (meter clocked)',
  thermocouple: 'Thermocouple millivolts',
  gaugeGlassLevel: 'Gauge-glass water level',
  lowWaterCutoff: 'Low-water cutoff test',
  steamOperatingPsi: 'Steam operating pressure',
  pressureControlCutInPsi: 'Pressure control cut-in',
  pressureControlCutOutPsi: 'Pressure control cut-out',
  fillPressurePsi: 'Fill pressure',
  expansionTankPrechargePsi: 'Expansion tank pre-charge',
  gasInletInWc: 'Gas inlet pressure',
  gasManifoldInWc: 'Manifold pressure',
  oil: 'Oil burner readings',
  makeupWater: 'Makeup water',
};

/** Readings only a burner can give: an electric boiler has no flue, pilot or oil pump, so they are never required of it. */
export const FIRED_ONLY_READINGS: readonly ReadingKey[] = ['combustion', 'gasInput', 'thermocouple', 'gasInletInWc', 'gasManifoldInWc', 'oil'];
