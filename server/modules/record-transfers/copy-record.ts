import crypto from 'node:crypto';
import type { Tx } from '../../db/client';
import { appliances, auditLog, components, customers, partSwaps, photos, sites, timelineEvents, visitAmendments, visits } from '../../db/schema/index';
import type { ObjectStorage } from '../../lib/object-storage';
import { LABELS } from '../../../shared/schemas/enums';
import { formatCalendarDate } from '../../../shared/format/dates';
import { typeLabelFor } from '../../core/type-label';
import { recomputeDueForAppliance } from '../due';
import type { TransferableRecord } from './read-transferable-record';

export type CopyTarget = { companyId: string; actorId: string; transferId: string; senderName: string; receivedAt: Date; today: string; site: { id: string; customerId: string } | null };

async function readIfStored(storage: ObjectStorage, key: string) {
  return storage.get(key).catch((err: unknown) => {
    if ((err as { name?: string }).name === 'NoSuchKey') return null;
    throw err;
  });
}

/**
 * Writes the copy in the receiving company, inside the redeeming transaction: new ids everywhere, links between the
 * copied rows kept (a swap's old and new part, a photo's visit and part), every row marked with the transfer it came from.
 * Photo objects are copied first to keys of the receiving company; `written` lists them so a failed transaction can
 * remove them (else the orphan sweep does).
 */
