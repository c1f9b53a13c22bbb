import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, componentCatalog, components, partSwaps, photos, sites, visits } from '../../db/schema/index';

export const homeownerRepository = {
  /** Completed visits only: a draft is the technician's work in progress. Internal notes are never selected. */
  completedVisits(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select({
        id: visits.id,
        type: visits.type,
        visitedOn: visits.visitedOn,
        checklist: visits.checklist,
        results: visits.results,
        findings: visits.findings,
        recommendations: visits.recommendations,
        outcome: visits.outcome,
        outcomeReason: visits.outcomeReason,
      })
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.applianceId, applianceId), eq(visits.status, 'completed')))
      .orderBy(desc(visits.visitedOn), desc(visits.completedAt));
  },
  swapsFor(db: DbOrTx, companyId: string, visitIds: string[]) {
    if (!visitIds.length) return Promise.resolve([]);
    return db
      .select({ visitId: partSwaps.visitId, reason: partSwaps.reason, typeCode: components.typeCode, label: componentCatalog.label })
      .from(partSwaps)
      .innerJoin(components, eq(components.id, partSwaps.removedComponentId))
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, partSwaps.companyId), eq(componentCatalog.code, components.typeCode)))
      .where(and(eq(partSwaps.companyId, companyId), inArray(partSwaps.visitId, visitIds)))
      .orderBy(asc(partSwaps.createdAt));
  },
  visiblePhotos(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select({ id: photos.id, caption: photos.caption, kind: photos.kind, createdAt: photos.createdAt })
      .from(photos)
      .where(and(eq(photos.companyId, companyId), eq(photos.applianceId, applianceId), eq(photos.homeownerVisible, true)))
      .orderBy(desc(photos.createdAt));
  },
  appliancesOfCustomers(db: DbOrTx, companyId: string, customerIds: string[]) {
    if (!customerIds.length) return Promise.resolve([]);
    return db
      .select({ id: appliances.id, kind: appliances.kind, fuel: appliances.fuel, street: sites.street, town: sites.town, customerId: sites.customerId })
      .from(appliances)
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .where(and(eq(appliances.companyId, companyId), inArray(sites.customerId, customerIds)))
      .orderBy(asc(sites.street));
  },
};
