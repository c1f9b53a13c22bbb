import { requireNumber, requireOneOf, TradeInputError } from './trade-input-error';

export const COMPONENT_GROUPS = ['gas', 'oil', 'steam', 'hot_water', 'common'] as const;
export type ComponentGroup = (typeof COMPONENT_GROUPS)[number];

type NumberUnit = 'in' | 'psi' | 'gph' | 'deg' | 'degF' | 'gal' | 'V' | 'btu_per_hour';
export type SpecField =
  | { key: string; label: string; kind: 'number'; unit: NumberUnit; prefix?: string }
  | { key: string; label: string; kind: 'choice'; options: Readonly<Record<string, string>> };

export type ComponentTypeDefinition = { group: ComponentGroup; label: string; specFields: readonly SpecField[] };

const lengthIn: SpecField = { key: 'lengthIn', label: 'length', kind: 'number', unit: 'in' };
const diameterIn: SpecField = { key: 'diameterIn', label: 'diameter', kind: 'number', unit: 'in', prefix: 'dia. ' };
const pipeSizeIn: SpecField = { key: 'pipeSizeIn', label: 'pipe size', kind: 'number', unit: 'in' };
const gasFuel: SpecField = { key: 'fuel', label: 'fuel', kind: 'choice', options: { natural_gas: 'natural gas', propane: 'propane' } };
const setPressurePsi: SpecField = { key: 'setPressurePsi', label: 'set pressure', kind: 'number', unit: 'psi' };
const inletSizeIn: SpecField = { key: 'inletSizeIn', label: 'inlet size', kind: 'number', unit: 'in', prefix: 'inlet ' };

/** Every component type the due engine and stock counts know, with generic names and the specs that tell parts apart. */
export const COMPONENT_TYPES = {
  thermocouple: { group: 'gas', label: 'thermocouple', specFields: [lengthIn] },
  thermopile: { group: 'gas', label: 'thermopile', specFields: [lengthIn] },
  pilot_assembly: { group: 'gas', label: 'pilot assembly', specFields: [gasFuel] },
  flame_sensor: { group: 'gas', label: 'flame sensor (flame rod)', specFields: [] },
  hot_surface_igniter: {
    group: 'gas',
    label: 'hot-surface igniter',
    specFields: [{ key: 'voltageV', label: 'voltage', kind: 'number', unit: 'V' }],
  },
  ignition_module: { group: 'gas', label: 'ignition control module', specFields: [] },
  gas_valve: { group: 'gas', label: 'gas valve', specFields: [pipeSizeIn, gasFuel] },
  burners: { group: 'gas', label: 'burners', specFields: [gasFuel] },

  nozzle: {
    group: 'oil',
    label: 'oil burner nozzle',
    specFields: [
      { key: 'firingRateGph', label: 'firing rate', kind: 'number', unit: 'gph' },
      { key: 'sprayAngleDeg', label: 'spray angle', kind: 'number', unit: 'deg' },
      { key: 'pattern', label: 'spray pattern', kind: 'choice', options: { solid: 'solid', hollow: 'hollow', semi_solid: 'semi-solid' } },
    ],
  },
  oil_filter: { group: 'oil', label: 'oil filter', specFields: [] },
  pump_strainer: { group: 'oil', label: 'fuel pump strainer', specFields: [] },
  electrodes: { group: 'oil', label: 'ignition electrodes', specFields: [] },
  cad_cell: { group: 'oil', label: 'cad cell (flame detector)', specFields: [] },
  primary_control: { group: 'oil', label: 'oil primary control', specFields: [] },
  fuel_pump: {
    group: 'oil',
    label: 'oil fuel pump',
    specFields: [{ key: 'stages', label: 'stages', kind: 'choice', options: { single: 'single-stage', two: 'two-stage' } }],
  },

  gauge_glass: { group: 'steam', label: 'gauge glass', specFields: [lengthIn, diameterIn] },
  gauge_glass_washers: { group: 'steam', label: 'gauge glass washers', specFields: [diameterIn] },
  low_water_cutoff_float: { group: 'steam', label: 'float-type low-water cutoff', specFields: [] },
  low_water_cutoff_probe: { group: 'steam', label: 'probe-type low-water cutoff', specFields: [] },
  pressure_control: {
    group: 'steam',
    label: 'steam pressure control',
    specFields: [{ key: 'maxPsi', label: 'top of range', kind: 'number', unit: 'psi', prefix: 'max ' }],
  },
  siphon_loop: { group: 'steam', label: 'siphon loop (pigtail)', specFields: [pipeSizeIn] },
  safety_valve: { group: 'steam', label: 'steam safety valve', specFields: [setPressurePsi, inletSizeIn] },
  main_air_vent: { group: 'steam', label: 'main air vent', specFields: [] },
  radiator_air_vent: { group: 'steam', label: 'radiator air vent', specFields: [] },

  relief_valve: {
    group: 'hot_water',
    label: 'boiler relief valve',
    specFields: [
      setPressurePsi,
      inletSizeIn,
      { key: 'capacityBtuPerHour', label: 'relieving capacity', kind: 'number', unit: 'btu_per_hour' },
    ],
  },
  circulator: { group: 'hot_water', label: 'circulator pump', specFields: [] },
  expansion_tank: {
    group: 'hot_water',
    label: 'expansion tank',
    specFields: [
      { key: 'volumeGal', label: 'volume', kind: 'number', unit: 'gal' },
      { key: 'prechargePsi', label: 'precharge', kind: 'number', unit: 'psi', prefix: 'precharge ' },
    ],
  },
  fill_valve: { group: 'hot_water', label: 'boiler fill valve (pressure-reducing)', specFields: [pipeSizeIn] },
  backflow_preventer: { group: 'hot_water', label: 'backflow preventer', specFields: [pipeSizeIn] },
  pressure_temperature_gauge: {
    group: 'hot_water',
    label: 'pressure/temperature gauge',
    specFields: [
      { key: 'pressureMaxPsi', label: 'pressure scale top', kind: 'number', unit: 'psi' },
      { key: 'temperatureMaxF', label: 'temperature scale top', kind: 'number', unit: 'degF' },
    ],
  },

  automatic_water_feeder: { group: 'common', label: 'automatic water feeder', specFields: [] },
  thermostat: { group: 'common', label: 'thermostat', specFields: [] },
  vent_damper: { group: 'common', label: 'automatic vent damper', specFields: [diameterIn] },
} as const satisfies Record<string, ComponentTypeDefinition>;

