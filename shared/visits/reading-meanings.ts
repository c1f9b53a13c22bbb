import { AIR_FREE_CO_CERTIFICATION_LIMIT_PPM } from '../trade/combustion-flags';
import { THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV, THERMOCOUPLE_TYPICAL_OPEN_CIRCUIT_MV } from '../trade/thermocouple';
import { describeGaugeGlassLevel } from '../trade/gauge-glass';

/** The part of a visit's stored results (computed and sourced by shared/trade when it was saved) the report reads. */
export type StoredResults = {
  combustion?: { efficiencyPct: number | null; coAirFreePpm: number; coAirFreeLimitPpm?: number; co2Pct?: number };
  gasInput?: { inputBtuPerHour: number; rating?: { status: 'over_fired' | 'under_fired' | 'within_rating'; allowedBtuPerHour: number } };
  thermocouple?: { status: string };
  gaugeGlass?: { fraction: number | null; mark?: 'at' | 'below' | 'above' | null; status?: 'ok' | 'warning' | 'stop' };
  lowWaterCutoff?: { type: 'float' | 'probe'; passed: boolean; trippedWith?: 'water_visible' | 'below_visible' | null };
};

export type ReadingMeaning = { reading: string; value: string; meaning: string };

const fmt = (n: number) => Math.round(n).toLocaleString('en-US');

/**
 * Each reading with what it means for the household, against the limit the trade code already uses. No new numbers:
 * the limits come from shared/trade, where each carries its source.
 */
export function readingMeanings(results: StoredResults, readings: { steamOperatingPsi?: number | null; thermocouple?: { openCircuitMv?: number | null } | null } = {}): ReadingMeaning[] {
  const out: ReadingMeaning[] = [];
  const c = results.combustion;
  if (c) {
    const co = Math.round(c.coAirFreePpm);
    // Results stored before the limit was chosen by appliance standard carry none: they were judged at 400 ppm.
    const limit = c.coAirFreeLimitPpm ?? AIR_FREE_CO_CERTIFICATION_LIMIT_PPM;
    out.push({
      reading: 'Carbon monoxide in the flue',
      value: `${fmt(co)} ppm air-free`,
      meaning:
        co <= limit / 2
          ? `well under the ${limit} ppm limit`
          : co <= limit
            ? `under the ${limit} ppm limit, but higher than we like to see`
            : `above the ${limit} ppm limit: the appliance needs attention`,
    });
    if (c.efficiencyPct !== null) {
      out.push({
        reading: 'Combustion efficiency',
        value: `${c.efficiencyPct.toFixed(1)} %`,
        meaning: `about ${Math.round(c.efficiencyPct)} % of the fuel's heat goes into the heating water or steam`,
      });
    }
  }
  const g = results.gasInput;
  if (g) {
    const r = g.rating;
    out.push({
      reading: 'Gas input (clocked at the meter)',
      value: `${fmt(g.inputBtuPerHour)} Btu/h`,
      meaning: !r
        ? 'no nameplate rating on file to compare with'
        : r.status === 'over_fired'
          ? `above the nameplate's ${fmt(r.allowedBtuPerHour)} Btu/h: burning more gas than it is built for`
          : r.status === 'under_fired'
            ? `below the nameplate's ${fmt(r.allowedBtuPerHour)} Btu/h by more than the company allows`
            : `within the nameplate's ${fmt(r.allowedBtuPerHour)} Btu/h`,
    });
  }
  const mv = readings.thermocouple?.openCircuitMv;
  if (typeof mv === 'number') {
    const { min, max } = THERMOCOUPLE_TYPICAL_OPEN_CIRCUIT_MV;
    out.push({
      reading: 'Pilot safety sensor (thermocouple), open circuit',
      value: `${mv} mV`,
      meaning:
        mv < THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV
          ? `below ${THERMOCOUPLE_REPLACE_BELOW_OPEN_CIRCUIT_MV} mV: weak, due for replacement`
          : mv < min
            ? `below the usual ${min}–${max} mV, still working`
            : `in or above the usual ${min}–${max} mV`,
    });
  }
  if (results.lowWaterCutoff) {
    out.push({
      reading: 'Low-water safety switch (cutoff) test',
      value: results.lowWaterCutoff.passed ? 'passed' : 'failed',
      meaning: results.lowWaterCutoff.passed
        ? 'the burner stopped when the water was lowered, as it should'
        : results.lowWaterCutoff.trippedWith === 'below_visible'
          ? 'the burner stopped only after the water was out of sight in the glass: too late, so the test failed'
          : 'the burner did not stop: the boiler is not protected against firing without water',
    });
  }
  if (results.gaugeGlass) {
    out.push({
      reading: 'Water in the gauge glass',
      value: describeGaugeGlassLevel(results.gaugeGlass),
      meaning: results.gaugeGlass.status === 'stop' ? 'too low to run safely' : results.gaugeGlass.status === 'warning' ? 'low: the cause needs finding before it runs on' : 'a safe water level',
    });
  }
  if (typeof readings.steamOperatingPsi === 'number') {
    out.push({ reading: 'Steam pressure while running', value: `${readings.steamOperatingPsi} psi`, meaning: 'as read on the boiler gauge' });
  }
  return out;
}
