import type { ApplianceKind, Fuel, IgnitionType } from '@shared/schemas/enums';
import type { ComponentType } from '@shared/trade';

// The parts a technician usually finds and tracks on each kind of appliance (common practice), so the office
// does not start from an empty list. Every suggested row can be removed.
const IGNITION_PARTS: Record<IgnitionType, ComponentType[]> = {
  standing_pilot: ['thermocouple'],
  intermittent_pilot: ['pilot_assembly', 'flame_sensor', 'ignition_module'],
  direct_spark: ['flame_sensor', 'ignition_module'],
  hot_surface: ['hot_surface_igniter', 'flame_sensor', 'ignition_module'],
  oil_burner: [],
};
const OIL_BURNER_PARTS: ComponentType[] = ['nozzle', 'oil_filter', 'pump_strainer', 'electrodes', 'cad_cell', 'primary_control', 'fuel_pump'];
const KIND_PARTS: Record<ApplianceKind, ComponentType[]> = {
  steam_boiler: ['gauge_glass', 'gauge_glass_washers', 'low_water_cutoff_float', 'pressure_control', 'siphon_loop', 'safety_valve'],
  hot_water_boiler: ['relief_valve', 'circulator', 'expansion_tank', 'fill_valve', 'backflow_preventer', 'pressure_temperature_gauge'],
  water_heater: [],
  furnace: ['thermostat'],
};

export function starterComponents(kind: ApplianceKind | '', fuel: Fuel | '', ignition: IgnitionType | ''): ComponentType[] {
  if (!kind || !fuel) return [];
  const burner = fuel === 'oil_no2' ? OIL_BURNER_PARTS : ignition ? IGNITION_PARTS[ignition] : [];
  return [...burner, ...KIND_PARTS[kind]];
}
