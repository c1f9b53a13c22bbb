import { describe, expect, it } from 'vitest';
import { AIR_FREE_CO_CERTIFICATION_LIMIT_PPM } from '../../shared/trade/combustion-flags';
import { readingMeanings } from '../../shared/visits/reading-meanings';

describe('readingMeanings', () => {
  it('says carbon monoxide against the certification limit the trade code uses', () => {
    // Source: ANSI Z21 vented-appliance standards, 400 ppm air-free CO (the constant in shared/trade/combustion-flags.ts).
    expect(AIR_FREE_CO_CERTIFICATION_LIMIT_PPM).toBe(400);
    const [co] = readingMeanings({ combustion: { efficiencyPct: null, coAirFreePpm: 35 } });
    expect(`${co.reading}: ${co.value}, ${co.meaning}`).toBe('Carbon monoxide in the flue: 35 ppm air-free, well under the 400 ppm limit');
    expect(readingMeanings({ combustion: { efficiencyPct: null, coAirFreePpm: 350 } })[0].meaning).toBe('under the 400 ppm limit, but higher than we like to see');
    expect(readingMeanings({ combustion: { efficiencyPct: null, coAirFreePpm: 401 } })[0].meaning).toBe('above the 400 ppm limit: the appliance needs attention');
  });

  it('reads the thermocouple against the typical and replace-below millivolts', () => {
    // Source: Basic HVAC (BCcampus), ch. 19: open circuit usually 25–30 mV; from memory: replace below about 18 mV.
    const mv = (openCircuitMv: number) => readingMeanings({}, { thermocouple: { openCircuitMv } })[0].meaning;
    expect(mv(12)).toBe('below 18 mV: weak, due for replacement');
    expect(mv(20)).toBe('below the usual 25–30 mV, still working');
    expect(mv(27)).toBe('in or above the usual 25–30 mV');
  });

  it('says a failed low-water cutoff test and a gas input over the nameplate plainly', () => {
    const [lwco, gas] = [
      readingMeanings({ lowWaterCutoff: { type: 'float', passed: false } })[0],
      readingMeanings({ gasInput: { inputBtuPerHour: 131_000, rating: { status: 'over_fired', allowedBtuPerHour: 125_000 } } })[0],
    ];
    expect(lwco).toEqual({ reading: 'Low-water safety switch (cutoff) test', value: 'failed', meaning: 'the burner did not stop: the boiler is not protected against firing without water' });
    expect(gas.value).toBe('131,000 Btu/h');
    expect(gas.meaning).toBe("above the nameplate's 125,000 Btu/h: burning more gas than it is built for");
    expect(readingMeanings({})).toEqual([]);
  });

  it('says a cutoff that tripped with the water out of sight failed, and why', () => {
    // from memory: ASME BPVC Section IV: the cutoff must act with water still visible in the gauge glass
    expect(readingMeanings({ lowWaterCutoff: { type: 'float', passed: false, trippedWith: 'below_visible' } })[0]).toMatchObject({
      value: 'failed',
      meaning: 'the burner stopped only after the water was out of sight in the glass: too late, so the test failed',
    });
  });

  it("words a level read against the maker's mark", () => {
    // common practice: the boiler maker's normal-water-line mark governs the cold level
    expect(readingMeanings({ gaugeGlass: { fraction: null, mark: 'below', status: 'warning' } })[0]).toMatchObject({ value: "below the maker's normal-water-line mark" });
  });
});
