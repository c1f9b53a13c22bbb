import type { DbOrTx } from '../../db/client';
import { notFound } from '../../lib/http-error';
import { LABELS } from '../../../shared/schemas/enums';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import { addMonths } from '../../../shared/trade/iso-date';
import { readingMeanings, type ReadingMeaning, type StoredResults } from '../../../shared/visits/reading-meanings';
import { loadApplianceRecord } from '../appliances';
import { wholeYearsBetween } from '../appliances';
import { typeLabelFor } from '../../core/type-label';
import { findVisit, visitUserNames, swapsOfVisit, amendmentsOfVisit } from '../visits';
import { visitAsCorrected } from './visit-as-corrected';
import { outcomeWords } from '../../../shared/glossary/outcomes';
import { findCompanyContact } from '../../core/tenant-finders';

export type VisitReport = {
  company: { name: string; phone: string };
  customerName: string;
  appliance: { title: string; makeAndModel: string | null; location: string | null; address: string; installedOn: string | null; ageYears: number | null };
  visit: { id: string; visitedOn: string; what: string; technicians: string[]; outcomeWords: string };
  /** Set when the visit left the appliance shut down as unsafe: said first, with what the household must do. */
  unsafe: { headline: string; reason: string; mustDo: string[] } | null;
  findings: string;
  recommendations: string;
  /** Why the visit was corrected afterwards, oldest first; the report shows the corrected fields. */
  corrections: string[];
  checklist: { section: string; label: string; result: string }[];
  readings: ReadingMeaning[];
  swaps: { part: string; fitted: string | null; removedAgeYears: number | null; reason: string | null }[];
  comingDue: { part: string; what: string; dueOn: string }[];
  nextAnnualServiceDue: string | null;
  safetyNotes: string[];
  /** Who the report goes to and which record it is about: for sending, never printed. */
  recipient: { customerId: string; email: string | null; optedOut: boolean; applianceId: string };
};

const RESULT_WORDS = { done: 'done', not_applicable: 'not needed on this appliance', needs_attention: 'needs attention' } as const;

// common practice: the cautions a service company leaves with a household; the manufacturer, local codes and licensed practice govern.
export const SAFETY_NOTES = [
  'Keep carbon monoxide (CO) alarms working near where people sleep, and test them as their maker says.',
  'If you smell gas, leave the building at once and call your gas supplier or emergency services from outside.',
  'Keep the area around the appliance clear, and do not block its air supply or vent.',
  "Work on gas and oil appliances is for licensed professionals, following the manufacturer's instructions and local codes: please do not attempt it yourself.",
];

const unsafeSteps = (company: { name: string; phone: string }) => [
  'Do not turn it back on, relight it, or let anyone else do so until a licensed technician has repaired it and says it is safe.',
  'If a carbon monoxide alarm sounds or anyone feels unwell (headache, dizziness, nausea), get everyone outside into fresh air and call emergency services.',
  'If you smell gas, leave the building at once and call your gas supplier or emergency services from outside.',
  `Call ${company.name} at ${company.phone} to arrange the repair.`,
];

/**
 * Everything the one-page visit report says, built field by field from the record, so internal notes and technician-only
 * fields (checklist notes included) can never slip through. Only completed visits have a report.
 */
export async function loadVisitReport(db: DbOrTx, companyId: string, visitId: string): Promise<VisitReport> {
  const stored = await findVisit(db, companyId, visitId);
  if (!stored || stored.status !== 'completed') throw notFound('Visit report');
  const visit = visitAsCorrected(stored, await amendmentsOfVisit(db, companyId, visitId));
  const [record, company, swaps, names] = await Promise.all([
    loadApplianceRecord(db, companyId, visit.applianceId),
    findCompanyContact(db, companyId),
    swapsOfVisit(db, companyId, visit.id),
    visitUserNames(db, visit.technicianIds),
  ]);
  const a = record.appliance;
  const byId = new Map(record.components.map((c) => [c.id, c]));
  const unsafe = visit.outcome === 'shut_down_unsafe';
  const reason = visit.outcomeReason ?? 'see the technician’s findings below';
  const isAnnual = visit.type === 'annual_maintenance';
  const lastAnnual = isAnnual ? visit.visitedOn : null;

  return {
    company,
    customerName: record.customer.name,
    appliance: {
      title: `${LABELS.applianceKind[a.kind]}, ${LABELS.fuel[a.fuel].toLowerCase()}`,
      makeAndModel: [a.manufacturer, a.model].filter(Boolean).join(' ') || null,
      location: a.location,
      address: `${record.site.street}, ${record.site.town}`,
      installedOn: a.installedOn,
      ageYears: record.ageYears,
    },
    visit: {
      id: visit.id,
      visitedOn: visit.visitedOn,
      what: LABELS.visitType[visit.type],
      technicians: visit.technicianIds.map((id) => names.get(id) ?? '').filter(Boolean),
      outcomeWords: outcomeWords(visit.outcome, reason) ?? 'Completed',
    },
    unsafe: unsafe
      ? { headline: 'This appliance was shut down as unsafe and must not be used.', reason, mustDo: unsafeSteps(company) }
      : null,
    findings: visit.findings,
    recommendations: visit.recommendations,
    corrections: visit.corrections,
    checklist: visit.checklist
      .filter((i) => i.mark)
      .map((i) => ({ section: i.section, label: i.label, result: RESULT_WORDS[i.mark!] })),
    readings: readingMeanings(visit.results as StoredResults, visit.readings as ReadingsInput),
    swaps: swaps.map((s) => {
      const removed = byId.get(s.removedComponentId);
      return {
        part: typeLabelFor(s.typeCode, s.catalogLabel),
        fitted: s.newDescription ?? (s.newSpecKey || null),
        removedAgeYears: removed?.installedOn ? wholeYearsBetween(removed.installedOn, s.swappedOn) : null,
        reason: s.reason,
      };
    }),
    comingDue: record.due
      .filter((d) => d.status !== 'ok')
      .map((d) => ({ part: d.typeLabel, what: d.kind === 'replacement' ? 'replace' : 'check', dueOn: d.dueOn })),
    nextAnnualServiceDue: lastAnnual ? addMonths(lastAnnual, 12) : null,
    safetyNotes: SAFETY_NOTES,
    recipient: { customerId: record.customer.id, email: record.customer.email, optedOut: record.customer.remindersOptOut, applianceId: visit.applianceId },
  };
}
