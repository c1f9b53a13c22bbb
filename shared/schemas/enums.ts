export const APPLIANCE_KINDS = ['steam_boiler', 'hot_water_boiler', 'water_heater', 'furnace'] as const;
export const FUELS = ['natural_gas', 'propane', 'oil_no2'] as const;
export const CONSTRUCTIONS = ['cast_iron', 'steel_fire_tube', 'steel_water_tube', 'copper', 'condensing', 'electric'] as const;
export const IGNITION_TYPES = ['standing_pilot', 'intermittent_pilot', 'direct_spark', 'hot_surface', 'oil_burner'] as const;
export const VENT_TYPES = ['draft_hood', 'barometric_damper', 'power_vent', 'direct_vent'] as const;
export const APPLIANCE_STATUSES = ['in_service', 'out_of_service', 'removed'] as const;
export const CUSTOMER_KINDS = ['homeowner', 'landlord', 'property_manager'] as const;
export const VISIT_TYPES = ['annual_maintenance', 'repair', 'install', 'no_heat', 'inspection'] as const;
export const VISIT_STATUSES = ['draft', 'completed'] as const;
export const VISIT_OUTCOMES = ['left_operating', 'shut_down_unsafe'] as const;
export const CHECK_MARKS = ['done', 'not_applicable', 'needs_attention'] as const;
export const TIMELINE_KINDS = [
  'install',
  'visit',
  'amendment',
  'part_swap',
  'reading',
  'makeup_water',
  'photo',
  'note',
  'reminder',
  'status',
  'import',
  'booking',
] as const;

export type ApplianceKind = (typeof APPLIANCE_KINDS)[number];
export type Fuel = (typeof FUELS)[number];
export type Construction = (typeof CONSTRUCTIONS)[number];
export type IgnitionType = (typeof IGNITION_TYPES)[number];
export type VentType = (typeof VENT_TYPES)[number];
export type ApplianceStatus = (typeof APPLIANCE_STATUSES)[number];
export type CustomerKind = (typeof CUSTOMER_KINDS)[number];
export type VisitType = (typeof VISIT_TYPES)[number];
export type VisitStatus = (typeof VISIT_STATUSES)[number];
export type VisitOutcome = (typeof VISIT_OUTCOMES)[number];
export type CheckMark = (typeof CHECK_MARKS)[number];
export type TimelineKind = (typeof TIMELINE_KINDS)[number];

/** Display names of these values live in the glossary (shared/glossary/labels.ts); re-exported here for old imports. */
export { LABELS } from '../glossary/labels';
