import type { ChecklistItemTemplate, RequiredReadingsByVisitType } from '../../db/schema/index';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';

/**
 * The annual-maintenance checklists every company starts with, as data: managers edit their own copies.
 * `readings` name fields of readingsInput (shared/schemas/visits.ts) so the visit form shows inputs beside the item.
 * Steps follow common trade practice; the manufacturer's instructions and local codes always govern.
 */

const FOLLOW = "Follow the manufacturer's instructions and local codes.";
const MAKE_SAFE = 'On a CO or gas-leak finding make the appliance safe (shut it off) and tell the occupant before you leave.';
const SCALDING = 'Blowdown water and steam are scalding: drain to a safe place and keep hands and face clear of the outlet.';
const RELIEF =
  'Valve discharge is scalding. The valve needs a full-size discharge pipe to a safe place; a valve not opened for years may not reseat, so be ready to replace it.';

type Item = ChecklistItemTemplate;

const steamWaterSide: Item[] = [
  {
    key: 'lwco_test',
    section: 'Low-water cutoff',
    label:
      'Test the low-water cutoff for its type. Float type: blow down its chamber with the burner firing; record the water level at which it tripped and whether the burner stopped. Probe type: test as its manufacturer\'s instructions say.',
    caution: `${SCALDING} If the burner does not stop, shut the boiler down and do not leave it firing. ${FOLLOW}`,
    readings: ['lowWaterCutoff'],
  },
  {
    key: 'gauge_glass',
    section: 'Gauge glass',
    label: 'Clean the gauge glass; check its washers and the gauge-glass valves (cocks) for leaks and free movement.',
    caution: 'Close both gauge-glass valves and let the glass cool before working on it: a glass under pressure can burst, and the water is scalding.',
  },
  {
    key: 'water_level',
    section: 'Gauge glass',
    label: 'Record the water level in the gauge glass with the boiler cold (as a fraction of the glass, e.g. 1/2).',
    caution: 'An empty glass means the water is below the safe level: do not fire the boiler until the level is restored and the cause found.',
    readings: ['gaugeGlassLevel'],
  },
  {
    key: 'pressure_control',
    section: 'Pressure controls',
    label: 'Check the pressure control settings (cut-in and cut-out) suit the system; residential steam usually runs on a few psi.',
    readings: ['pressureControlCutInPsi', 'pressureControlCutOutPsi'],
  },
  {
    key: 'siphon_loop',
    section: 'Pressure controls',
    label: 'Check the siphon loop (pigtail) under the pressure control and gauge is clear and holds water.',
    caution: 'Let the boiler cool and relieve pressure before opening the siphon loop: trapped water is scalding.',
  },
  {
    key: 'operating_pressure',
    section: 'Pressure controls',
    label: 'Record the operating pressure at the gauge with the boiler steaming, and confirm the control stops the burner at cut-out.',
    readings: ['steamOperatingPsi'],
  },
];

const steamSystem: Item[] = [
  { key: 'main_air_vents', section: 'Steam system', label: 'Check the main air vents open when cold and close on steam.' },
  { key: 'radiator_air_vents', section: 'Steam system', label: 'Check the radiator air vents; note any that spit water, hiss steam or stay shut.' },
  {
    key: 'safety_valve',
    section: 'Safety valve',
    label: "Check the safety valve: set pressure on its tag against the boiler's maximum allowable working pressure, discharge pipe in place, no seepage.",
    caution: `${RELIEF} ${FOLLOW}`,
  },
  {
    key: 'makeup_water',
    section: 'Water use',
    label: 'Record the makeup water added since the last visit (feeder meter or water added by hand); high use points to a leak.',
    readings: ['makeupWater'],
  },
];

