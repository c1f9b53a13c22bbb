import { and, asc, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, customers, components, partSwaps, photos, sites, visitAmendments, visits } from '../../db/schema/index';

/**
 * What a transfer copies, read with the sending company's id: the same parts of the record the homeowner's export
 * gives (server/modules/life-record-export/build-export.ts, audience "homeowner"): completed visits, every part with its
 * swaps, the photos the homeowner can see; never internal notes, checklist notes, site access notes or the team.
 */
export async function readTransferableRecord(db: DbOrTx, companyId: string, applianceId: string) {
  const [appliance] = await db.select().from(appliances).where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId)));
  if (!appliance) return null;
  const [place] = await db
    .select({
      street: sites.street,
      town: sites.town,
      postalCode: sites.postalCode,
      elevationFt: sites.elevationFt,
      homeownerName: customers.name,
      customerKind: customers.kind,
    })
    .from(sites)
    .innerJoin(customers, and(eq(customers.id, sites.customerId), eq(customers.companyId, companyId)))
    .where(and(eq(sites.companyId, companyId), eq(sites.id, appliance.siteId)));
  // One after another: inside the redeeming transaction these share one connection.
  const parts = await db
      .select()
      .from(components)
      .where(and(eq(components.companyId, companyId), eq(components.applianceId, applianceId)))
      .orderBy(asc(components.createdAt), asc(components.id));
  const visitRows = await db
      .select()
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.applianceId, applianceId), eq(visits.status, 'completed')))
      .orderBy(asc(visits.visitedOn), asc(visits.completedAt));
  const photoRows = await db
      .select()
      .from(photos)
      .where(and(eq(photos.companyId, companyId), eq(photos.applianceId, applianceId), eq(photos.homeownerVisible, true)))
      .orderBy(asc(photos.createdAt));
  const visitIds = visitRows.map((v) => v.id);
  const swaps = visitIds.length
    ? await db
        .select()
        .from(partSwaps)
        .where(and(eq(partSwaps.companyId, companyId), inArray(partSwaps.visitId, visitIds)))
        .orderBy(asc(partSwaps.createdAt))
    : [];
  const amendments = visitIds.length
    ? await db
        .select()
        .from(visitAmendments)
        .where(and(eq(visitAmendments.companyId, companyId), inArray(visitAmendments.visitId, visitIds)))
        .orderBy(asc(visitAmendments.createdAt))
    : [];
  return { appliance, place: place!, parts, visits: visitRows, swaps, amendments, photos: photoRows };
}

export type TransferableRecord = NonNullable<Awaited<ReturnType<typeof readTransferableRecord>>>;

export const countsOf = (r: TransferableRecord) => ({ components: r.parts.length, visits: r.visits.length, partSwaps: r.swaps.length, photos: r.photos.length });
