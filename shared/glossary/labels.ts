import { OUTCOME_LABELS } from './outcomes';

/** The display name of every stored value a screen, e-mail or PDF shows: never the code itself. */
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
  visitOutcome: OUTCOME_LABELS,
  importStatus: { uploaded: 'not imported yet', queued: 'waiting to import', importing: 'importing', done: 'imported', failed: 'stopped with an error' },
  /** The life record's history entries, by kind (the History filter's words). */
  timelineKind: {
    visit: 'Visits',
    part_swap: 'Part swaps',
    reading: 'Readings',
    install: 'Installs',
    amendment: 'Amendments',
    status: 'Status',
    note: 'Notes',
    photo: 'Photos',
    makeup_water: 'Makeup water',
    reminder: 'Reminders',
    booking: 'Bookings',
    import: 'Imports',
  },
  /** A photo's kind as a household reads it (the office's words are PHOTO_KIND_LABELS in schemas/photos.ts). */
  photoKindForHousehold: { nameplate: 'Rating plate', before: 'Before the work', after: 'After the work', finding: 'What was found', other: 'Photo' },
  checkMark: { done: 'Done', not_applicable: 'Not applicable', needs_attention: 'Needs attention' },
} as const;