export type ComponentType = keyof typeof COMPONENT_TYPES;
export const COMPONENT_TYPE_CODES = Object.keys(COMPONENT_TYPES) as ComponentType[];

export type ComponentSpec = Readonly<Record<string, number | string | null | undefined>>;

export function requireComponentType(field: string, value: unknown): ComponentType {
  return requireOneOf(field, value, COMPONENT_TYPE_CODES);
}

/**
 * A short, stable description of a part's spec, e.g. "24 in" or "0.85 gph, 80°, hollow", used as a stock-count key.
 * Fields follow the type's definition order; missing ones are left out; unknown keys and bad values throw.
 */
export function formatSpec(type: ComponentType, spec: ComponentSpec): string {
  const fields: readonly SpecField[] = COMPONENT_TYPES[requireComponentType('type', type)].specFields;
  for (const key of Object.keys(spec)) {
    if (!fields.some((f) => f.key === key)) throw new TradeInputError(`spec.${key}`, `is not a spec field of ${type}`);
  }
  const parts: string[] = [];
  for (const field of fields) {
    const value = spec[field.key];
    if (value === undefined || value === null) continue;
    if (field.kind === 'choice') {
      parts.push(field.options[requireOneOf(`spec.${field.key}`, value, Object.keys(field.options))]);
    } else {
      parts.push((field.prefix ?? '') + formatQuantity(requireNumber(`spec.${field.key}`, value, { minExclusive: 0 }), field.unit));
    }
  }
  return parts.join(', ');
}

function formatQuantity(value: number, unit: NumberUnit): string {
  switch (unit) {
    case 'in':
      return `${formatInches(value)} in`;
    case 'deg':
      return `${plain(value)}°`;
    case 'degF':
      return `${plain(value)} °F`;
    case 'btu_per_hour':
      return `${plain(value).replace(/\B(?=(\d{3})+(?!\d))/g, ',')} Btu/h`;
    default:
      return `${plain(value)} ${unit}`;
  }
}

/** Up to three decimals, trailing zeros dropped, so 0.8500000001 and 0.85 give the same key. */
const plain = (value: number) => String(Number(value.toFixed(3)));

/** Sixteenths as a fraction (0.625 → "5/8", 1.25 → "1 1/4"); anything else as a decimal. */
function formatInches(value: number): string {
  const sixteenths = Math.round(value * 16);
  if (Math.abs(sixteenths - value * 16) > 1e-9) return plain(value);
  const whole = Math.floor(sixteenths / 16);
  let numerator = sixteenths % 16;
  let denominator = 16;
  while (numerator > 0 && numerator % 2 === 0) {
    numerator /= 2;
    denominator /= 2;
  }
  if (numerator === 0) return String(whole);
  return whole === 0 ? `${numerator}/${denominator}` : `${whole} ${numerator}/${denominator}`;
}
