import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { photos, users, visitAmendments, visits } from '../../db/schema/index';
import { LIFE_RECORD_EXPORT_FORMAT, LIFE_RECORD_EXPORT_VERSION, type LifeRecordExport } from '../../../shared/schemas/life-record-export';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import { readingMeanings, type StoredResults } from '../../../shared/visits/reading-meanings';
import { loadApplianceRecord } from '../appliances';
import { wholeYearsBetween } from '../appliances';
import { companyToday } from '../../core/company-today';
import { typeLabelFor } from '../../core/type-label';
import { swapsOfVisit } from '../visits';
import { findCompanyContact } from '../../core/tenant-finders';

/** Who the export is for: the office sees every photo and the serial; a homeowner their visible photos; a share link no serial. */
export type ExportAudience = 'office' | 'homeowner' | 'share';

export type ExportPhoto = { id: string; thumbKey: string; kind: string; caption: string | null; takenOn: string };

/**
 * The whole life record of one appliance, field by field (never internal notes or checklist notes), read with the
 * caller's company so another company's appliance answers 404.
 */
export async function buildLifeRecordExport(db: DbOrTx, companyId: string, applianceId: string, audience: ExportAudience, now = new Date()) {
  const record = await loadApplianceRecord(db, companyId, applianceId);
  const [company, today, visitRows, photoRows] = await Promise.all([
    findCompanyContact(db, companyId),
    companyToday(db, companyId),
    db
      .select()
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.applianceId, applianceId), eq(visits.status, 'completed')))
      .orderBy(desc(visits.visitedOn), desc(visits.completedAt)),
    db
      .select({ id: photos.id, thumbKey: photos.thumbKey, kind: photos.kind, caption: photos.caption, createdAt: photos.createdAt })
      .from(photos)
      .where(and(eq(photos.companyId, companyId), eq(photos.applianceId, applianceId), audience === 'office' ? undefined : eq(photos.homeownerVisible, true)))
      .orderBy(asc(photos.createdAt)),
  ]);
  const visitIds = visitRows.map((v) => v.id);
  const amendments = visitIds.length
    ? await db
        .select({ visitId: visitAmendments.visitId, reason: visitAmendments.reason, changes: visitAmendments.changes, createdAt: visitAmendments.createdAt })
        .from(visitAmendments)
        .leftJoin(users, eq(users.id, visitAmendments.createdBy))
        .where(and(eq(visitAmendments.companyId, companyId), inArray(visitAmendments.visitId, visitIds)))
        .orderBy(asc(visitAmendments.createdAt))
    : [];
  const swapsByVisit = new Map(await Promise.all(visitRows.map(async (v) => [v.id, await swapsOfVisit(db, companyId, v.id)] as const)));
  const a = record.appliance;

  const document: LifeRecordExport = {
    format: LIFE_RECORD_EXPORT_FORMAT,
    version: LIFE_RECORD_EXPORT_VERSION,
    exportedAt: now.toISOString(),
    recordedBy: company,
    appliance: {
      kind: a.kind,
      fuel: a.fuel,
      construction: a.construction,
      manufacturer: a.manufacturer,
      model: a.model,
      serial: audience === 'share' ? null : a.serial,
      manufacturedYear: a.manufacturedYear,
      manufacturedMonth: a.manufacturedMonth,
      installedOn: a.installedOn,
      ageYears: record.ageYears,
      location: a.location,
      address: `${record.site.street}, ${record.site.town}`,
      status: a.status,
      inputBtuPerHour: a.inputBtuh,
      grossOutputBtuPerHour: a.grossOutputBtuh,
      firingRateGallonsPerHour: a.firingRateGph,
      maxWorkingPressurePsi: a.mawpPsi,
      ignitionType: a.ignitionType,
      ventType: a.ventType,
    },
    components: record.components.map((c) => ({
      typeCode: c.typeCode,
      typeLabel: c.typeLabel,
      description: c.description,
      spec: c.spec,
      installedOn: c.installedOn,
      originalWithAppliance: c.originalWithAppliance,
      ageYears: c.installedOn && c.installedOn <= (c.removedOn ?? today) ? wholeYearsBetween(c.installedOn, c.removedOn ?? today) : null,
      lastInspectedOn: c.lastInspectedOn,
      conditionFailed: c.conditionFailed,
      removedOn: c.removedOn,
      removalReason: c.removalReason,
      due: c.due && { kind: c.due.kind, dueOn: c.due.dueOn, status: c.due.status },
    })),
    visits: visitRows.map((v) => ({
      visitedOn: v.visitedOn,
      type: v.type,
      outcome: v.outcome,
      outcomeReason: v.outcomeReason,
      findings: v.findings,
      recommendations: v.recommendations,
      checklist: v.checklist.map((i) => ({ section: i.section, label: i.label, mark: i.mark })),
      readings: v.readings as Record<string, unknown>,
      results: v.results as Record<string, unknown>,
      readingsInWords: readingMeanings(v.results as StoredResults, v.readings as ReadingsInput),
      partSwaps: (swapsByVisit.get(v.id) ?? []).map((s) => ({
        part: typeLabelFor(s.typeCode, s.catalogLabel),
        swappedOn: s.swappedOn,
        reason: s.reason,
        newDescription: s.newDescription,
      })),
      amendments: amendments
        .filter((m) => m.visitId === v.id)
        .map((m) => ({ reason: m.reason, changes: m.changes as Record<string, unknown>, madeAt: m.createdAt.toISOString() })),
    })),
    photos: photoRows.map((p) => ({ kind: p.kind, caption: p.caption, takenOn: p.createdAt.toISOString().slice(0, 10) })),
  };
  const photoFiles: ExportPhoto[] = photoRows.map((p) => ({ id: p.id, thumbKey: p.thumbKey, kind: p.kind, caption: p.caption, takenOn: p.createdAt.toISOString().slice(0, 10) }));
  return { document, photoFiles };
}
