import type { Faker } from '@faker-js/faker';
import type { ChecklistItemRecord } from '../schema/index';
import type { appliances, components, partSwaps, timelineEvents, visits } from '../schema/index';
import { LABELS, type VisitOutcome, type VisitType } from '../../../shared/schemas/enums';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import { addDays, addYears, daysBetween } from '../../../shared/trade/iso-date';
import { COMPONENT_TYPES, formatSpec } from '../../../shared/trade/component-types';
import { resultsToStore, keyReadings } from '../../modules/visits';
import { findDefaultChecklist } from '../../modules/checklists';
import { requiredReadingsFor } from '../../../shared/visits/required-readings';
import { ATTENTION_NOTES, demoFindings, demoReadings } from './demo-readings';
import { partSlotsFor, type DemoApplianceShape, type PartSlot } from './demo-parts';
import type { DemoClock } from './demo-clock';

type Appliance = typeof appliances.$inferInsert & { id: string; installedOn: string };
type ComponentRow = typeof components.$inferInsert & { id: string };
type VisitRow = typeof visits.$inferInsert & { id: string };
type SwapRow = typeof partSwaps.$inferInsert & { id: string };
type EventRow = typeof timelineEvents.$inferInsert;

export type DemoHistoryPlan = {
  appliance: Appliance;
  shape: DemoApplianceShape;
  technicianId: string;
  customerName: string;
  /** The last day the appliance was in service: today, or the day it was removed. */
  lastDay: string;
  special?: 'unsafe' | 'thermocouple_due';
};
export type DemoHistoryRows = { components: ComponentRow[]; visits: VisitRow[]; swaps: SwapRow[]; events: EventRow[] };

const partLabel = (typeCode: string, specKey: string) => `${COMPONENT_TYPES[typeCode as keyof typeof COMPONENT_TYPES].label}${specKey ? ` (${specKey})` : ''}`;

function visitDates(f: Faker, installedOn: string, lastDay: string): string[] {
  const wanted = f.number.int({ min: 5, max: 20 });
  const dates: string[] = [];
  let d = addDays(lastDay, -f.number.int({ min: 20, max: 400 }));
  while (dates.length < wanted && daysBetween(installedOn, d) > 150) {
    dates.unshift(d);
    d = addDays(d, -f.number.int({ min: 345, max: 385 }));
  }
  return dates;
}

/**
 * When a visit on `plannedOn` took place, in the company's time: arriving between 08:00 and 14:00 and staying one to
 * two and a half hours. A visit planned for today that would not have ended by now took place the day before.
 */
export function visitTimes(f: Faker, clock: DemoClock, plannedOn: string) {
  const arriveHour = 7 + f.number.int({ min: 1, max: 7 });
  const lengthMs = f.number.int({ min: 60, max: 150 }) * 60_000;
  const on = (visitedOn: string) => {
    const arrivedAt = clock.at(visitedOn, arriveHour);
    return { visitedOn, arrivedAt, departedAt: new Date(arrivedAt.getTime() + lengthMs) };
  };
  const planned = on(plannedOn);
  return planned.departedAt <= clock.now ? planned : on(addDays(plannedOn, -1));
}

function readingSummary(k: Record<string, number>): string {
  const bits: string[] = [];
  if (k.efficiencyPct !== undefined) bits.push(`efficiency ${k.efficiencyPct} %`);
  if (k.coAirFreePpm !== undefined) bits.push(`air-free CO ${k.coAirFreePpm} ppm`);
  if (k.flueTempF !== undefined) bits.push(`flue ${k.flueTempF} °F`);
  if (k.thermocoupleOpenCircuitMv !== undefined) bits.push(`thermocouple ${k.thermocoupleOpenCircuitMv} mV open circuit`);
  if (k.steamOperatingPsi !== undefined) bits.push(`steam ${k.steamOperatingPsi} psi`);
  return bits.length ? `Readings: ${bits.join(', ')}.` : 'Readings recorded.';
}

