import {
  APPLIANCE_KINDS,
  CONSTRUCTIONS,
  FUELS,
  IGNITION_TYPES,
  LABELS,
  VENT_TYPES,
  VISIT_OUTCOMES,
  VISIT_TYPES,
  type ApplianceKind,
  type Construction,
  type Fuel,
  type IgnitionType,
  type VentType,
  type VisitOutcome,
  type VisitType,
} from '../schemas/enums';
import { normaliseHeader } from './guess-mapping';

type Choices<T extends string> = { codes: readonly T[]; labels: Readonly<Record<T, string>>; words: Readonly<Record<string, T>> };

/** Words an old system or a spreadsheet commonly uses for our codes, beside our own labels and codes. */
const KIND: Choices<ApplianceKind> = {
  codes: APPLIANCE_KINDS,
  labels: LABELS.applianceKind,
  words: { steam: 'steam_boiler', 'steam boiler': 'steam_boiler', 'hot water': 'hot_water_boiler', 'hot water boiler': 'hot_water_boiler', hydronic: 'hot_water_boiler', 'hydronic boiler': 'hot_water_boiler', 'water heater': 'water_heater', 'hot water tank': 'water_heater', tank: 'water_heater', furnace: 'furnace', 'warm air': 'furnace', 'warm air furnace': 'furnace' },
};
const FUEL: Choices<Fuel> = {
  codes: FUELS,
  labels: LABELS.fuel,
  words: { gas: 'natural_gas', 'natural gas': 'natural_gas', ng: 'natural_gas', propane: 'propane', lp: 'propane', lpg: 'propane', 'lp gas': 'propane', oil: 'oil_no2', 'fuel oil': 'oil_no2', 'heating oil': 'oil_no2', 'no 2 oil': 'oil_no2', '2 oil': 'oil_no2', '#2 oil': 'oil_no2' },
};
const CONSTRUCTION: Choices<Construction> = {
  codes: CONSTRUCTIONS,
  labels: LABELS.construction,
  words: { 'cast iron': 'cast_iron', iron: 'cast_iron', steel: 'steel_fire_tube', 'fire tube': 'steel_fire_tube', 'water tube': 'steel_water_tube', copper: 'copper', condensing: 'condensing', electric: 'electric' },
};
const IGNITION: Choices<IgnitionType> = {
  codes: IGNITION_TYPES,
  labels: LABELS.ignitionType,
  words: { 'standing pilot': 'standing_pilot', pilot: 'standing_pilot', 'intermittent pilot': 'intermittent_pilot', ipi: 'intermittent_pilot', spark: 'direct_spark', 'direct spark': 'direct_spark', 'hot surface': 'hot_surface', hsi: 'hot_surface', 'oil burner': 'oil_burner', oil: 'oil_burner' },
};
const VENT: Choices<VentType> = {
  codes: VENT_TYPES,
  labels: LABELS.ventType,
  words: { 'draft hood': 'draft_hood', 'draft diverter': 'draft_hood', natural: 'draft_hood', 'natural draft': 'draft_hood', barometric: 'barometric_damper', 'barometric damper': 'barometric_damper', 'power vent': 'power_vent', 'power vented': 'power_vent', 'direct vent': 'direct_vent', sealed: 'direct_vent' },
};
const VISIT: Choices<VisitType> = {
  codes: VISIT_TYPES,
  labels: LABELS.visitType,
  words: { annual: 'annual_maintenance', 'tune up': 'annual_maintenance', 'tune-up': 'annual_maintenance', cleaning: 'annual_maintenance', service: 'annual_maintenance', maintenance: 'annual_maintenance', repair: 'repair', 'no heat': 'no_heat', install: 'install', inspection: 'inspection' },
};
const OUTCOME: Choices<VisitOutcome> = {
  codes: VISIT_OUTCOMES,
  labels: LABELS.visitOutcome,
  words: { ok: 'left_operating', running: 'left_operating', 'left running': 'left_operating', operating: 'left_operating', unsafe: 'shut_down_unsafe', 'shut down': 'shut_down_unsafe', 'red tag': 'shut_down_unsafe', 'red tagged': 'shut_down_unsafe' },
};

function matcher<T extends string>(choices: Choices<T>) {
  const table = new Map<string, T>();
  for (const code of choices.codes) {
    table.set(normaliseHeader(code.replace(/_/g, ' ')), code);
    table.set(normaliseHeader(choices.labels[code]), code);
  }
  for (const [word, code] of Object.entries(choices.words)) table.set(normaliseHeader(word), code as T);
  return {
    match: (text: string): T | null => table.get(normaliseHeader(text)) ?? null,
    hint: choices.codes.map((c) => choices.labels[c]).join(', '),
  };
}

export const applianceKindChoice = matcher(KIND);
export const fuelChoice = matcher(FUEL);
export const constructionChoice = matcher(CONSTRUCTION);
export const ignitionChoice = matcher(IGNITION);
export const ventChoice = matcher(VENT);
export const visitTypeChoice = matcher(VISIT);
export const visitOutcomeChoice = matcher(OUTCOME);
