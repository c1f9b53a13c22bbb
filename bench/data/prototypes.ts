import type { Faker } from '@faker-js/faker';
import { planAppliance, type DemoApplianceRow } from '../../server/db/seed/demo-plan';
import { partSlotsFor } from '../../server/db/seed/demo-parts';
import { demoFindings, demoReadings } from '../../server/db/seed/demo-readings';
import { resultsToStore, keyReadings } from '../../server/modules/visits/visit-results';
import { COMPONENT_TYPES, formatSpec } from '../../shared/trade/component-types';

/**
 * The bulk load is set-based SQL, so the variety comes from a small set of prototypes built here with the demo
 * seed's own planners (invented makes, part slots, readings computed by the trade functions). Each generated
 * appliance picks a prototype, and each visit a reading of the prototype at a wear level, by a seeded hash.
 */
export const PROTOTYPE_COUNT = 64;
export const WEAR_LEVELS = 8;
export const READINGS_PER_WEAR = 3;

export type Prototype = { p: number; row: DemoApplianceRow };
/** `annual`: the demo swaps this part at every visit (oil nozzle and filter), so the generator does too. */
export type PrototypeSlot = { p: number; slot: number; typeCode: string; spec: Record<string, string | number>; specKey: string; label: string; reasons: string[]; annual: boolean };
export type PrototypeReading = { p: number; wear: number; r: number; readings: unknown; results: unknown; key: Record<string, number> | null; summary: string; findings: string };

const fmt = (v: number | undefined, unit: string, label: string) => (v === undefined ? null : `${label} ${v}${unit}`);

function readingSummary(key: Record<string, number> | null): string {
  if (!key) return 'Readings recorded.';
  const bits = [fmt(key.efficiencyPct, ' %', 'efficiency'), fmt(key.coAirFreePpm, ' ppm', 'air-free CO'), fmt(key.flueTempF, ' °F', 'flue')].filter(Boolean);
  return bits.length ? `Readings: ${bits.join(', ')}.` : 'Readings recorded.';
}

export function buildPrototypes(f: Faker, today: string) {
  const prototypes: Prototype[] = [];
  const slots: PrototypeSlot[] = [];
  const readings: PrototypeReading[] = [];
  for (let p = 0; p < PROTOTYPE_COUNT; p++) {
    const { row, shape } = planAppliance(f, { companyId: '', siteId: '', today, ageYears: f.number.int({ min: 1, max: 24 }), createdBy: '' });
    prototypes.push({ p, row });
    partSlotsFor(f, shape).forEach((s, slot) => {
      const label = COMPONENT_TYPES[s.typeCode].label;
      const annual = s.swapEveryYears?.[0] === 1 && s.swapEveryYears[1] === 1;
      slots.push({ p, slot, typeCode: s.typeCode, spec: s.spec, specKey: formatSpec(s.typeCode, s.spec), label, reasons: s.reasons, annual });
    });
    for (let wear = 0; wear < WEAR_LEVELS; wear++) {
      for (let r = 0; r < READINGS_PER_WEAR; r++) {
        const input = demoReadings(f, shape, wear / (WEAR_LEVELS - 1));
        const results = resultsToStore(input, { fuel: row.fuel, ventType: row.ventType, construction: row.construction, inputBtuh: row.inputBtuh });
        const key = keyReadings(input, results);
        readings.push({ p, wear, r, readings: input, results, key, summary: readingSummary(key), findings: demoFindings(f, shape) });
      }
    }
  }
  return { prototypes, slots, readings };
}
