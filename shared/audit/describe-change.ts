/**
 * One audit row in plain words for the history of changes. The audit trail stores codes (action, entity, the
 * request's fields); nobody reads those on a screen, so every row gets a sentence here, and a row this file does
 * not know still gets one ("Made a change to …"), never its code.
 */
import { COMPONENT_TYPES } from '../trade/component-types';
import { READING_LABELS } from '../visits/reading-labels';

export type AuditRowFacts = { action: string; entity: string; changes: Record<string, unknown> | null };

/** What a visit looked like before an amendment: its signed-off values with earlier amendments laid over them. */
export type VisitState = { outcome: string | null; outcomeReason: string | null; findings: string; recommendations: string; readings: Record<string, unknown> };

export type ChangeWords = { what: string; details: string[]; why: string | null };

const OUTCOME_WORDS: Record<string, string> = { left_operating: 'left operating', shut_down_unsafe: 'shut down as unsafe' };
const VISIT_TYPE_WORDS: Record<string, string> = {
  annual_maintenance: 'annual maintenance',
  repair: 'repair',
  install: 'install',
  no_heat: 'no-heat call',
  inspection: 'inspection',
};

/** The readings inside a block, with their units, as the visit form names them. */
const READING_LEAF: Record<string, { label: string; unit?: string }> = {
  'combustion.o2Pct': { label: 'O2 reading', unit: '%' },
  'combustion.coPpm': { label: 'CO reading', unit: 'ppm' },
  'combustion.flueTempF': { label: 'flue temperature', unit: '°F' },
  'combustion.airTempF': { label: 'combustion-air temperature', unit: '°F' },
  'combustion.draftInWc': { label: 'draft reading', unit: 'in. w.c.' },
  'combustion.ambientCoPpm': { label: 'ambient CO reading', unit: 'ppm' },
  'combustion.spillageSeconds': { label: 'spillage time', unit: 's' },
  'combustion.outdoorTempF': { label: 'outdoor temperature', unit: '°F' },
  'combustion.steadyFiringMinutes': { label: 'minutes of steady firing', unit: 'min' },
  'gasInput.dialCubicFeet': { label: 'meter dial size', unit: 'cu ft' },
  'gasInput.secondsPerRevolution': { label: 'seconds per revolution', unit: 's' },
  'gasInput.heatingValueBtuPerCubicFoot': { label: 'gas heating value', unit: 'Btu/cu ft' },
  'thermocouple.openCircuitMv': { label: 'open-circuit millivolts', unit: 'mV' },
  'thermocouple.closedCircuitMv': { label: 'closed-circuit millivolts', unit: 'mV' },
  'oil.smokeSpot': { label: 'smoke spot' },
  'oil.pumpPressurePsi': { label: 'oil pump pressure', unit: 'psi' },
  'oil.nozzleGph': { label: 'nozzle rating', unit: 'gph' },
  'oil.overFireDraftInWc': { label: 'over-fire draft', unit: 'in. w.c.' },
  'oil.breechDraftInWc': { label: 'breech draft', unit: 'in. w.c.' },
  'makeupWater.meterGallons': { label: 'feeder meter reading', unit: 'gal' },
  'makeupWater.addedByHandGallons': { label: 'water added by hand', unit: 'gal' },
  steamOperatingPsi: { label: 'steam operating pressure', unit: 'psi' },
  pressureControlCutInPsi: { label: 'pressure control cut-in', unit: 'psi' },
  pressureControlCutOutPsi: { label: 'pressure control cut-out', unit: 'psi' },
  fillPressurePsi: { label: 'fill pressure', unit: 'psi' },
  expansionTankPrechargePsi: { label: 'expansion tank pre-charge', unit: 'psi' },
  gasInletInWc: { label: 'gas inlet pressure', unit: 'in. w.c.' },
  gasManifoldInWc: { label: 'manifold pressure', unit: 'in. w.c.' },
  gaugeGlassLevel: { label: 'gauge-glass water level' },
};

/** "burnerCount" → "burner count": field names of the record's own forms, in words. */
export function fieldWords(key: string): string {
  return key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase()
    .replace(/\b(btuh|btu)\b/, 'Btu/h');
}

const isRecord = (v: unknown): v is Record<string, unknown> => Boolean(v) && typeof v === 'object' && !Array.isArray(v);
const text = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : null);

function valueWords(v: unknown, unit?: string): string {
  if (v === null || v === undefined || v === '') return 'nothing';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') return unit ? `${v} ${unit}` : String(v);
  if (typeof v === 'string') return `“${v}”`;
  return 'a new value';
}

