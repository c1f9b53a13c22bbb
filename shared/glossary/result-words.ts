/**
 * What each worked-out result on the visit means, in the technician's words: shown under the number on the phone and
 * on the completed visit. The working itself (formula and source) comes with each result from shared/trade/ and is
 * shown only when asked for.
 */
export type ResultWords = { label: string; meaning: string };

export const RESULT_WORDS = {
  co2: { label: 'CO2', meaning: 'Carbon dioxide in the flue, worked out from your O2 and the fuel.' },
  excessAir: { label: 'Excess air', meaning: 'Air beyond what the fire needs, worked out from your O2.' },
  coAirFree: { label: 'CO air-free', meaning: 'Your CO reading with the extra air taken out, so it can be held against the limit.' },
  efficiency: {
    label: 'Efficiency (HHV)',
    meaning: 'How much of the fuel’s heat goes into the water, worked out from your O2, flue and air temperatures (gross basis).',
  },
  gasInput: { label: 'Gas input', meaning: 'Gas burned per hour, worked out from your meter clocking and the gas’s heating value.' },
  thermocouple: { label: 'Thermocouple', meaning: 'Your millivolt readings held against the usual range.' },
  gaugeGlass: { label: 'Gauge glass', meaning: 'Your water level held against the safe level.' },
  lowWaterCutoff: { label: 'Low-water cutoff', meaning: 'What your test showed.' },
} as const satisfies Record<string, ResultWords>;

export type ResultKey = keyof typeof RESULT_WORDS;

/** Said once over the stored results: they are what the record keeps, worked out from the readings last saved. */
export const STORED_RESULTS_NOTE = 'Worked out from your readings when they were last saved. This is what the life record keeps.';
/** Said over the live results on the phone. */
export const LIVE_RESULTS_NOTE = 'Worked out on this phone from your readings as you type.';
