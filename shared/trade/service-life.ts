import { isoDateToDayNumber } from './iso-date';
import { requireNumber, requireOneOf, TradeInputError } from './trade-input-error';

export const SERVICE_LIFE_APPLIANCE_KINDS = ['steam_boiler', 'hot_water_boiler', 'water_heater', 'furnace'] as const;
export type ServiceLifeApplianceKind = (typeof SERVICE_LIFE_APPLIANCE_KINDS)[number];
export const SERVICE_LIFE_CONSTRUCTIONS = ['cast_iron', 'steel_fire_tube', 'steel_water_tube', 'copper', 'condensing', 'electric'] as const;
export type ServiceLifeConstruction = (typeof SERVICE_LIFE_CONSTRUCTIONS)[number];

export const ASHRAE_SERVICE_LIFE_SOURCE =
  'ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, equipment service-life table (1978 survey), secondary copy';

/** Median service lives, years, from the ASHRAE table (1978 survey data; medians, not predictions). */
export const ASHRAE_MEDIAN_SERVICE_LIFE_YEARS = {
  boiler_hot_water_steel_water_tube: 24,
  boiler_steam_steel_water_tube: 30,
  boiler_steel_fire_tube: 25,
  boiler_hot_water_cast_iron: 35,
  boiler_steam_cast_iron: 30,
  boiler_electric: 15,
  burners: 21,
  furnaces_gas_or_oil: 18,
  pumps_base_mounted: 20,
  pumps_pipe_mounted: 10,
  pumps_condensate: 15,
  controls_pneumatic: 20,
} as const;

type Row = keyof typeof ASHRAE_MEDIAN_SERVICE_LIFE_YEARS;

const ROWS: Record<ServiceLifeApplianceKind, Partial<Record<ServiceLifeConstruction, Row>>> = {
  hot_water_boiler: {
    cast_iron: 'boiler_hot_water_cast_iron',
    steel_fire_tube: 'boiler_steel_fire_tube',
    steel_water_tube: 'boiler_hot_water_steel_water_tube',
    electric: 'boiler_electric',
  },
  steam_boiler: {
    cast_iron: 'boiler_steam_cast_iron',
    steel_fire_tube: 'boiler_steel_fire_tube',
    steel_water_tube: 'boiler_steam_steel_water_tube',
    electric: 'boiler_electric',
  },
  // The table's furnace row covers gas- and oil-fired furnaces, whatever their heat exchanger is made of.
  furnace: { cast_iron: 'furnaces_gas_or_oil', steel_fire_tube: 'furnaces_gas_or_oil', steel_water_tube: 'furnaces_gas_or_oil' },
  water_heater: {},
};

export type ServiceLifeResult = {
  years: number | null;
  basis: 'published_median' | 'no_published_median';
  source: string;
  note: string;
};

export function medianServiceLifeYears(input: {
  kind: ServiceLifeApplianceKind;
  construction: ServiceLifeConstruction;
}): ServiceLifeResult {
  const kind = requireOneOf('kind', input.kind, SERVICE_LIFE_APPLIANCE_KINDS);
  const construction = requireOneOf('construction', input.construction, SERVICE_LIFE_CONSTRUCTIONS);
  const row = ROWS[kind][construction];
  if (row === undefined) {
    return {
      years: null,
      basis: 'no_published_median',
      source: ASHRAE_SERVICE_LIFE_SOURCE,
      note: `No published median for this kind and construction in the ASHRAE table (${kind}, ${construction}).`,
    };
  }
  return {
    years: ASHRAE_MEDIAN_SERVICE_LIFE_YEARS[row],
    basis: 'published_median',
    source: ASHRAE_SERVICE_LIFE_SOURCE,
    note: 'Median age at replacement in a 1978 survey; not a prediction for any one appliance.',
  };
}

const DAYS_PER_YEAR = 365.2425;

export type ApplianceLifeStatus = {
  ageYears: number;
  remainingYears: number;
  status: 'within' | 'near' | 'past';
};

/** Age against a median life. "near" starts `nearWindowYears` before the median (company default 2 years). */
export function applianceLifeStatus(input: {
  installedOn: string;
  today: string;
  medianYears: number;
  nearWindowYears?: number;
}): ApplianceLifeStatus {
  const medianYears = requireNumber('medianYears', input.medianYears, { minExclusive: 0 });
  const nearWindow = requireNumber('nearWindowYears', input.nearWindowYears ?? 2, { min: 0 });
  const ageDays = isoDateToDayNumber('today', input.today) - isoDateToDayNumber('installedOn', input.installedOn);
  if (ageDays < 0) throw new TradeInputError('installedOn', `install date ${input.installedOn} is after today ${input.today}`);
  const ageYears = ageDays / DAYS_PER_YEAR;
  const remainingYears = medianYears - ageYears;
  const status = remainingYears <= 0 ? 'past' : remainingYears <= nearWindow ? 'near' : 'within';
  return { ageYears, remainingYears, status };
}
