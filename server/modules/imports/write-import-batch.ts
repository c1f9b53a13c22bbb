import { and, eq } from 'drizzle-orm';
import type { Tx } from '../../db/client';
import { appliances, auditLog, components, customers, sites, timelineEvents, visits } from '../../db/schema/index';
import { LABELS } from '../../../shared/schemas/enums';
import { formatCalendarDate } from '../../../shared/format/dates';
import { COMPONENT_TYPES } from '../../../shared/trade/component-types';
import type { RowPlan } from './import-plan';

export type ImportSource = { importId: string; fileName: string; importedOn: string; companyId: string; actorId: string | null };

// A date-only fact (an install, a past visit) is placed at noon UTC: the same calendar date in every US time zone.
const atNoon = (date: string) => new Date(`${date}T12:00:00Z`);

/** Writes one batch of planned rows in the caller's transaction: multi-row inserts, one audit row per new record. */
export async function writeImportBatch(tx: Tx, source: ImportSource, batch: RowPlan[]) {
  const { companyId, actorId, importId, fileName, importedOn } = source;
  const provenance = { importId, fileName, importedOn };
  const audit: (typeof auditLog.$inferInsert)[] = [];
  const events: (typeof timelineEvents.$inferInsert)[] = [];

  const newCustomers = batch.filter((r) => r.customer.insert);
  if (newCustomers.length) {
    await tx.insert(customers).values(
      newCustomers.map(({ row, customer }) => ({
        id: customer.id,
        companyId,
        name: row.customer.name,
        phone: row.customer.phone,
        email: row.customer.email,
        externalId: row.customer.externalId,
        createdBy: actorId,
        updatedBy: actorId,
      })),
    );
    for (const r of newCustomers) audit.push({ companyId, actorId, action: 'import', entity: 'customer', entityId: r.customer.id, changes: { ...provenance, row: r.row.row } });
  }
  for (const r of batch.filter((x) => Object.keys(x.customer.fill).length)) {
    await tx
      .update(customers)
      .set({ ...r.customer.fill, updatedBy: actorId })
      .where(and(eq(customers.companyId, companyId), eq(customers.id, r.customer.id)));
    audit.push({ companyId, actorId, action: 'import_update', entity: 'customer', entityId: r.customer.id, changes: { ...provenance, row: r.row.row, ...r.customer.fill } });
  }

  const newSites = batch.filter((r) => r.site.insert);
  if (newSites.length) {
    await tx.insert(sites).values(
      newSites.map(({ row, site, customer }) => ({
        id: site.id,
        companyId,
        customerId: customer.id,
        street: row.site.street,
        town: row.site.town,
        postalCode: row.site.postalCode,
        accessNotes: row.site.accessNotes,
        elevationFt: row.site.elevationFt,
        createdBy: actorId,
        updatedBy: actorId,
      })),
    );
    for (const r of newSites) audit.push({ companyId, actorId, action: 'import', entity: 'site', entityId: r.site.id, changes: { ...provenance, row: r.row.row } });
  }

  const newAppliances = batch.filter((r) => r.appliance.insert);
  if (newAppliances.length) {
    await tx.insert(appliances).values(
      newAppliances.map(({ row, appliance, site }) => {
        const { assumed: _assumed, ...fields } = row.appliance;
        return { ...fields, id: appliance.id, companyId, siteId: site.id, importId, createdBy: actorId, updatedBy: actorId };
      }),
    );
    for (const r of newAppliances) {
      audit.push({ companyId, actorId, action: 'import', entity: 'appliance', entityId: r.appliance.id, changes: { ...provenance, row: r.row.row } });
      const assumed = r.row.appliance.assumed;
      events.push({
        companyId,
        applianceId: r.appliance.id,
        occurredAt: r.row.appliance.installedOn ? atNoon(r.row.appliance.installedOn) : new Date(),
        kind: 'import',
        summary: `Brought in from ${fileName} on ${formatCalendarDate(importedOn)} (row ${r.row.row}).${assumed.length ? ` Not in the file, so assumed until checked on a visit: ${assumed.join(', ')}.` : ''}`,
        data: { ...provenance, row: r.row.row, assumed },
        homeownerVisible: false,
        actorId,
      });
    }
  }

  const parts = batch.flatMap((r) => r.parts.map((p) => ({ r, p })));
  if (parts.length) {
    await tx.insert(components).values(
      parts.map(({ r, p }) => ({
        id: p.id,
        companyId,
        applianceId: r.appliance.id,
        typeCode: p.typeCode,
        spec: p.spec,
        specKey: p.specKey,
        description: p.description,
        installedOn: p.installedOn,
        // Without a date of its own the part is taken to be as old as the appliance (its date, if any, was used).
        originalWithAppliance: !p.installedOn,
        note: `Imported from ${fileName}`,
        createdBy: actorId,
        updatedBy: actorId,
      })),
    );
  }

  const history = batch.flatMap((r) => r.visits.map((v) => ({ r, v })));
  if (history.length) {
    await tx.insert(visits).values(
      history.map(({ r, v }) => ({
        id: v.id,
        companyId,
        applianceId: r.appliance.id,
        type: v.type,
        status: 'completed' as const,
        visitedOn: v.visitedOn,
        findings: v.notes,
        outcome: v.outcome,
        completedAt: atNoon(v.visitedOn),
        importId,
        createdBy: actorId,
        updatedBy: actorId,
      })),
    );
    for (const { r, v } of history) {
      events.push({
        companyId,
        applianceId: r.appliance.id,
        occurredAt: atNoon(v.visitedOn),
        kind: 'visit',
        refId: v.id,
        summary: `${LABELS.visitType[v.type]}${v.outcome ? `: ${LABELS.visitOutcome[v.outcome].toLowerCase()}` : ''} (imported from ${fileName})`,
        data: { ...provenance, imported: true },
        actorId,
      });
      audit.push({ companyId, actorId, action: 'import', entity: 'visit', entityId: v.id, changes: { ...provenance, row: r.row.row } });
    }
  }
  for (const { r, p } of parts) {
    if (!r.appliance.insert) {
      events.push({
        companyId,
        applianceId: r.appliance.id,
        occurredAt: p.installedOn ? atNoon(p.installedOn) : new Date(),
        kind: 'import',
        refId: p.id,
        summary: `Part on record: ${COMPONENT_TYPES[p.typeCode].label}${p.specKey ? `, ${p.specKey}` : ''} (imported from ${fileName})`,
        data: { ...provenance, componentId: p.id },
        homeownerVisible: false,
        actorId,
      });
    }
  }

  if (events.length) await tx.insert(timelineEvents).values(events);
  if (audit.length) await tx.insert(auditLog).values(audit);
  return { parts: parts.length, visits: history.length };
}

