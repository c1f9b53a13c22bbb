/**
 * The visit's checklist steps, by the section names of the checklists every company starts with
 * (server/modules/checklists/default-checklists.ts), each with one plain line for the household: what we checked and
 * why it matters. Homeowner pages and the visit report show the line beside the step; a company's own section name that
 * is not here is shown as it is, without a line.
 * Wording follows common practice; where work can hurt, the line says so and leaves the work to a licensed technician.
 */
export const VISIT_STEPS = {
  'Air side': 'The filter, blower and the warm air leaving the furnace: a clogged filter or weak blower wastes fuel and can overheat the furnace.',
  'Burner and pilot': 'The burner flame and what lights and watches it: a clean, steady flame burns the fuel fully, and the safety device shuts the gas off if the flame goes out.',
  'Carbon monoxide': 'That a carbon monoxide (CO) alarm is near where people sleep and sounds: CO has no colour or smell, so the alarm is your only warning.',
  'Combustion and draft': 'How cleanly the fuel burns and that the fumes go up the chimney or vent, measured with an instrument in the flue.',
  Controls: 'The switches that stop the burner when the water gets too hot or too low, so the appliance cannot overheat.',
  'Domestic hot water': 'The temperature of the hot water at your taps and the mixing valve that keeps it from scalding.',
  'Gas supply': 'The gas pressure and the pipe joints at the appliance, checked for leaks, and the fresh air the burner needs.',
  'Gauge glass': 'The glass tube that shows the water level in the boiler: a steam boiler must never run without water in it.',
  'Heat exchanger': 'The metal wall between the flame and the air or water, looked over for cracks or holes that could let fumes into the house.',
  'Low-water cutoff': 'The safety switch that stops the burner if the boiler runs low on water, tested by draining water until it acts.',
  'Oil burner': 'The oil burner’s nozzle, filter and spark, set so the oil burns cleanly without soot or smoke.',
  'Oil supply': 'The oil tank, lines and fittings, checked for leaks and for water or sludge in the tank.',
  'Pressure controls': 'The controls that keep the steam pressure low and shut the burner off if the pressure climbs too high.',
  'Relief valve': 'The valve that lets water out if the pressure or temperature gets too high, so the tank or boiler cannot burst.',
  'Safety switches': 'The emergency switch and the other switches that stop the burner at once when something is wrong.',
  'Safety valve': 'The valve that lets steam out if the pressure climbs too high, so the boiler cannot burst.',
  'Steam system': 'The air vents on the pipes and radiators, which let air out so steam can reach every room.',
  Tank: 'The water heater’s tank: sediment flushed out and, where fitted, the part that slows rust inside it.',
  Venting: 'The flue pipe and chimney or vent that carry the fumes outside, looked over for gaps, rust and blockages.',
  'Water side': 'The pump, expansion tank and water pressure that move hot water to the radiators without leaks or air.',
  'Water use': 'How much fresh water was added since the last visit: a lot points to a leak that can damage the boiler.',
} as const satisfies Record<string, string>;

export type VisitStepName = keyof typeof VISIT_STEPS;

/** The plain "what we checked and why" line for a checklist section, or null for a company's own section name. */
export function visitStepWhy(section: string): string | null {
  return Object.hasOwn(VISIT_STEPS, section) ? VISIT_STEPS[section as VisitStepName] : null;
}

/** The sections a household is told were checked, each with its plain line where we have one, in the order given. */
export const explainSteps = (sections: readonly string[]) => sections.map((step) => ({ step, why: visitStepWhy(step) }));