const hotWaterSide: Item[] = [
  { key: 'circulator', section: 'Water side', label: 'Check the circulator runs quietly and moves water (supply and return temperatures differ as expected).' },
  {
    key: 'expansion_tank',
    section: 'Water side',
    label: 'Check the expansion tank: isolated and drained, its pre-charge matches the cold fill pressure; no water at the air valve.',
    caution: 'Isolate and cool the tank before draining it: boiler water is hot enough to scald.',
    readings: ['expansionTankPrechargePsi'],
  },
  {
    key: 'fill_pressure',
    section: 'Water side',
    label: 'Record the cold fill pressure and check the fill valve holds it.',
    readings: ['fillPressurePsi'],
  },
  {
    key: 'relief_valve',
    section: 'Relief valve',
    label: 'Check the relief valve: set pressure and relieving capacity on its tag suit the boiler, discharge pipe in place, no seepage.',
    caution: `${RELIEF} ${FOLLOW}`,
  },
  { key: 'pt_gauge', section: 'Water side', label: 'Check the pressure/temperature gauge reads plausibly against the fill pressure and boiler temperature.' },
  {
    key: 'high_limit',
    section: 'Controls',
    label: 'Check the high-limit control stops the burner when the water reaches its setting.',
    caution: 'A boiler that fires past its limit can overheat and lift the relief valve: shut it down until the limit is repaired.',
  },
];

const gasBurner: Item[] = [
  {
    key: 'burners_clean',
    section: 'Burner and pilot',
    label: 'Clean the burners and the combustion chamber; look for rust scale, soot and signs of flame rollout.',
    caution: 'Shut off the gas and power and let the boiler cool before opening the combustion chamber.',
  },
  {
    key: 'pilot_thermocouple',
    section: 'Burner and pilot',
    label: 'Check the pilot flame envelops the thermocouple tip; measure the thermocouple (open- and closed-circuit millivolts).',
    readings: ['thermocouple'],
  },
  {
    key: 'pilot_relight',
    section: 'Burner and pilot',
    label: 'Relight the pilot by the lighting instructions on the boiler: hold the pilot button about 30 seconds so the thermocouple proves the flame.',
    caution: `If you smell gas, do not light anything: shut off the gas, ventilate and find the leak first. ${FOLLOW}`,
  },
  {
    key: 'gas_pressure',
    section: 'Gas supply',
    label: 'Record inlet and manifold gas pressure; clock the gas meter to check the firing rate against the rating plate.',
    readings: ['gasInletInWc', 'gasManifoldInWc', 'gasInput'],
  },
  {
    key: 'gas_leak_check',
    section: 'Gas supply',
    label: 'Leak-check the gas valve, pilot tubing and gas train joints with a detector or leak solution.',
    caution: `${MAKE_SAFE} ${FOLLOW}`,
  },
];

const combustionAndVenting = (ventCheck: string): Item[] => [
  {
    key: 'combustion_test',
    section: 'Combustion and draft',
    label: 'Run a combustion test after several minutes of steady firing: O2, CO, flue and combustion-air temperature.',
    caution: `${MAKE_SAFE} ${FOLLOW}`,
    readings: ['combustion'],
  },
  {
    key: 'draft_spillage',
    section: 'Combustion and draft',
    label: 'Measure the draft and check for spillage after start-up; check ambient CO in the boiler room.',
    caution: `Spillage brings flue gas, which can carry carbon monoxide, into the home. ${MAKE_SAFE}`,
    readings: ['combustion'],
  },
  {
    key: 'flue_vent',
    section: 'Venting',
    label: ventCheck,
    caution: `A blocked or broken vent can put carbon monoxide into the home. ${MAKE_SAFE}`,
  },
];

const GAS_VENT = 'Inspect the flue pipe, draft hood and chimney connection: pitch, joints, corrosion and blockage.';
const OIL_VENT = 'Inspect the flue pipe, barometric damper and chimney connection: pitch, joints, soot and blockage.';

