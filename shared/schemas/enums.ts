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

export const LABELS = {
  applianceKind: { steam_boiler: 'Steam boiler', hot_water_boiler: 'Hot-water boiler', water_heater: 'Water heater', furnace: 'Furnace' },
  fuel: { natural_gas: 'Natural gas', propane: 'Propane', oil_no2: 'No. 2 oil' },
  construction: {
    cast_iron: 'Cast iron',
    steel_fire_tube: 'Steel fire-tube',
    steel_water_tube: 'Steel water-tube',
    copper: 'Copper',
    condensing: 'Condensing',
    electric: 'Electric',
  },
  ignitionType: {
    standing_pilot: 'Standing pilot',
    intermittent_pilot: 'Intermittent pilot',
    direct_spark: 'Direct spark',
    hot_surface: 'Hot-surface',
    oil_burner: 'Oil-burner ignition',
  },
  ventType: { draft_hood: 'Draft hood', barometric_damper: 'Barometric damper', power_vent: 'Power vent', direct_vent: 'Direct vent' },
  applianceStatus: { in_service: 'In service', out_of_service: 'Out of service', removed: 'Removed' },
  customerKind: { homeowner: 'Homeowner', landlord: 'Landlord', property_manager: 'Property manager' },
  visitType: {
    annual_maintenance: 'Annual maintenance',
    repair: 'Repair',
    install: 'Install',
    no_heat: 'No-heat call',
    inspection: 'Inspection',
  },
  visitOutcome: { left_operating: 'Left operating', shut_down_unsafe: 'Shut down as unsafe' },
  checkMark: { done: 'Done', not_applicable: 'Not applicable', needs_attention: 'Needs attention' },
} as const;
