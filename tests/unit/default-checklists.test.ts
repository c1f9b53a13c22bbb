import { describe, expect, it } from 'vitest';
import { DEFAULT_CHECKLISTS } from '../../server/modules/checklists/default-checklists';
import { requiredReadingsFor } from '../../shared/visits/required-readings';
import { checklistTemplateInput } from '../../shared/schemas/records';

describe('seeded checklist templates', () => {
  it('each passes the same validation a manager’s edit must pass, so a seeded template can be saved unchanged', () => {
    for (const template of DEFAULT_CHECKLISTS) {
      const result = checklistTemplateInput.safeParse({ name: template.name, items: template.items, requiredReadings: template.requiredReadings });
      expect({ name: template.name, issues: result.success ? [] : result.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) }).toEqual({
        name: template.name,
        issues: [],
      });
    }
  });

  it('require the combustion test on every annual visit and the low-water cutoff test on steam, each recorded by an item', () => {
    // common practice: an annual service of a fired boiler includes an analyzer combustion test; a steam boiler's a low-water cutoff test.
    for (const template of DEFAULT_CHECKLISTS) {
      const expected = template.applianceKind === 'steam_boiler' ? ['combustion', 'lowWaterCutoff'] : ['combustion'];
      expect(requiredReadingsFor(template, 'annual_maintenance')).toEqual(expected);
      expect(template.requiredReadings.annual_maintenance).toEqual(expected);
      expect(requiredReadingsFor(template, 'repair')).toEqual([]);
    }
  });

  it('a required reading no item records is not required of a visit', () => {
    const template = { items: [{ key: 'a', section: 'S', label: 'A', readings: ['combustion'] }], requiredReadings: { annual_maintenance: ['combustion', 'lowWaterCutoff'] } };
    expect(requiredReadingsFor(template, 'annual_maintenance')).toEqual(['combustion']);
  });
});

describe('seeded checklist safety steps', () => {
  const keysOf = (name: string) => {
    const template = DEFAULT_CHECKLISTS.find((t) => t.name === name);
    if (!template) throw new Error(`no template ${name}`);
    return template.items.map((i) => i.key);
  };
  const GAS = ['pilot_outage', 'electronic_ignition', 'rollout_spill_switch', 'manifold_vs_nameplate', 'combustion_air', 'vent_damper'];
  const STEAM = ['high_limit_manual_reset', 'safety_valve_try_lever', 'safety_valve_set_pressure', 'lwco_slow_drain', 'auto_water_feeder'];
  const HOT_WATER = ['expansion_precharge_vs_fill', 'air_elimination', 'hw_makeup_water', 'hw_lwco', 'relief_valve_lift', 'anti_scald'];
  const OIL = ['pump_vacuum', 'pump_pressure', 'emergency_switch', 'smoke_test'];

  it.each([
    ['Steam boiler, gas-fired: annual maintenance', [...STEAM, ...GAS]],
    ['Steam boiler, oil-fired: annual maintenance', [...STEAM, ...OIL]],
    ['Hot-water boiler, gas-fired: annual maintenance', [...HOT_WATER, ...GAS]],
    ['Hot-water boiler, oil-fired: annual maintenance', [...HOT_WATER, ...OIL]],
    ['Storage water heater, gas-fired: annual maintenance', ['tp_relief_valve', 'wh_anti_scald', ...GAS]],
    ['Warm-air furnace, gas-fired: annual maintenance', ['heat_exchanger', 'furnace_high_limit', ...GAS]],
  ])('%s has its safety steps and a CO alarm check', (name, expected) => {
    expect(keysOf(name)).toEqual(expect.arrayContaining([...expected, 'co_alarm']));
  });

  it('keys are unique within every template and every added safety step carries a caution deferring to the instructions and codes', () => {
    for (const template of DEFAULT_CHECKLISTS) {
      const keys = template.items.map((i) => i.key);
      expect(new Set(keys).size).toBe(keys.length);
    }
    const steam = DEFAULT_CHECKLISTS.find((t) => t.applianceKind === 'steam_boiler')!;
    expect(steam.items.find((i) => i.key === 'water_level')?.caution).toMatch(/Never add cold water to a hot boiler/);
    // Source: ASME Boiler and Pressure Vessel Code Section IV, low-pressure steam boilers at 15 psi or less
    expect(steam.items.find((i) => i.key === 'safety_valve_set_pressure')?.label).toMatch(/15 psig or less/);
    for (const key of ['high_limit_manual_reset', 'safety_valve_try_lever', 'pilot_outage', 'rollout_spill_switch', 'co_alarm']) {
      expect(steam.items.find((i) => i.key === key)?.caution).toMatch(/manufacturer's instructions and local codes/);
    }
  });
});