const oilBurner: Item[] = [
  {
    key: 'combustion_chamber',
    section: 'Oil burner',
    label: 'Vacuum the combustion chamber and flue passages; check the chamber lining (refractory) for cracks.',
    caution: 'Shut off the burner power and oil supply and let the boiler cool before opening it.',
  },
  { key: 'nozzle', section: 'Oil burner', label: 'Replace the nozzle with the rated firing rate, spray angle and pattern; record what was fitted.' },
  { key: 'oil_filter', section: 'Oil burner', label: 'Replace the oil filter cartridge and bleed air from the oil line.', caution: 'Catch spilled oil and clean it up; oil-soaked rags are a fire hazard.' },
  { key: 'pump_strainer', section: 'Oil burner', label: 'Clean or replace the fuel pump strainer and its gasket.' },
  { key: 'electrodes', section: 'Oil burner', label: "Clean the electrodes and set their gap and position to the burner manufacturer's dimensions." },
  { key: 'cad_cell', section: 'Oil burner', label: 'Clean the cad cell and check its resistance with the flame on and off.' },
  {
    key: 'primary_control',
    section: 'Oil burner',
    label: 'Check the primary control shuts the burner off on flame failure within its safety time.',
    caution: 'Do not reset a locked-out primary control again and again: unburned oil collects in the chamber and can ignite violently.',
  },
  { key: 'pump_pressure', section: 'Oil burner', label: 'Set and record the pump pressure to the nozzle rating.', readings: ['oil'] },
  { key: 'smoke_test', section: 'Combustion and draft', label: 'Run a smoke test before the final air adjustment and record the smoke spot.', readings: ['oil'] },
  {
    key: 'oil_drafts',
    section: 'Combustion and draft',
    label: 'Measure over-fire draft and breech draft; set the barometric damper.',
    readings: ['oil'],
  },
  {
    key: 'oil_leak_check',
    section: 'Oil supply',
    label: 'Check the oil tank, lines and fittings for leaks and the tank for water or sludge.',
    caution: 'An oil leak near the burner is a fire hazard: stop the burner and repair before leaving it running.',
  },
];

export type DefaultChecklist = { name: string; applianceKind: ApplianceKind; fuel: Fuel | null; items: Item[]; requiredReadings: RequiredReadingsByVisitType };

/**
 * common practice: an annual service of a fired boiler includes a combustion test with an analyzer, and a steam
 * boiler's includes a test that the low-water cutoff stops the burner. A visit records them or says why not.
 */
const FIRED_ANNUAL: RequiredReadingsByVisitType = { annual_maintenance: ['combustion'] };
const STEAM_ANNUAL: RequiredReadingsByVisitType = { annual_maintenance: ['combustion', 'lowWaterCutoff'] };

/** Gas templates carry fuel null: they serve natural gas and propane; the oil-specific template wins for oil. */
export const DEFAULT_CHECKLISTS: DefaultChecklist[] = [
  {
    name: 'Steam boiler, gas-fired: annual maintenance',
    applianceKind: 'steam_boiler',
    fuel: null,
    items: [...steamWaterSide, ...gasBurner, ...combustionAndVenting(GAS_VENT), ...steamSystem],
    requiredReadings: STEAM_ANNUAL,
  },
  {
    name: 'Hot-water boiler, gas-fired: annual maintenance',
    applianceKind: 'hot_water_boiler',
    fuel: null,
    items: [...hotWaterSide, ...gasBurner, ...combustionAndVenting(GAS_VENT)],
    requiredReadings: FIRED_ANNUAL,
  },
  {
    name: 'Steam boiler, oil-fired: annual maintenance',
    applianceKind: 'steam_boiler',
    fuel: 'oil_no2',
    items: [...steamWaterSide, ...oilBurner, ...combustionAndVenting(OIL_VENT), ...steamSystem],
    requiredReadings: STEAM_ANNUAL,
  },
  {
    name: 'Hot-water boiler, oil-fired: annual maintenance',
    applianceKind: 'hot_water_boiler',
    fuel: 'oil_no2',
    items: [...hotWaterSide, ...oilBurner, ...combustionAndVenting(OIL_VENT)],
    requiredReadings: FIRED_ANNUAL,
  },
];

/** The default template a kind and fuel start from: the fuel-specific one wins over the kind's general one. */
export function findDefaultChecklist(kind: ApplianceKind, fuel: Fuel): DefaultChecklist | null {
  const forKind = DEFAULT_CHECKLISTS.filter((t) => t.applianceKind === kind);
  return forKind.find((t) => t.fuel === fuel) ?? forKind.find((t) => t.fuel === null) ?? null;
}
