import { describe, expect, it } from 'vitest';
import { readingsInWords } from '../../server/modules/homeowner/readings-in-words';

describe('readings in plain words for the homeowner', () => {
  it('judges air-free CO against the 400 ppm appliance limit', () => {
    // Source: ANSI Z21 appliance standards, 400 ppm air-free for vented heating equipment, as quoted in trade literature (secondary).
    expect(readingsInWords({ combustion: { efficiencyPct: 81.6, coAirFreePpm: 40 } }).words).toEqual([
      "The burner was turning about 82 % of the fuel's heat into heat for the house.",
      'Carbon monoxide in the flue gas was low.',
    ]);
    expect(readingsInWords({ combustion: { efficiencyPct: null, coAirFreePpm: 250 } }).words).toEqual([
      'Carbon monoxide in the flue gas was higher than we like to see; the technician noted it.',
    ]);
    const high = readingsInWords({ combustion: { efficiencyPct: 80, coAirFreePpm: 401 } });
    expect(high.words[1]).toMatch(/above the limit appliances are built to/);
    expect(high.numbers).toEqual({ efficiencyPct: 80, coAirFreePpm: 401 });
  });

  it('says whether the low-water cutoff stopped the burner and whether water showed in the glass', () => {
    expect(readingsInWords({ lowWaterCutoff: { passed: false }, gaugeGlass: { fraction: 0 } }).words).toEqual([
      'The low-water safety switch did not stop the burner when tested.',
      'No water showed in the gauge glass.',
    ]);
    expect(readingsInWords({ lowWaterCutoff: { passed: false, trippedWith: 'below_visible' }, gaugeGlass: { fraction: null } }).words).toEqual([
      'The low-water safety switch stopped the burner too late, only after the water was out of sight: it failed its test.',
      'Water showed in the gauge glass.',
    ]);
  });
});
