import type { Faker } from '@faker-js/faker';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import type { ApplianceKind, Fuel, IgnitionType } from '../../../shared/schemas/enums';
import { DEFAULT_HEATING_VALUE_BTU_PER_FT3 } from '../../../shared/trade/gas-input';

type Facts = { kind: ApplianceKind; fuel: Fuel; ignitionType: IgnitionType; inputBtuh: number | null; steamLwco: 'float' | 'probe' };

const round = (v: number, digits = 1) => Number(v.toFixed(digits));

/** Plausible annual readings; `wear` (0 new … 1 tired) nudges flue temperature and CO upward as a boiler ages. */
export function demoReadings(f: Faker, a: Facts, wear: number, overrides: Partial<ReadingsInput> = {}): ReadingsInput {
  const oil = a.fuel === 'oil_no2';
  const readings: ReadingsInput = {
    combustion: {
      o2Pct: round(oil ? f.number.float({ min: 4, max: 7 }) : f.number.float({ min: 5.5, max: 9 })),
      coPpm: Math.round((oil ? f.number.int({ min: 5, max: 30 }) : f.number.int({ min: 5, max: 35 })) * (1 + 0.8 * wear)),
      flueTempF: Math.round((oil ? f.number.int({ min: 430, max: 520 }) : f.number.int({ min: 340, max: 440 })) + 60 * wear),
      airTempF: f.number.int({ min: 58, max: 72 }),
      outdoorTempF: f.number.int({ min: 25, max: 55 }),
      draftInWc: round(-f.number.float({ min: 0.02, max: 0.05 }), 2),
      ambientCoPpm: f.number.int({ min: 0, max: 2 }),
      spillageSeconds: oil ? null : f.number.int({ min: 0, max: 20 }),
      steadyFiringMinutes: f.number.int({ min: 5, max: 12 }),
    },
  };
  if (oil) {
    readings.oil = {
      // A tuned flame-retention burner holds smoke at No. 1 or under (the limit the visit judges it against).
      smokeSpot: f.helpers.arrayElement([0, 0, 1, 1]),
      burnerType: 'flame_retention',
      nozzleGph: f.helpers.arrayElement([0.65, 0.75, 0.85]),
      pumpPressurePsi: f.helpers.arrayElement([100, 100, 140]),
      overFireDraftInWc: round(-f.number.float({ min: 0.01, max: 0.03 }), 2),
      breechDraftInWc: round(-f.number.float({ min: 0.03, max: 0.06 }), 2),
    };
  } else {
    const heatingValue = DEFAULT_HEATING_VALUE_BTU_PER_FT3[a.fuel === 'propane' ? 'propane' : 'natural_gas'];
    const input = (a.inputBtuh ?? 100_000) * f.number.float({ min: 0.93, max: 1.03 });
    const dial = a.fuel === 'propane' ? 1 : 2;
    readings.gasInput = { dialCubicFeet: dial, secondsPerRevolution: round((dial * 3600 * heatingValue) / input), heatingValueBtuPerCubicFoot: heatingValue };
    readings.gasInletInWc = a.fuel === 'propane' ? round(f.number.float({ min: 11, max: 13 })) : round(f.number.float({ min: 6.5, max: 7.5 }));
    readings.gasManifoldInWc = a.fuel === 'propane' ? round(f.number.float({ min: 9.8, max: 10.2 })) : round(f.number.float({ min: 3.3, max: 3.6 }));
    if (a.ignitionType === 'standing_pilot') {
      readings.thermocouple = { openCircuitMv: f.number.int({ min: 22, max: 30 }), closedCircuitMv: f.number.int({ min: 11, max: 16 }) };
    }
  }
  if (a.kind === 'steam_boiler') {
    const cutOut = f.helpers.arrayElement([1.5, 2, 2]);
    readings.gaugeGlassLevel = f.helpers.arrayElement(['1/2', '1/2', '5/8', '3/8']);
    readings.lowWaterCutoff = { type: a.steamLwco, trippedAtLevel: a.steamLwco === 'float' ? f.helpers.arrayElement(['1/4', '1/8', '1/4']) : null, trippedWith: 'water_visible', burnerStopped: true };
    readings.pressureControlCutInPsi = 0.5;
    readings.pressureControlCutOutPsi = cutOut;
    readings.steamOperatingPsi = round(cutOut - f.number.float({ min: 0, max: 0.4 }));
    readings.makeupWater = { addedByHandGallons: f.helpers.arrayElement([0, 0, 1, 2, 3]) };
  } else {
    readings.fillPressurePsi = f.helpers.arrayElement([12, 12, 14, 15]);
    readings.expansionTankPrechargePsi = f.helpers.arrayElement([12, 12, 10]);
  }
  return { ...readings, ...overrides };
}

const ROUTINE_FINDINGS = [
  'Cleaned burners and combustion chamber; light rust scale removed.',
  'Flue passages brushed; moderate soot.',
  'Vent connector sound; pitch good.',
  'Controls cycled normally.',
  'Boiler room clear of storage.',
  'Minor rust on the jacket; no leaks found.',
];
const STEAM_FINDINGS = ['Low-water cutoff tripped and stopped the burner.', 'Gauge glass cleaned; level steady.', 'Main vents working.'];
const HOT_WATER_FINDINGS = ['Expansion tank pre-charge matched fill pressure.', 'Relief valve dry; discharge pipe in place.', 'Circulator quiet.'];
const OIL_FINDINGS = ['Nozzle and filter replaced; pump strainer cleaned.', 'Electrodes cleaned and gapped.', 'Smoke test clean before air set.'];

export function demoFindings(f: Faker, a: Facts): string {
  const specific = a.fuel === 'oil_no2' ? OIL_FINDINGS : [];
  const water = a.kind === 'steam_boiler' ? STEAM_FINDINGS : HOT_WATER_FINDINGS;
  return [...f.helpers.arrayElements(ROUTINE_FINDINGS, 2), ...f.helpers.arrayElements(water, 2), ...specific.slice(0, 2)].join(' ');
}

/** Items a technician sometimes marks "needs attention", with the note they leave. */
export const ATTENTION_NOTES: Record<string, string[]> = {
  gauge_glass: ['Glass starting to etch; plan to replace next visit.'],
  radiator_air_vents: ['Two radiator vents spitting; replace when parts in.'],
  makeup_water: ['More water added than last year; check returns for a leak.'],
  expansion_tank: ['Pre-charge low; recharged to 12 psi.'],
  flue_vent: ['Surface rust at the connector joint; watch it.'],
  burners_clean: ['Heavy scale on the burner ports; cleaned, watch next year.'],
  electrodes: ['Electrode tips worn; replace next year.'],
  circulator: ['Slight bearing noise.'],
};
