import { COMPONENT_TYPES, type ComponentType } from '../trade/component-types';

/**
 * The quick reasons the part-swap form offers, per part type: what a technician usually finds wrong with that part
 * (common practice). A tap fills the free-text reason, which stays editable; the cause (worn out, failed, upgraded...)
 * is asked separately. A company's own part type gets the generic list.
 */
export const GENERIC_QUICK_REASONS = ['worn', 'leaking', 'failed its test', 'cracked or broken', 'corroded'] as const;

export const QUICK_REASONS: Record<ComponentType, readonly string[]> = {
  thermocouple: ['low millivolts', 'pilot drops out', 'tip burnt or swollen', 'loose at the gas valve'],
  thermopile: ['low millivolts', 'pilot drops out', 'burnt or cracked'],
  pilot_assembly: ['pilot flame weak or lifting', 'orifice clogged', 'will not stay lit', 'corroded'],
  flame_sensor: ['low flame current', 'rod coated or dirty', 'cracked insulator', 'locks out after lighting'],
  hot_surface_igniter: ['cracked', 'does not glow', 'glows weakly, slow to light'],
  ignition_module: ['no spark or no ignition try', 'locks out', 'no gas to the valve'],
  gas_valve: ['will not open', 'will not close fully', 'leaking at the valve', 'pressure will not set'],
  burners: ['rusted or scaled', 'flame lifting or uneven', 'cracked or burnt through', 'ports clogged'],

  nozzle: ['clogged', 'spray pattern poor', 'wrong firing rate', 'dripping after shut-off'],
  oil_filter: ['clogged', 'water or sludge in the bowl', 'leaking at the gasket'],
  pump_strainer: ['clogged', 'gasket leaking'],
  electrodes: ['gap out of setting', 'tips worn or burnt', 'porcelain cracked'],
  cad_cell: ['dirty or sooted', 'reads too high in the light', 'flame not seen, locks out'],
  primary_control: ['locks out', 'no ignition on a call for heat', 'does not stop on flame failure'],
  fuel_pump: ['pressure low or unsteady', 'noisy', 'leaking at the seal', 'will not hold cut-off'],

  gauge_glass: ['etched or cloudy', 'leaking at washers', 'cracked', 'level hard to read'],
  gauge_glass_washers: ['leaking', 'hard and cracked'],
  low_water_cutoff_float: ['did not stop the burner', 'chamber full of sediment', 'float sticking', 'leaking at the blowdown valve'],
  low_water_cutoff_probe: ['did not stop the burner', 'probe coated with scale', 'control fault'],
  pressure_control: ['does not cut out at its setting', 'switch contacts burnt', 'setting drifts'],
  siphon_loop: ['clogged', 'leaking at a fitting', 'corroded'],
  safety_valve: ['seeping or dripping', 'did not reseat after the try-lever test', 'set pressure wrong for the boiler', 'corroded or painted over'],
  main_air_vent: ['does not close on steam', 'clogged, does not vent', 'spitting water'],
  radiator_air_vent: ['spitting water', 'hissing steam', 'stays shut, radiator cold'],

  relief_valve: ['seeping or dripping', 'did not reseat after the lever test', 'rating wrong for the boiler', 'corroded'],
  circulator: ['noisy', 'seized, does not move water', 'leaking at the flange'],
  expansion_tank: ['waterlogged', 'lost its pre-charge', 'water at the air valve', 'leaking'],
  fill_valve: ['does not hold the fill pressure', 'passes water, pressure creeps up', 'strainer clogged'],
  backflow_preventer: ['leaking or dripping', 'failed its test'],
  pressure_temperature_gauge: ['reads wrong', 'needle stuck', 'glass fogged or cracked'],

  automatic_water_feeder: ['feeds too often', 'does not feed', 'does not stop feeding', 'leaking'],
  thermostat: ['does not call for heat', 'reads the room wrong', 'display dead'],
  vent_damper: ['does not open fully', 'stuck shut, burner will not fire', 'motor or switch failed'],
};

const isKnownType = (code: string): code is ComponentType => Object.hasOwn(COMPONENT_TYPES, code);

/** The quick reasons for one part type, or the generic list for a type our catalog does not know. */
export function quickReasonsFor(typeCode: string): readonly string[] {
  return isKnownType(typeCode) ? QUICK_REASONS[typeCode] : GENERIC_QUICK_REASONS;
}
