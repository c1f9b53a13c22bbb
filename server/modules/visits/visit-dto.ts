import type { DbOrTx } from '../../db/client';
import type { ReadingKey, ReadingsInput, VisitDto } from '../../../shared/schemas/visits';
import { typeLabelFor } from '../../core/type-label';
import { isOutcomeRequired, type VisitResults } from '../../../shared/visits/visit-results';
import { transferProvenance } from '../record-transfers';
import { visitsRepository, type VisitRow } from './visits.repository';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** The visit as stored, with names, its part swaps and every amendment (newest last) beside the original fields. */
export async function loadVisitDto(db: DbOrTx, companyId: string, visit: VisitRow): Promise<VisitDto> {
  const [swaps, amendments, recordedElsewhere] = await Promise.all([
    visitsRepository.swapsOfVisit(db, companyId, visit.id),
    visitsRepository.amendmentsOfVisit(db, companyId, visit.id),
    transferProvenance(db, visit.importedFromTransferId),
  ]);
  const people = [...visit.technicianIds, ...(visit.signedOffBy ? [visit.signedOffBy] : [])];
  const names = await visitsRepository.userNames(db, [...new Set(people)]);
  const results = visit.results as Partial<VisitResults>;
  return {
    id: visit.id,
    applianceId: visit.applianceId,
    type: visit.type,
    status: visit.status,
    visitedOn: visit.visitedOn,
    technicians: visit.technicianIds.map((id) => ({ id, name: names.get(id) ?? '' })),
    arrivedAt: iso(visit.arrivedAt),
    departedAt: iso(visit.departedAt),
    checklist: visit.checklist,
    readings: visit.readings as ReadingsInput,
    requiredReadings: visit.requiredReadings as ReadingKey[],
    readingSkips: visit.readingSkips,
    results: visit.results,
    outcomeRequired: isOutcomeRequired(results),
    findings: visit.findings,
    recommendations: visit.recommendations,
    internalNotes: visit.internalNotes,
    outcome: visit.outcome,
    outcomeReason: visit.outcomeReason,
    outcomeToldWhom: visit.outcomeToldWhom,
    outcomeToldAt: iso(visit.outcomeToldAt),
    signedOffBy: visit.signedOffBy ? { id: visit.signedOffBy, name: names.get(visit.signedOffBy) ?? '' } : null,
    signedOffAt: iso(visit.signedOffAt),
    customerAckName: visit.customerAckName,
    completedAt: iso(visit.completedAt),
    revision: visit.revision,
    swaps: swaps.map((s) => ({
      id: s.id,
      removedComponentId: s.removedComponentId,
      newComponentId: s.newComponentId,
      typeLabel: typeLabelFor(s.typeCode, s.catalogLabel),
      swappedOn: s.swappedOn,
      reason: s.reason,
      newDescription: s.newDescription,
    })),
    amendments: amendments.map((a) => ({
      id: a.id,
      reason: a.reason,
      changes: a.changes,
      createdAt: a.createdAt.toISOString(),
      createdByName: a.createdByName,
    })),
    recordedElsewhere,
  };
}