function checklistFor(f: Faker, plan: DemoHistoryPlan): ChecklistItemRecord[] {
  const template = findDefaultChecklist(plan.shape.kind, plan.shape.fuel);
  if (!template) return [];
  const attention = new Set(f.helpers.arrayElements(Object.keys(ATTENTION_NOTES), f.helpers.arrayElement([0, 0, 0, 1, 1, 2])));
  return template.items.map((item) => {
    const pilotItem = item.key.startsWith('pilot_');
    if (pilotItem && plan.shape.ignitionType !== 'standing_pilot') return { ...item, mark: 'not_applicable', note: 'No standing pilot on this boiler.' };
    if (attention.has(item.key)) return { ...item, mark: 'needs_attention', note: f.helpers.arrayElement(ATTENTION_NOTES[item.key]) };
    return { ...item, mark: 'done', note: '' };
  });
}

/** Visits, part swaps, components and timeline events for one appliance's past, oldest first, none after `clock.now`. */
export function buildDemoHistory(f: Faker, plan: DemoHistoryPlan, clock: DemoClock): DemoHistoryRows {
  const { appliance: a, shape, technicianId } = plan;
  const rows: DemoHistoryRows = { components: [], visits: [], swaps: [], events: [] };
  const base = { companyId: a.companyId, applianceId: a.id };
  const label = [a.manufacturer, a.model].filter(Boolean).join(' ');
  rows.events.push({ ...base, occurredAt: clock.at(a.installedOn, 12), kind: 'install', summary: `Installed: ${label}, ${LABELS.applianceKind[shape.kind].toLowerCase()}.`, actorId: technicianId });

  type Current = { row: ComponentRow; slot: PartSlot; nextSwap: string | null };
  const nextSwapAfter = (slot: PartSlot, from: string) => (slot.swapEveryYears ? addYears(from, f.number.int({ min: slot.swapEveryYears[0], max: slot.swapEveryYears[1] })) : null);
  const dates = visitDates(f, a.installedOn, plan.lastDay);
  const recordsBegin = dates[0] ?? plan.lastDay;
  const current: Current[] = partSlotsFor(f, shape).map((slot) => {
    // Parts swapped before the records begin left no history; the part found at the first visit is on record.
    let fittedOn: string | null = null;
    let nextSwap = nextSwapAfter(slot, a.installedOn);
    while (nextSwap && nextSwap < recordsBegin) {
      fittedOn = nextSwap;
      nextSwap = nextSwapAfter(slot, nextSwap);
    }
    const row: ComponentRow = {
      ...base,
      id: f.string.uuid(),
      typeCode: slot.typeCode,
      description: slot.description ?? null,
      spec: slot.spec,
      specKey: formatSpec(slot.typeCode, slot.spec),
      installedOn: fittedOn,
      originalWithAppliance: fittedOn === null,
      note: fittedOn ? 'Fitted before our records began.' : null,
      createdBy: technicianId,
    };
    rows.components.push(row);
    return { row, slot, nextSwap };
  });

  dates.forEach((plannedOn, index) => {
    const last = index === dates.length - 1;
    const visitId = f.string.uuid();
    const { visitedOn, arrivedAt, departedAt } = visitTimes(f, clock, plannedOn);
    const wear = Math.min(1, daysBetween(a.installedOn, visitedOn) / 365 / 40);
    let type: VisitType = 'annual_maintenance';
    let outcome: VisitOutcome = 'left_operating';
    let outcomeReason: string | null = null;
    let recommendations = '';
    let overrides: Partial<ReadingsInput> = {};
    if (last && plan.special === 'unsafe') {
      type = 'no_heat';
      outcome = 'shut_down_unsafe';
      outcomeReason = 'Cracked section in the heat exchanger; air-free CO above 800 ppm in the flue. Gas shut off at the appliance valve and the boiler tagged.';
      recommendations = 'Replace the boiler. Do not relight until it has been repaired or replaced.';
      overrides = { combustion: { o2Pct: 10.5, coPpm: 460, flueTempF: 470, airTempF: 64, draftInWc: -0.01, ambientCoPpm: 9, spillageSeconds: 90, steadyFiringMinutes: 5 } };
    }
    if (last && plan.special === 'thermocouple_due') {
      overrides = { thermocouple: { openCircuitMv: 16, closedCircuitMv: 7 } };
      recommendations = 'Replace the thermocouple at the next call; it is weak and the pilot may drop out.';
      outcomeReason = 'Told the customer the thermocouple is weak (16 mV) and the pilot may drop out; replacement booked for the next call.';
    }
    const readings = demoReadings(f, shape, wear, overrides);
    const results = resultsToStore(readings, { fuel: shape.fuel, ventType: a.ventType, construction: a.construction, kind: shape.kind });
    const checklist = checklistFor(f, plan);

    const swapped: string[] = [];
    for (const slotState of current) {
      const due = slotState.nextSwap && slotState.nextSwap <= visitedOn;
      const keepForDemo = last && plan.special === 'thermocouple_due' && slotState.slot.typeCode === 'thermocouple';
      if (!due || keepForDemo || outcome === 'shut_down_unsafe') continue;
      const old = slotState.row;
      const reason = f.helpers.arrayElement(slotState.slot.reasons);
      const fresh: ComponentRow = { ...old, id: f.string.uuid(), installedOn: visitedOn, originalWithAppliance: false, note: null };
      old.removedOn = visitedOn;
      old.removalReason = reason;
      old.replacedById = fresh.id;
      rows.components.push(fresh);
      const swapId = f.string.uuid();
      // A part changed at every annual service (filter, nozzle) comes out on schedule, not because it wore out.
      const cause = (slotState.slot.swapEveryYears?.[1] ?? Infinity) <= 1 ? ('other' as const) : ('wear_or_failure' as const);
      rows.swaps.push({ ...base, id: swapId, visitId, removedComponentId: old.id, newComponentId: fresh.id, swappedOn: visitedOn, reason, cause, createdBy: technicianId });
      rows.events.push({
        ...base,
        occurredAt: new Date(departedAt.getTime() - 60_000),
        kind: 'part_swap',
        refId: swapId,
        summary: `Replaced the ${partLabel(old.typeCode, old.specKey ?? '')}: ${reason}.`,
        data: { swapId, visitId, typeCode: old.typeCode, specKey: old.specKey, removedComponentId: old.id, newComponentId: fresh.id, swappedOn: visitedOn },
        actorId: technicianId,
      });
      swapped.push(partLabel(old.typeCode, old.specKey ?? ''));
      slotState.row = fresh;
      slotState.nextSwap = nextSwapAfter(slotState.slot, visitedOn);
    }
    for (const s of current) s.row.lastInspectedOn = visitedOn;

    rows.visits.push({
      ...base,
      id: visitId,
      type,
      status: 'completed',
      visitedOn,
      technicianIds: [technicianId],
      arrivedAt,
      departedAt,
      checklist,
      readings,
      requiredReadings: requiredReadingsFor(findDefaultChecklist(shape.kind, shape.fuel), type),
      results,
      findings: outcome === 'shut_down_unsafe' ? 'No heat. Found flame rolling out and soot at the draft hood; cracked section visible at the rear.' : demoFindings(f, shape),
      recommendations,
      outcome,
      outcomeReason,
      outcomeToldWhom: outcomeReason !== null ? plan.customerName : null,
      outcomeToldAt: outcomeReason !== null ? departedAt : null,
      signedOffBy: technicianId,
      signedOffAt: departedAt,
      completedAt: departedAt,
      revision: 1,
      createdBy: technicianId,
      updatedBy: technicianId,
    });
    const attention = checklist.filter((i) => i.mark === 'needs_attention').map((i) => i.label.replace(/\.$/, ''));
    const summary = [`${LABELS.visitType[type]}: ${LABELS.visitOutcome[outcome].toLowerCase()}.`];
    if (swapped.length) summary.push(`Replaced: ${swapped.join(', ')}.`);
    if (attention.length) summary.push(`Needs attention: ${attention.join('; ')}.`);
    rows.events.push({
      ...base,
      occurredAt: departedAt,
      kind: 'visit',
      refId: visitId,
      summary: summary.join(' '),
      data: { visitId, type, outcome, visitedOn, swapIds: rows.swaps.filter((s) => s.visitId === visitId).map((s) => s.id) },
      actorId: technicianId,
    });
    const key = keyReadings(readings, results);
    if (key) rows.events.push({ ...base, occurredAt: departedAt, kind: 'reading', refId: visitId, summary: readingSummary(key), data: { visitId, visitedOn, ...key }, actorId: technicianId });

    if (last && plan.special === 'thermocouple_due') {
      const tc = current.find((s) => s.slot.typeCode === 'thermocouple')!;
      tc.row.conditionFailed = true;
      tc.row.conditionNote = results.thermocouple?.reason ?? 'Open circuit 16 mV: replace.';
    }
  });
  return rows;
}