function listWords(items: string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** Every reading leaf that differs between two readings objects, as "Changed the CO reading from 40 ppm to 120 ppm." */
export function readingChanges(before: Record<string, unknown>, after: Record<string, unknown>): { label: string; sentence: string }[] {
  const out: { label: string; sentence: string }[] = [];
  for (const block of Object.keys(after)) {
    const b = before[block];
    const a = after[block];
    if (isRecord(a) || isRecord(b)) {
      const keys = new Set([...Object.keys(isRecord(b) ? b : {}), ...Object.keys(isRecord(a) ? a : {})]);
      for (const key of keys) {
        const from = isRecord(b) ? b[key] : undefined;
        const to = isRecord(a) ? a[key] : undefined;
        if (JSON.stringify(from ?? null) === JSON.stringify(to ?? null)) continue;
        const leaf = READING_LEAF[`${block}.${key}`];
        const label = leaf?.label ?? `${((READING_LABELS as Record<string, string>)[block] ?? fieldWords(block)).toLowerCase()}: ${fieldWords(key)}`;
        out.push({ label, sentence: `Changed the ${label} from ${valueWords(from, leaf?.unit)} to ${valueWords(to, leaf?.unit)}.` });
      }
    } else if (JSON.stringify(b ?? null) !== JSON.stringify(a ?? null)) {
      const leaf = READING_LEAF[block];
      const label = leaf?.label ?? ((READING_LABELS as Record<string, string>)[block] ?? fieldWords(block)).toLowerCase();
      out.push({ label, sentence: `Changed the ${label} from ${valueWords(b, leaf?.unit)} to ${valueWords(a, leaf?.unit)}.` });
    }
  }
  return out;
}

/** The readings after an amendment: each given block replaces the stored one (as the server merges them). */
export const mergeReadingBlocks = (current: Record<string, unknown>, given: Record<string, unknown>) => ({ ...current, ...given });

/** An amendment in words, against the visit as it stood before it; `next` is the state after it. */
export function describeAmendment(changes: Record<string, unknown>, before: VisitState): { words: ChangeWords; next: VisitState } {
  const corrected = isRecord(changes.changes) ? changes.changes : {};
  const details: string[] = [];
  const touched: string[] = [];
  const next: VisitState = { ...before, readings: { ...before.readings } };
  for (const field of ['findings', 'recommendations'] as const) {
    const v = corrected[field];
    if (typeof v !== 'string') continue;
    touched.push(`the ${field}`);
    details.push(`Changed the ${field} from ${valueWords(before[field])} to ${valueWords(v)}.`);
    next[field] = v;
  }
  if (isRecord(corrected.outcome)) {
    const o = corrected.outcome;
    if (o.outcome !== undefined && o.outcome !== before.outcome) {
      const from = before.outcome ? (OUTCOME_WORDS[before.outcome] ?? 'another outcome') : 'none';
      const to = typeof o.outcome === 'string' ? (OUTCOME_WORDS[o.outcome] ?? 'another outcome') : 'none';
      details.push(`Changed the outcome from ${from} to ${to}.`);
      next.outcome = typeof o.outcome === 'string' ? o.outcome : null;
    }
    if (o.outcomeReason !== undefined && (o.outcomeReason ?? null) !== before.outcomeReason) {
      details.push(`Changed the reason for the outcome from ${valueWords(before.outcomeReason)} to ${valueWords(o.outcomeReason)}.`);
      next.outcomeReason = typeof o.outcomeReason === 'string' ? o.outcomeReason : null;
    }
    if (o.outcomeToldWhom !== undefined) details.push(`Changed who was told of the outcome to ${valueWords(o.outcomeToldWhom)}.`);
    touched.push('the outcome');
  }
  if (isRecord(corrected.readings)) {
    const changed = readingChanges(before.readings, corrected.readings);
    next.readings = mergeReadingBlocks(before.readings, corrected.readings);
    details.push(...changed.map((r) => r.sentence));
    touched.push(...(changed.length ? changed.map((r) => `the ${r.label}`) : ['the readings']));
  }
  if (Array.isArray(corrected.checklist)) {
    touched.push('the checklist');
    details.push(`Corrected ${corrected.checklist.length === 1 ? 'one checklist step' : `${corrected.checklist.length} checklist steps`}.`);
  }
  if (Array.isArray(corrected.swaps)) {
    touched.push('a part swap');
    for (const s of corrected.swaps) if (isRecord(s) && typeof s.swappedOn === 'string') details.push(`Moved a part swap to ${s.swappedOn}.`);
  }
  const what = touched.length ? `Amended ${listWords([...new Set(touched)])}` : 'Amended the visit';
  return { words: { what, details, why: text(changes.reason) }, next };
}

const partName = (code: unknown) => (typeof code === 'string' && code in COMPONENT_TYPES ? COMPONENT_TYPES[code as keyof typeof COMPONENT_TYPES].label : 'part');

/** Every other row in words. Amendments go through describeAmendment, which needs the visit's earlier state. */
export function describeChange(row: AuditRowFacts): ChangeWords {
  const c = row.changes ?? {};
  const fields = (o: Record<string, unknown>) => listWords(Object.keys(o).filter((k) => o[k] !== undefined).map(fieldWords));
  switch (`${row.entity}:${row.action}`) {
    case 'appliance:create':
      return { what: 'Created the life record', details: [], why: null };
    case 'appliance:update':
      return { what: Object.keys(c).length ? `Changed the record's ${fields(c)}` : "Changed the record's details", details: [], why: null };
    case 'appliance:replace':
      return { what: 'Marked the appliance removed and linked its replacement', details: typeof c.removedOn === 'string' ? [`Removed on ${c.removedOn}.`] : [], why: text(c.reason) };
    case 'component:create':
      return { what: `Added a part: ${partName(c.typeCode)}`, details: [], why: null };
    case 'visit:start': {
      const type = typeof c.type === 'string' ? VISIT_TYPE_WORDS[c.type] : undefined;
      return { what: type ? `Started a visit (${type})` : 'Started a visit', details: [], why: null };
    }
    case 'visit:save_draft': {
      const changed = Array.isArray(c.fields) ? c.fields.filter((f): f is string => typeof f === 'string') : [];
      return { what: 'Saved the visit draft', details: changed.length ? [`Saved ${listWords(changed.map((f) => `the ${fieldWords(f)}`))}.`] : [], why: null };
    }
    case 'visit:complete': {
      const outcome = typeof c.outcome === 'string' ? OUTCOME_WORDS[c.outcome] : undefined;
      return { what: 'Completed the visit', details: outcome ? [`Outcome: ${outcome}.`] : [], why: null };
    }
    case 'visit:amend':
      return { what: 'Amended the visit', details: [], why: text(c.reason) };
    case 'visit:visit_report_mailed':
      return { what: 'E-mailed the visit report to the household', details: [], why: null };
    case 'visit:visit_report_not_mailed':
      return {
        what: 'Did not e-mail the visit report',
        details: [],
        why: c.reason === 'opted_out' ? 'The household asked for no e-mails.' : c.reason === 'no_email' ? 'There is no e-mail address for the household.' : null,
      };
    case 'part_swap:swap':
      return { what: 'Swapped a part', details: typeof c.swappedOn === 'string' ? [`Swapped on ${c.swappedOn}.`] : [], why: text(c.reason) };
    case 'tag:assign':
      return { what: typeof c.code === 'string' ? `Put tag ${c.code} on the appliance` : 'Put a tag on the appliance', details: c.retiredTagId ? ['The old tag was retired.'] : [], why: null };
    case 'share_link:create':
      return { what: c.for === 'visit_report_mail' ? 'Made a link for the visit report e-mail' : 'Made a share link for the household', details: [], why: null };
    case 'photo:create':
      return { what: 'Added a photo', details: text(c.caption) ? [`Caption: “${text(c.caption)}”.`] : [], why: null };
    case 'photo:update':
      return { what: 'Changed a photo’s caption or who may see it', details: [], why: null };
    case 'makeup_water_entry:create': {
      const gallons = typeof c.gallons === 'number' ? `${c.gallons} gal` : null;
      const what = c.kind === 'meter_reading' ? `Recorded a makeup-water meter reading${gallons ? ` of ${gallons}` : ''}` : `Recorded water added by hand${gallons ? `: ${gallons}` : ''}`;
      return { what, details: [], why: text(c.note) };
    }
    case 'radiation_survey:create':
      return { what: 'Recorded a radiation survey', details: typeof c.rooms === 'number' ? [`${c.rooms} ${c.rooms === 1 ? 'room' : 'rooms'}.`] : [], why: null };
    case 'record_transfer:create':
      return { what: 'Made a transfer code for another company', details: [], why: null };
    case 'record_transfer:transfer_sent':
      return { what: 'Sent a copy of the record to another company', details: [], why: null };
    case 'service_request:create':
      return { what: 'A service request came in', details: [], why: null };
    case 'booking:booked':
      return { what: 'Booked a visit', details: [], why: text(c.note) };
    case 'booking:moved':
      return { what: 'Moved a booked visit', details: [], why: text(c.reason) ?? text(c.note) };
    case 'booking:confirmed':
      return { what: 'Confirmed a booked visit', details: [], why: null };
    case 'booking:cancelled':
      return { what: 'Cancelled a booked visit', details: [], why: text(c.reason) };
    case 'booking:no_access':
      return { what: 'Recorded that nobody could let us in for a booked visit', details: [], why: text(c.reason) };
    case 'reminder:send':
      return { what: 'Sent a service reminder', details: [], why: null };
    default:
      return { what: `Made a change to the ${fieldWords(row.entity)}`, details: [], why: text(c.reason) ?? text(c.note) };
  }
}
