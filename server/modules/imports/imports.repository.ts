import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, components, customers, importFiles, importMappings, sites, visits } from '../../db/schema/index';
import type { ImportField } from '../../../shared/imports/import-fields';
import { addressKey, nameKey, serialKey } from './match-keys';
import { partKey, visitKey, type ExistingRecords, type HistoryKeys } from './import-plan';

export type ImportFileRow = typeof importFiles.$inferSelect;

export const importsRepository = {
  async insertFile(db: DbOrTx, row: typeof importFiles.$inferInsert) {
    const [out] = await db.insert(importFiles).values(row).returning();
    return out;
  },
  async findFile(db: DbOrTx, companyId: string, id: string, options: { forUpdate?: boolean } = {}) {
    const q = db.select().from(importFiles).where(and(eq(importFiles.companyId, companyId), eq(importFiles.id, id)));
    const [row] = await (options.forUpdate ? q.for('update') : q);
    return row ?? null;
  },
  listFiles: (db: DbOrTx, companyId: string) =>
    db.select().from(importFiles).where(eq(importFiles.companyId, companyId)).orderBy(desc(importFiles.createdAt)).limit(20),
  async updateFile(db: DbOrTx, companyId: string, id: string, patch: Partial<typeof importFiles.$inferInsert>) {
    const [row] = await db
      .update(importFiles)
      .set(patch)
      .where(and(eq(importFiles.companyId, companyId), eq(importFiles.id, id)))
      .returning();
    return row;
  },
  async busyFile(db: DbOrTx, companyId: string) {
    const [row] = await db
      .select({ id: importFiles.id, fileName: importFiles.fileName })
      .from(importFiles)
      .where(and(eq(importFiles.companyId, companyId), inArray(importFiles.status, ['queued', 'importing'])))
      .limit(1);
    return row ?? null;
  },

  async rememberedMapping(db: DbOrTx, companyId: string): Promise<Record<string, ImportField>> {
    const [row] = await db.select({ byHeader: importMappings.byHeader }).from(importMappings).where(eq(importMappings.companyId, companyId));
    return row?.byHeader ?? {};
  },
  async rememberMapping(db: DbOrTx, companyId: string, byHeader: Record<string, ImportField>) {
    await db
      .insert(importMappings)
      .values({ companyId, byHeader })
      .onConflictDoUpdate({ target: importMappings.companyId, set: { byHeader: sql`${importMappings.byHeader} || excluded.by_header`, updatedAt: new Date() } });
  },

  async existingRecords(db: DbOrTx, companyId: string): Promise<ExistingRecords> {
    const [cs, ss, as] = await Promise.all([
      db.select({ id: customers.id, name: customers.name, externalId: customers.externalId, phone: customers.phone, email: customers.email }).from(customers).where(eq(customers.companyId, companyId)),
      db.select({ id: sites.id, customerId: sites.customerId, street: sites.street, town: sites.town }).from(sites).where(eq(sites.companyId, companyId)),
      db
        .select({ id: appliances.id, siteId: appliances.siteId, kind: appliances.kind, fuel: appliances.fuel, serial: appliances.serial, externalId: appliances.externalId })
        .from(appliances)
        .where(eq(appliances.companyId, companyId)),
    ]);
    const out: ExistingRecords = { customers: new Map(), sites: new Map(), appliances: new Map() };
    for (const c of cs) {
      const entry = { id: c.id, phone: c.phone, email: c.email };
      if (c.externalId) out.customers.set(`x:${c.externalId}`, entry);
      const byName = `n:${nameKey(c.name)}`;
      if (!out.customers.has(byName)) out.customers.set(byName, entry);
    }
    for (const s of ss) out.sites.set(`${s.customerId}|${addressKey(s.street)}|${addressKey(s.town)}`, s.id);
    for (const a of as) {
      if (a.externalId) out.appliances.set(`x:${a.externalId}`, a.id);
      if (a.serial) out.appliances.set(`${a.siteId}|s:${serialKey(a.serial)}`, a.id);
      const byKind = `${a.siteId}|k:${a.kind}|${a.fuel}`;
      if (!a.serial && !out.appliances.has(byKind)) out.appliances.set(byKind, a.id);
    }
    return out;
  },

  async historyKeys(db: DbOrTx, companyId: string, applianceIds: string[]): Promise<HistoryKeys> {
    const keys: HistoryKeys = { parts: new Set(), visits: new Set() };
    if (!applianceIds.length) return keys;
    const [ps, vs] = await Promise.all([
      db
        .select({ applianceId: components.applianceId, typeCode: components.typeCode, installedOn: components.installedOn })
        .from(components)
        .where(and(eq(components.companyId, companyId), inArray(components.applianceId, applianceIds))),
      db
        .select({ applianceId: visits.applianceId, visitedOn: visits.visitedOn, type: visits.type })
        .from(visits)
        .where(and(eq(visits.companyId, companyId), inArray(visits.applianceId, applianceIds))),
    ]);
    for (const p of ps) keys.parts.add(partKey(p.applianceId, p.typeCode, p.installedOn));
    for (const v of vs) keys.visits.add(visitKey(v.applianceId, v.visitedOn, v.type));
    return keys;
  },
};
