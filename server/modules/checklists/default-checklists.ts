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

const CO_ALARM: ChecklistItemTemplate = {
  key: 'co_alarm',
  section: 'Carbon monoxide',
  label: 'Check a carbon-monoxide alarm is present near the sleeping rooms and test that it sounds; note its age.',
  caution: `Carbon monoxide has no smell: an alarm missing or not working is told to the occupant. Where alarms are required is set by local codes. ${FOLLOW}`,
};

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
    caution:
      'An empty glass means the water is below the safe level: do not fire the boiler until the level is restored and the cause found. Never add cold water to a hot boiler whose glass shows no water: let it cool first, or the shock can crack it or flash to steam.',
    readings: ['gaugeGlassLevel'],
  },
  {
    key: 'lwco_slow_drain',
    section: 'Low-water cutoff',
    label: 'Beside the quick blowdown, run a slow-drain test: with the burner firing, drain the boiler slowly and record the glass level at which the cutoff stops the burner.',
    caution: `${SCALDING} Stop the test and shut the burner off by hand if the level reaches the bottom of the glass with the burner still firing. ${FOLLOW}`,
  },
  {
    key: 'auto_water_feeder',
    section: 'Low-water cutoff',
    label: 'Where an automatic water feeder is fitted, check it feeds when the level drops and stops at the set level; record feeder counter or meter.',
    caution: 'A feeder that runs often hides a leak or a failed cutoff; it does not replace the low-water cutoff.',
  },
  {
    key: 'high_limit_manual_reset',
    section: 'Pressure controls',
    label: 'Test the manual-reset high-limit pressure control: raise pressure (or lower its setting) until it trips; confirm the burner stops and stays off until reset by hand.',
    caution: `If it does not trip, shut the boiler down: it is the backup to the operating control. ${FOLLOW}`,
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
    key: 'safety_valve_set_pressure',
    section: 'Safety valve',
    label: 'Confirm the safety valve tag shows a set pressure of 15 psig or less on a low-pressure steam boiler.',
    // Source: ASME Boiler and Pressure Vessel Code Section IV, low-pressure steam boilers at 15 psi or less
    caution: `A valve set higher than the boiler allows must be replaced, not adjusted. ${FOLLOW}`,
  },
  {
    key: 'safety_valve_try_lever',
    section: 'Safety valve',
    label: 'Try-lever test: with the boiler steaming, lift the try lever fully, let it snap shut, and check it reseats without seepage.',
    caution: `${RELIEF} Wear gloves and eye protection and stand clear of the discharge. ${FOLLOW}`,
  },
  CO_ALARM,
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
    key: 'expansion_precharge_vs_fill',
    section: 'Water side',
    label: 'Compare the expansion tank pre-charge with the static fill pressure at the tank: they should match; adjust the pre-charge with the tank isolated and drained.',
    caution: 'Isolate and cool the tank before draining it: boiler water is hot enough to scald.',
  },
  { key: 'air_elimination', section: 'Water side', label: 'Check the air eliminator or air separator vents air and does not leak water.' },
  {
    key: 'hw_makeup_water',
    section: 'Water use',
    label: 'Record makeup water added since the last visit (fill meter where fitted); high use points to a leak.',
    readings: ['makeupWater'],
  },
  {
    key: 'hw_lwco',
    section: 'Controls',
    label: 'Where a low-water cutoff is fitted, test it stops the burner as its manufacturer\'s instructions say.',
    caution: `Water drained from the test is hot enough to scald. ${FOLLOW}`,
  },
  {
    key: 'relief_valve_lift',
    section: 'Relief valve',
    label: 'Lift-test the relief valve by its lever: water flows freely and the valve reseats without dripping.',
    caution: `${RELIEF} Stand clear of the discharge. ${FOLLOW}`,
  },
  {
    key: 'anti_scald',
    section: 'Domestic hot water',
    label: 'Where the boiler heats domestic water, check the anti-scald (mixing) valve and record the hot-water temperature at a tap.',
    caution: `Water above about 120 °F can scald quickly, most of all children and the elderly. ${FOLLOW}`,
  },
  CO_ALARM,
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
    label: 'Standing pilot only: check the pilot flame envelops the thermocouple tip; measure the thermocouple (open- and closed-circuit millivolts).',
    readings: ['thermocouple'],
  },
  {
    key: 'pilot_relight',
    section: 'Burner and pilot',
    label: 'Standing pilot only: relight the pilot by the lighting instructions on the boiler: hold the pilot button about 30 seconds so the thermocouple proves the flame.',
    caution: `If you smell gas, do not light anything: shut off the gas, ventilate and find the leak first. ${FOLLOW}`,
  },
  {
    key: 'pilot_outage',
    section: 'Burner and pilot',
    label: "Standing pilot only: pilot-outage test: put out the pilot and confirm the gas valve closes within the time the valve maker publishes.",
    caution: `If the valve does not close, shut off the gas and leave the appliance off. ${MAKE_SAFE} ${FOLLOW}`,
  },
  {
    key: 'electronic_ignition',
    section: 'Burner and pilot',
    label: 'Spark or hot-surface ignition only: check the igniter (spark gap or hot-surface element), flame sensing (flame current) and that the control locks out on failed ignition.',
    caution: `Hot-surface igniters are fragile and hot: do not touch them. ${FOLLOW}`,
  },
  {
    key: 'rollout_spill_switch',
    section: 'Safety switches',
    label: 'Test the flame rollout switch and the spill (draft) switch: each stops the burner when tripped.',
    caution: `Never bypass or jumper a safety switch; a tripped switch means a fault to find. ${MAKE_SAFE} ${FOLLOW}`,
  },
  {
    key: 'manifold_vs_nameplate',
    section: 'Gas supply',
    label: 'Compare the manifold pressure with the pressure on the nameplate and set it to the nameplate for the gas in use.',
    caution: FOLLOW,
  },
  {
    key: 'combustion_air',
    section: 'Gas supply',
    label: 'Check the combustion-air openings are present, open and sized as local codes require.',
    caution: `Starved combustion air makes carbon monoxide. ${FOLLOW}`,
  },
  {
    key: 'vent_damper',
    section: 'Venting',
    label: 'Where a vent damper is fitted, check it opens fully before the burner fires (interlock) and the burner cannot fire with it shut.',
    caution: `${MAKE_SAFE} ${FOLLOW}`,
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
    label: 'Run a combustion test after several minutes of steady firing: O2, CO, flue and combustion-air temperature. On a draft-hood appliance take the flue sample before the draft hood.',
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
  {
    key: 'pump_vacuum',
    section: 'Oil burner',
    label: "Measure the pump vacuum at the inlet; a high vacuum points to a blocked filter or line; compare with the pump maker's limit.",
  },
  {
    key: 'emergency_switch',
    section: 'Oil supply',
    label: 'Check the emergency shut-off switch (outside the boiler room door) stops the burner.',
    caution: FOLLOW,
  },
  {
    key: 'smoke_test',
    section: 'Combustion and draft',
    label: "Run a smoke test before the final air adjustment and record the smoke spot; it should be within the burner maker's limit (commonly no more than No. 1 on a modern flame-retention burner).",
    // common practice: smoke spot no more than No. 1 on flame-retention oil burners
    caution: FOLLOW,
    readings: ['oil'],
  },
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

const waterHeater: Item[] = [
  {
    key: 'tp_relief_valve',
    section: 'Relief valve',
    label: 'Check the temperature-and-pressure relief valve: rating on its tag, full-size discharge pipe to a safe place, no seepage; lift-test by its lever.',
    caution: `${RELIEF} ${FOLLOW}`,
  },
  {
    key: 'tank_flush',
    section: 'Tank',
    label: 'Flush sediment from the tank at the drain valve; check the anode rod where the maker calls for it.',
    caution: 'Tank water is hot enough to scald: run it to a safe drain and keep clear of the hose end.',
  },
  {
    key: 'wh_anti_scald',
    section: 'Domestic hot water',
    label: 'Record the hot-water temperature at a tap and check the thermostat setting and any mixing valve.',
    caution: `Water above about 120 °F can scald quickly, most of all children and the elderly. ${FOLLOW}`,
  },
  { key: 'wh_expansion', section: 'Tank', label: 'Where a thermal expansion tank is fitted, check its pre-charge matches the house water pressure.' },
  CO_ALARM,
];

const warmAirFurnace: Item[] = [
  { key: 'air_filter', section: 'Air side', label: 'Replace or clean the air filter; record its size.' },
  { key: 'blower', section: 'Air side', label: 'Clean the blower wheel and check its motor current against the nameplate.', caution: 'Shut off power at the furnace switch before opening the blower door.' },
  { key: 'temperature_rise', section: 'Air side', label: "Measure the temperature rise (supply minus return) and compare it with the range on the furnace's rating plate." },
  {
    key: 'heat_exchanger',
    section: 'Heat exchanger',
    label: 'Inspect the heat exchanger for cracks, holes and rust-through; watch the flame for change when the blower starts.',
    caution: `A broken heat exchanger can put carbon monoxide into the air stream. ${MAKE_SAFE} ${FOLLOW}`,
  },
  {
    key: 'furnace_high_limit',
    section: 'Controls',
    label: 'Check the high-limit switch stops the burner when the air temperature reaches its setting (e.g. with the blower stopped).',
    caution: FOLLOW,
  },
  CO_ALARM,
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
  {
    name: 'Storage water heater, gas-fired: annual maintenance',
    applianceKind: 'water_heater',
    fuel: null,
    items: [...waterHeater, ...gasBurner, ...combustionAndVenting(GAS_VENT)],
    requiredReadings: FIRED_ANNUAL,
  },
  {
    name: 'Warm-air furnace, gas-fired: annual maintenance',
    applianceKind: 'furnace',
    fuel: null,
    items: [...warmAirFurnace, ...gasBurner, ...combustionAndVenting(GAS_VENT)],
    requiredReadings: FIRED_ANNUAL,
  },
];

/** The default template a kind and fuel start from: the fuel-specific one wins over the kind's general one. */
export function findDefaultChecklist(kind: ApplianceKind, fuel: Fuel): DefaultChecklist | null {
  const forKind = DEFAULT_CHECKLISTS.filter((t) => t.applianceKind === kind);
  return forKind.find((t) => t.fuel === fuel) ?? forKind.find((t) => t.fuel === null) ?? null;
}