export async function copyRecord(tx: Tx, storage: ObjectStorage, r: TransferableRecord, to: CopyTarget, written: string[]) {
  const { companyId, actorId, transferId } = to;
  const provenance = { transferId, recordedBy: to.senderName };
  const by = { createdBy: actorId };

  let site = to.site;
  const made: (typeof auditLog.$inferInsert)[] = [];
  if (!site) {
    const [customer] = await tx
      .insert(customers)
      .values({ companyId, name: r.place.homeownerName, kind: r.place.customerKind, ...by, updatedBy: actorId })
      .returning({ id: customers.id });
    const [row] = await tx
      .insert(sites)
      .values({ companyId, customerId: customer!.id, street: r.place.street, town: r.place.town, postalCode: r.place.postalCode, elevationFt: r.place.elevationFt, ...by, updatedBy: actorId })
      .returning({ id: sites.id, customerId: sites.customerId });
    site = row!;
    made.push({ companyId, actorId, action: 'create', entity: 'customer', entityId: customer!.id, changes: provenance });
    made.push({ companyId, actorId, action: 'create', entity: 'site', entityId: site.id, changes: provenance });
  }

  const a = r.appliance;
  const applianceId = crypto.randomUUID();
  await tx.insert(appliances).values({
    id: applianceId,
    companyId,
    siteId: site.id,
    kind: a.kind,
    fuel: a.fuel,
    construction: a.construction,
    manufacturer: a.manufacturer,
    model: a.model,
    serial: a.serial,
    inputBtuh: a.inputBtuh,
    firingRateGph: a.firingRateGph,
    grossOutputBtuh: a.grossOutputBtuh,
    mawpPsi: a.mawpPsi,
    manufacturedMonth: a.manufacturedMonth,
    manufacturedYear: a.manufacturedYear,
    installedOn: a.installedOn,
    location: a.location,
    ignitionType: a.ignitionType,
    burnerCount: a.burnerCount,
    ventType: a.ventType,
    status: a.status,
    importedFromTransferId: transferId,
    ...by,
    updatedBy: actorId,
  });

  const partId = new Map(r.parts.map((p) => [p.id, crypto.randomUUID()]));
  const visitId = new Map(r.visits.map((v) => [v.id, crypto.randomUUID()]));
  if (r.parts.length) {
    // One statement, so a part's link to the part that replaced it is checked once every part is in.
    await tx.insert(components).values(
      r.parts.map((p) => ({
        id: partId.get(p.id)!,
        companyId,
        applianceId,
        typeCode: p.typeCode,
        description: p.description,
        spec: p.spec,
        specKey: p.specKey,
        installedOn: p.installedOn,
        originalWithAppliance: p.originalWithAppliance,
        conditionFailed: p.conditionFailed,
        conditionNote: p.conditionNote,
        lastInspectedOn: p.lastInspectedOn,
        removedOn: p.removedOn,
        removalReason: p.removalReason,
        replacedById: p.replacedById ? (partId.get(p.replacedById) ?? null) : null,
        importedFromTransferId: transferId,
        ...by,
        updatedBy: actorId,
      })),
    );
  }
  if (r.visits.length) {
    await tx.insert(visits).values(
      r.visits.map((v) => ({
        id: visitId.get(v.id)!,
        companyId,
        applianceId,
        type: v.type,
        status: 'completed' as const,
        visitedOn: v.visitedOn,
        arrivedAt: v.arrivedAt,
        departedAt: v.departedAt,
        checklist: v.checklist.map((i) => ({ ...i, note: '' })),
        readings: v.readings,
        requiredReadings: v.requiredReadings,
        readingSkips: v.readingSkips,
        results: v.results,
        findings: v.findings,
        recommendations: v.recommendations,
        outcome: v.outcome,
        outcomeReason: v.outcomeReason,
        outcomeToldWhom: v.outcomeToldWhom,
        outcomeToldAt: v.outcomeToldAt,
        signedOffAt: v.signedOffAt,
        customerAckName: v.customerAckName,
        completedAt: v.completedAt,
        revision: v.revision,
        importedFromTransferId: transferId,
        ...by,
        updatedBy: actorId,
      })),
    );
  }
  if (r.amendments.length) {
    await tx.insert(visitAmendments).values(
      r.amendments.map((m) => ({ companyId, visitId: visitId.get(m.visitId)!, reason: m.reason, changes: m.changes, createdAt: m.createdAt, createdBy: null })),
    );
  }
  const swaps = r.swaps.filter((s) => partId.has(s.removedComponentId) && partId.has(s.newComponentId));
  if (swaps.length) {
    await tx.insert(partSwaps).values(
      swaps.map((s) => ({
        companyId,
        visitId: visitId.get(s.visitId)!,
        applianceId,
        removedComponentId: partId.get(s.removedComponentId)!,
        newComponentId: partId.get(s.newComponentId)!,
        swappedOn: s.swappedOn,
        reason: s.reason,
        cause: s.cause,
        importedFromTransferId: transferId,
        ...by,
      })),
    );
  }

  const photoRows: (typeof photos.$inferInsert)[] = [];
  for (const p of r.photos) {
    const base = `${companyId}/${applianceId}/${crypto.randomUUID()}`;
    const keys = { display: `${base}-display.jpg`, thumb: `${base}-thumb.jpg` };
    const objects = [];
    for (const from of [p.displayKey, p.thumbKey]) objects.push(await readIfStored(storage, from));
    // A photo whose bytes are gone from storage is left out rather than copied as a broken picture.
    if (objects.some((o) => !o)) continue;
    for (const [i, key] of [keys.display, keys.thumb].entries()) {
      await storage.put(key, objects[i]!.body, objects[i]!.contentType ?? 'image/jpeg');
      written.push(key);
    }
    photoRows.push({
      companyId,
      applianceId,
      visitId: p.visitId ? (visitId.get(p.visitId) ?? null) : null,
      componentId: p.componentId ? (partId.get(p.componentId) ?? null) : null,
      kind: p.kind,
      caption: p.caption,
      homeownerVisible: true,
      sha256: p.sha256,
      width: p.width,
      height: p.height,
      displayKey: keys.display,
      thumbKey: keys.thumb,
      bytes: p.bytes,
      importedFromTransferId: transferId,
      createdAt: p.createdAt,
      ...by,
    });
  }
  if (photoRows.length) await tx.insert(photos).values(photoRows);

  const from = `recorded by another company (${to.senderName})`;
  const events: (typeof timelineEvents.$inferInsert)[] = [
    {
      companyId,
      applianceId,
      occurredAt: to.receivedAt,
      kind: 'import',
      refId: transferId,
      summary: `Life record received from ${to.senderName} on ${formatCalendarDate(to.today)} with the homeowner's consent. History before this was ${from}.`,
      data: { ...provenance },
      homeownerVisible: true,
      actorId,
    },
    ...r.visits.map((v) => ({
      companyId,
      applianceId,
      occurredAt: v.completedAt ?? to.receivedAt,
      kind: 'visit' as const,
      refId: visitId.get(v.id)!,
      summary: `${LABELS.visitType[v.type]}${v.outcome ? `: ${LABELS.visitOutcome[v.outcome].toLowerCase()}` : ''} (${from})`,
      data: { ...provenance, transferred: true },
      homeownerVisible: true,
      actorId: null,
    })),
    ...swaps.map((s) => {
      const part = r.parts.find((p) => p.id === s.newComponentId)!;
      return {
        companyId,
        applianceId,
        occurredAt: new Date(`${s.swappedOn}T12:00:00Z`),
        kind: 'part_swap' as const,
        refId: visitId.get(s.visitId)!,
        summary: `Part swap: ${typeLabelFor(part.typeCode)} (${from})`,
        data: { ...provenance, transferred: true },
        homeownerVisible: true,
        actorId: null,
      };
    }),
  ];
  await tx.insert(timelineEvents).values(events);
  made.push({ companyId, actorId, action: 'transfer_received', entity: 'appliance', entityId: applianceId, changes: { ...provenance, counts: { components: r.parts.length, visits: r.visits.length, partSwaps: swaps.length, photos: photoRows.length } } });
  await tx.insert(auditLog).values(made);
  await recomputeDueForAppliance(tx, companyId, applianceId, { today: to.today });
  return { applianceId, siteId: site.id, customerId: site.customerId, counts: { components: r.parts.length, visits: r.visits.length, partSwaps: swaps.length, photos: photoRows.length } };
}
