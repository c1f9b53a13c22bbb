import type { Faker } from '@faker-js/faker';
import type { ComponentType } from '../../../shared/trade/component-types';
import type { ApplianceKind, Fuel, IgnitionType } from '../../../shared/schemas/enums';

/** One place a part sits on an appliance, with how often (in years) it is swapped in the demo and why. */
export type PartSlot = {
  typeCode: ComponentType;
  spec: Record<string, string | number>;
  description?: string;
  /** Years between swaps, or null when the part stays for life in the demo. */
  swapEveryYears: [number, number] | null;
  reasons: string[];
};

export type DemoApplianceShape = { kind: ApplianceKind; fuel: Fuel; ignitionType: IgnitionType; inputBtuh: number | null; firingRateGph: number | null; steamLwco: 'float' | 'probe' };

const gasFuel = (fuel: Fuel) => (fuel === 'propane' ? 'propane' : 'natural_gas');

function gasParts(f: Faker, a: DemoApplianceShape): PartSlot[] {
  const fuel = gasFuel(a.fuel);
  const common: PartSlot[] = [
    { typeCode: 'gas_valve', spec: { pipeSizeIn: 0.5, fuel }, swapEveryYears: [18, 25], reasons: ['pilot safety shutoff slow to close', 'regulator would not hold manifold pressure'] },
    { typeCode: 'burners', spec: { fuel }, swapEveryYears: [16, 21], reasons: ['burner ports rusted; flame lifting', 'burners cracked; flame uneven'] },
  ];
  if (a.ignitionType === 'standing_pilot') {
    return [
      {
        typeCode: 'thermocouple',
        spec: { lengthIn: f.helpers.arrayElement([18, 24, 24, 30, 36]) },
        swapEveryYears: [3, 7],
        reasons: ['would not hold the pilot', 'open circuit below 18 mV', 'tip burned and pitted', 'pilot dropped out on cold mornings'],
      },
      { typeCode: 'pilot_assembly', spec: { fuel }, swapEveryYears: [7, 10], reasons: ['pilot hood burned through', 'pilot orifice fouled; flame lazy and yellow'] },
      ...common,
    ];
  }
  return [
    { typeCode: 'flame_sensor', spec: {}, swapEveryYears: [4, 8], reasons: ['flame signal weak after cleaning', 'rod cracked at the ceramic'] },
    { typeCode: 'ignition_module', spec: {}, swapEveryYears: [12, 18], reasons: ['intermittent lockout on ignition'] },
    ...common,
  ];
}

function oilParts(f: Faker, a: DemoApplianceShape): PartSlot[] {
  const annual = ['replaced at the annual service'];
  return [
    {
      typeCode: 'nozzle',
      spec: { firingRateGph: a.firingRateGph ?? 0.75, sprayAngleDeg: f.helpers.arrayElement([60, 70, 80, 80]), pattern: f.helpers.arrayElement(['hollow', 'hollow', 'solid', 'semi_solid']) },
      swapEveryYears: [1, 1],
      reasons: annual,
    },
    { typeCode: 'oil_filter', spec: {}, description: 'spin-on cartridge', swapEveryYears: [1, 1], reasons: annual },
    { typeCode: 'pump_strainer', spec: {}, swapEveryYears: [3, 5], reasons: ['strainer clogged with sludge', 'gasket torn when cleaned'] },
    { typeCode: 'electrodes', spec: {}, swapEveryYears: [5, 8], reasons: ['electrode tips worn; gap would not hold', 'porcelain cracked'] },
    { typeCode: 'cad_cell', spec: {}, swapEveryYears: [6, 10], reasons: ['slow to prove flame; resistance high', 'cell face crazed'] },
    { typeCode: 'primary_control', spec: {}, swapEveryYears: [12, 18], reasons: ['nuisance lockouts'] },
    { typeCode: 'fuel_pump', spec: { stages: 'single' }, swapEveryYears: [15, 22], reasons: ['pump would not hold pressure', 'shaft seal leaking'] },
  ];
}

function steamParts(f: Faker, a: DemoApplianceShape): PartSlot[] {
  const glassLength = f.helpers.arrayElement([10, 12, 12, 14]);
  return [
    { typeCode: 'gauge_glass', spec: { lengthIn: glassLength, diameterIn: 0.625 }, swapEveryYears: [6, 12], reasons: ['glass etched', 'glass cloudy; level hard to read', 'cracked at the top nut'] },
    { typeCode: 'gauge_glass_washers', spec: { diameterIn: 0.625 }, swapEveryYears: [6, 12], reasons: ['washers hard and weeping'] },
    a.steamLwco === 'float'
      ? { typeCode: 'low_water_cutoff_float', spec: {}, swapEveryYears: [18, 25], reasons: ['float chamber packed with sludge; slow to trip'] }
      : { typeCode: 'low_water_cutoff_probe', spec: {}, swapEveryYears: [15, 22], reasons: ['probe scaled; control would not reset'] },
    { typeCode: 'pressure_control', spec: { maxPsi: f.helpers.arrayElement([5, 9, 10]) }, swapEveryYears: [15, 20], reasons: ['switch contacts pitted; cut-out wandered'] },
    { typeCode: 'siphon_loop', spec: { pipeSizeIn: 0.25 }, swapEveryYears: [12, 20], reasons: ['loop plugged with scale'] },
    { typeCode: 'safety_valve', spec: { setPressurePsi: 15, inletSizeIn: 0.75 }, swapEveryYears: [15, 25], reasons: ['seeping after the lift test', 'would not reseat'] },
    { typeCode: 'main_air_vent', spec: {}, swapEveryYears: [8, 14], reasons: ['stuck closed; main slow to heat'] },
    { typeCode: 'radiator_air_vent', spec: {}, description: 'set of radiator vents', swapEveryYears: [6, 12], reasons: ['several vents spitting water'] },
  ];
}

function hotWaterParts(f: Faker, a: DemoApplianceShape): PartSlot[] {
  const capacity = Math.max(a.inputBtuh ?? 0, Math.round((a.firingRateGph ?? 0) * 140_000), 100_000);
  return [
    {
      typeCode: 'relief_valve',
      spec: { setPressurePsi: 30, inletSizeIn: 0.75, capacityBtuPerHour: Math.ceil(capacity / 25_000) * 25_000 },
      swapEveryYears: [8, 14],
      reasons: ['weeping at the seat', 'did not reseat after the test'],
    },
    { typeCode: 'circulator', spec: {}, swapEveryYears: [9, 14], reasons: ['bearing noise', 'seized after the summer'] },
    { typeCode: 'expansion_tank', spec: { volumeGal: f.helpers.arrayElement([2, 4.4, 4.4]), prechargePsi: 12 }, swapEveryYears: [8, 12], reasons: ['waterlogged; water at the air valve'] },
    { typeCode: 'fill_valve', spec: { pipeSizeIn: 0.5 }, swapEveryYears: [12, 18], reasons: ['creeping pressure; valve would not shut tight'] },
    { typeCode: 'pressure_temperature_gauge', spec: { pressureMaxPsi: 75, temperatureMaxF: 320 }, swapEveryYears: [15, 25], reasons: ['needle stuck'] },
  ];
}

export function partSlotsFor(f: Faker, a: DemoApplianceShape): PartSlot[] {
  const burner = a.fuel === 'oil_no2' ? oilParts(f, a) : gasParts(f, a);
  const water = a.kind === 'steam_boiler' ? steamParts(f, a) : hotWaterParts(f, a);
  return [...water, ...burner];
}
