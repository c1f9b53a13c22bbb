/**
 * A visit's stored results, said the way a homeowner can follow; the numbers go alongside for whoever wants them.
 * Wording only: every figure here was computed and sourced by shared/trade when the visit was saved.
 */
type Results = {
  combustion?: { efficiencyPct: number | null; coAirFreePpm: number };
  gasInput?: { inputBtuPerHour: number; rating?: { status: string } };
  thermocouple?: { status?: string };
  gaugeGlass?: { fraction: number | null };
  lowWaterCutoff?: { passed: boolean; trippedWith?: 'water_visible' | 'below_visible' | null };
};

// ANSI Z21 appliance standards' limit for vented heating appliances, air-free (secondary): used as the yardstick.
const CO_LIMIT_PPM = 400;

export function readingsInWords(raw: Record<string, unknown>): { words: string[]; numbers: Record<string, number> } {
  const r = raw as Results;
  const words: string[] = [];
  const numbers: Record<string, number> = {};
  if (r.combustion) {
    const { efficiencyPct, coAirFreePpm } = r.combustion;
    if (efficiencyPct !== null) {
      words.push(`The burner was turning about ${Math.round(efficiencyPct)} % of the fuel's heat into heat for the house.`);
      numbers.efficiencyPct = Number(efficiencyPct.toFixed(1));
    }
    words.push(
      coAirFreePpm <= CO_LIMIT_PPM / 4
        ? 'Carbon monoxide in the flue gas was low.'
        : coAirFreePpm <= CO_LIMIT_PPM
          ? 'Carbon monoxide in the flue gas was higher than we like to see; the technician noted it.'
          : 'Carbon monoxide in the flue gas was above the limit appliances are built to: the appliance needs attention.',
    );
    numbers.coAirFreePpm = Math.round(coAirFreePpm);
  }
  if (r.lowWaterCutoff) {
    words.push(
      r.lowWaterCutoff.passed
        ? 'The low-water safety switch was tested and stopped the burner, as it should.'
        : r.lowWaterCutoff.trippedWith === 'below_visible'
          ? 'The low-water safety switch stopped the burner too late, only after the water was out of sight: it failed its test.'
          : 'The low-water safety switch did not stop the burner when tested.',
    );
  }
  if (r.gaugeGlass) {
    const fraction = r.gaugeGlass.fraction;
    if (fraction !== null) numbers.gaugeGlassFraction = Number(fraction.toFixed(3));
    words.push(fraction === null || fraction > 0 ? 'Water showed in the gauge glass.' : 'No water showed in the gauge glass.');
  }
  if (r.gasInput?.rating?.status === 'over_fired') words.push('The burner was burning more gas than its rating; the technician adjusted or noted it.');
  if (r.thermocouple?.status === 'replace') words.push('The pilot safety sensor (thermocouple) was weak.');
  return { words, numbers };
}
