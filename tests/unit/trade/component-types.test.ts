import { describe, it, expect } from 'vitest';
import { COMPONENT_TYPE_CODES, COMPONENT_TYPES, formatSpec } from '../../../shared/trade/component-types';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

// The component list from the product brief, by group.
const EXPECTED = {
  gas: ['thermocouple', 'thermopile', 'pilot_assembly', 'flame_sensor', 'hot_surface_igniter', 'ignition_module', 'gas_valve', 'burners'],
  oil: ['nozzle', 'oil_filter', 'pump_strainer', 'electrodes', 'cad_cell', 'primary_control', 'fuel_pump'],
  steam: [
    'gauge_glass', 'gauge_glass_washers', 'low_water_cutoff_float', 'low_water_cutoff_probe', 'pressure_control',
    'siphon_loop', 'safety_valve', 'main_air_vent', 'radiator_air_vent',
  ],
  hot_water: ['relief_valve', 'circulator', 'expansion_tank', 'fill_valve', 'backflow_preventer', 'pressure_temperature_gauge'],
  common: ['automatic_water_feeder', 'thermostat', 'vent_damper'],
};

describe('component types', () => {
  it('lists exactly the component types of the brief, in their groups', () => {
    for (const [group, types] of Object.entries(EXPECTED)) {
      expect(COMPONENT_TYPE_CODES.filter((t) => COMPONENT_TYPES[t].group === group)).toEqual(types);
    }
    expect(COMPONENT_TYPE_CODES).toHaveLength(Object.values(EXPECTED).flat().length);
  });

  it('uses generic labels', () => {
    expect(COMPONENT_TYPES.low_water_cutoff_float.label).toBe('float-type low-water cutoff');
    expect(COMPONENT_TYPES.siphon_loop.label).toBe('siphon loop (pigtail)');
    for (const code of COMPONENT_TYPE_CODES) expect(COMPONENT_TYPES[code].label).toMatch(/^[a-z]/);
  });
});

describe('formatSpec', () => {
  it.each([
    ['thermocouple', { lengthIn: 24 }, '24 in'],
    ['gauge_glass', { lengthIn: 12, diameterIn: 0.625 }, '12 in, dia. 5/8 in'],
    ['gauge_glass', { diameterIn: 0.75, lengthIn: 10.5 }, '10 1/2 in, dia. 3/4 in'],
    ['nozzle', { firingRateGph: 0.85, sprayAngleDeg: 80, pattern: 'hollow' }, '0.85 gph, 80°, hollow'],
    ['nozzle', { pattern: 'semi_solid', firingRateGph: 1.1, sprayAngleDeg: 60 }, '1.1 gph, 60°, semi-solid'],
    ['safety_valve', { setPressurePsi: 15 }, '15 psi'],
    ['relief_valve', { setPressurePsi: 30, inletSizeIn: 0.75, capacityBtuPerHour: 210_000 }, '30 psi, inlet 3/4 in, 210,000 Btu/h'],
    ['expansion_tank', { volumeGal: 4.4, prechargePsi: 12 }, '4.4 gal, precharge 12 psi'],
    ['circulator', {}, ''],
    ['thermocouple', { lengthIn: null }, ''],
  ] as const)('%s %j → %j', (type, spec, expected) => {
    expect(formatSpec(type, spec)).toBe(expected);
  });

  it('gives the same key for the same part however the numbers were typed', () => {
    expect(formatSpec('nozzle', { firingRateGph: 0.8500000001, sprayAngleDeg: 80, pattern: 'solid' })).toBe(
      formatSpec('nozzle', { pattern: 'solid', sprayAngleDeg: 80.0, firingRateGph: 0.85 }),
    );
  });

  it.each([
    ['thermocouple', { length: 24 }],
    ['thermocouple', { lengthIn: -3 }],
    ['thermocouple', { lengthIn: '24' }],
    ['nozzle', { pattern: 'cone' }],
    ['flux_capacitor', {}],
  ])('rejects %s %j', (type, spec) => {
    expect(() => formatSpec(type as never, spec as never)).toThrow(TradeInputError);
  });
});
