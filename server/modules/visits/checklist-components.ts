import { COMPONENT_TYPE_CODES, type ComponentType } from '../../../shared/trade/component-types';

/** Checklist words that name a part without using its type code. */
const ALIASES: Record<string, ComponentType[]> = {
  low_water_cutoff: ['low_water_cutoff_float', 'low_water_cutoff_probe'],
  lwco: ['low_water_cutoff_float', 'low_water_cutoff_probe'],
  safety_relief_valve: ['safety_valve', 'relief_valve'],
  relief: ['relief_valve'],
  pilot: ['pilot_assembly'],
  igniter: ['hot_surface_igniter'],
  flame_rod: ['flame_sensor'],
  pigtail: ['siphon_loop'],
  feeder: ['automatic_water_feeder'],
  pt_gauge: ['pressure_temperature_gauge'],
};

// Longest first, so "gauge_glass_washers" is matched before "gauge_glass".
const CODES_LONGEST_FIRST = [...COMPONENT_TYPE_CODES, ...Object.keys(ALIASES)].sort((a, b) => b.length - a.length);

const containsWord = (key: string, word: string) =>
  [word, `${word}s`].some((w) => key === w || key.startsWith(`${w}_`) || key.endsWith(`_${w}`) || key.includes(`_${w}_`));

/**
 * The component types a checklist item is about, read from its key: "thermocouple", "gauge_glass",
 * "lwco_test", "pilot_thermocouple" (both parts) and so on. A key that names no part gives an empty list.
 */
export function componentTypesForChecklistKey(key: string): ComponentType[] {
  const k = key.toLowerCase();
  const words: string[] = [];
  for (const w of CODES_LONGEST_FIRST) {
    // "gauge_glass" inside an already matched "gauge_glass_washers" is the same word, not a second part.
    if (containsWord(k, w) && !words.some((longer) => longer.includes(w))) words.push(w);
  }
  const types = words.flatMap((w) => (Object.hasOwn(ALIASES, w) ? ALIASES[w] : [w as ComponentType]));
  return [...new Set(types)];
}
