import type { Faker } from '@faker-js/faker';
import type { appliances } from '../schema/index';
import type { Construction, Fuel, VentType } from '../../../shared/schemas/enums';
import { addDays, addYears } from '../../../shared/trade/iso-date';
import { INVENTED_MAKES, pickInvented } from '../factories/invented-names';
import type { DemoApplianceShape } from './demo-parts';

export type DemoApplianceRow = typeof appliances.$inferInsert & { id: string; installedOn: string };

type Variant = 'steam_gas' | 'hot_water_gas' | 'steam_oil' | 'hot_water_oil';
const VARIANTS: Variant[] = ['steam_gas', 'steam_gas', 'steam_gas', 'steam_gas', 'hot_water_gas', 'hot_water_gas', 'hot_water_gas', 'steam_oil', 'steam_oil', 'hot_water_oil', 'hot_water_oil'];

/** An invented boiler of the given variant, `ageYears` old on `today`. */
export function planAppliance(
  f: Faker,
  input: { companyId: string; siteId: string; today: string; ageYears: number; variant?: Variant; location?: string; createdBy: string },
): { row: DemoApplianceRow; shape: DemoApplianceShape } {
  const variant = input.variant ?? f.helpers.arrayElement(VARIANTS);
  const oil = variant.endsWith('_oil');
  const steam = variant.startsWith('steam');
  const fuel: Fuel = oil ? 'oil_no2' : f.helpers.arrayElement<Fuel>(['natural_gas', 'natural_gas', 'natural_gas', 'propane']);
  const installedOn = addDays(addYears(input.today, -input.ageYears), -f.number.int({ min: 0, max: 300 }));
  const installYear = Number(installedOn.slice(0, 4));
  // Newer gas hot-water boilers light from an intermittent pilot; the rest keep a standing pilot.
  const ignitionType = oil ? 'oil_burner' : !steam && input.ageYears < 15 && f.datatype.boolean() ? 'intermittent_pilot' : 'standing_pilot';
  const construction: Construction = oil && f.datatype.boolean({ probability: 0.3 }) ? 'steel_fire_tube' : 'cast_iron';
  const ventType: VentType = oil ? 'barometric_damper' : 'draft_hood';
  const firingRateGph = oil ? f.helpers.arrayElement([0.65, 0.75, 0.85, 1.0, 1.25]) : null;
  const inputBtuh = oil ? Math.round(firingRateGph! * 140_000) : f.helpers.arrayElement([70_000, 87_500, 105_000, 122_500, 140_000, 175_000, 210_000]);
  const make = pickInvented(f, INVENTED_MAKES);
  const row: DemoApplianceRow = {
    id: f.string.uuid(),
    companyId: input.companyId,
    siteId: input.siteId,
    kind: steam ? 'steam_boiler' : 'hot_water_boiler',
    fuel,
    construction,
    manufacturer: make,
    model: `${make.slice(0, 2).toUpperCase()}-${f.number.int({ min: 2, max: 9 })}${steam ? 'S' : 'W'}`,
    serial: `${make.slice(0, 1).toUpperCase()}${installYear % 100}${f.string.alphanumeric({ length: 7, casing: 'upper' })}`,
    inputBtuh,
    firingRateGph,
    grossOutputBtuh: Math.round(inputBtuh * 0.8),
    mawpPsi: steam ? 15 : 50,
    manufacturedYear: installYear,
    manufacturedMonth: f.number.int({ min: 1, max: 12 }),
    installedOn,
    location: input.location ?? f.helpers.arrayElement(['Basement', 'Basement, by the stairs', 'Cellar, north wall', 'Utility room']),
    ignitionType,
    burnerCount: oil ? 1 : f.number.int({ min: 2, max: 6 }),
    ventType,
    createdBy: input.createdBy,
    updatedBy: input.createdBy,
  };
  const shape: DemoApplianceShape = {
    kind: row.kind,
    fuel,
    ignitionType,
    inputBtuh,
    firingRateGph,
    steamLwco: f.datatype.boolean({ probability: 0.8 }) ? 'float' : 'probe',
  };
  return { row, shape };
}
