import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, checklistTemplates, componentCatalog } from '../../server/db/schema/index';
import { findTemplateFor } from '../../server/modules/checklists/checklists.repository';
import { COMPONENT_TYPE_CODES } from '../../shared/trade/component-types';
import { readingsInput } from '../../shared/schemas/visits';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;

type Template = { id: string; name: string; applianceKind: string; fuel: string | null; items: { key: string; caution?: string; readings?: string[] }[] };

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

describe('component catalog', () => {
  it('every new company has every part type; members read it', async () => {
    for (const agent of [as.owner, as.manager, as.technician]) {
      const res = await agent.get('/api/catalog/component-types');
      expect(res.status).toBe(200);
      expect(res.body.map((e: { code: string }) => e.code).sort()).toEqual([...COMPONENT_TYPE_CODES].sort());
    }
    const res = await as.owner.get('/api/catalog/component-types');
    expect(res.body.find((e: { code: string }) => e.code === 'nozzle')).toMatchObject({ group: 'oil', label: 'oil burner nozzle', active: true });
  });

  it('lets owner and manager rename or retire a type, stored with an audit row', async () => {
    const res = await as.manager.patch('/api/catalog/component-types/thermocouple').send({ label: 'Thermocouple (standing pilot)' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ code: 'thermocouple', label: 'Thermocouple (standing pilot)', active: true });
    const [row] = await ctx.db.select().from(componentCatalog).where(and(eq(componentCatalog.companyId, t.company.id), eq(componentCatalog.code, 'thermocouple')));
    expect(row).toMatchObject({ label: 'Thermocouple (standing pilot)', updatedBy: t.manager.user.id });
    const [otherRow] = await ctx.db.select().from(componentCatalog).where(and(eq(componentCatalog.companyId, other.company.id), eq(componentCatalog.code, 'thermocouple')));
    expect(otherRow.label).toBe('thermocouple');
    await as.owner.patch('/api/catalog/component-types/vent_damper').send({ active: false }).expect(200);
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, t.company.id), eq(auditLog.entity, 'component_catalog')));
    expect(audits.map((a) => a.entityId).sort()).toEqual(['thermocouple', 'vent_damper']);
  });

  it('refuses technicians and homeowners (403), signed out (401), bad input (400), unknown code (404)', async () => {
    expect((await as.technician.patch('/api/catalog/component-types/nozzle').send({ label: 'x' })).status).toBe(403);
    expect((await as.homeowner.patch('/api/catalog/component-types/nozzle').send({ label: 'x' })).status).toBe(403);
    expect((await as.homeowner.get('/api/catalog/component-types')).status).toBe(403);
    expect((await as.anonymous.get('/api/catalog/component-types')).status).toBe(401);
    const bad = await as.owner.patch('/api/catalog/component-types/Not%20A%20Code').send({ label: '', active: 'yes' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['active', 'code', 'label']);
    expect((await as.owner.patch('/api/catalog/component-types/flux_capacitor').send({ label: 'x' })).status).toBe(404);
    const [row] = await ctx.db.select().from(componentCatalog).where(and(eq(componentCatalog.companyId, t.company.id), eq(componentCatalog.code, 'nozzle')));
    expect(row.label).toBe('oil burner nozzle');
  });
});

describe('checklist templates', () => {
  const readingKeys = Object.keys(readingsInput.shape);

  it('seeds steam and hot-water templates for gas and oil, with cautions and known reading keys', async () => {
    const res = await as.technician.get('/api/checklist-templates');
    expect(res.status).toBe(200);
    const list: Template[] = res.body;
    expect(list.map((x) => `${x.applianceKind}/${x.fuel}`).sort()).toEqual([
      'furnace/null',
      'hot_water_boiler/null',
      'hot_water_boiler/oil_no2',
      'steam_boiler/null',
      'steam_boiler/oil_no2',
      'water_heater/null',
    ]);
    for (const tpl of list) {
      expect(new Set(tpl.items.map((i) => i.key)).size).toBe(tpl.items.length);
      for (const item of tpl.items) for (const r of item.readings ?? []) expect(readingKeys).toContain(r);
    }
    const steamGas = list.find((x) => x.applianceKind === 'steam_boiler' && x.fuel === null)!;
    const keys = steamGas.items.map((i) => i.key);
    expect(keys).toEqual(expect.arrayContaining(['lwco_test', 'gauge_glass', 'water_level', 'pilot_thermocouple', 'pilot_relight', 'combustion_test', 'safety_valve', 'makeup_water']));
    expect(steamGas.items.find((i) => i.key === 'lwco_test')).toMatchObject({ readings: ['lowWaterCutoff'], caution: expect.stringContaining('scalding') });
    expect(steamGas.items.find((i) => i.key === 'safety_valve')!.caution).toMatch(/discharge pipe.*may not reseat/);
    const oilSteam = list.find((x) => x.applianceKind === 'steam_boiler' && x.fuel === 'oil_no2')!;
    const oilKeys = oilSteam.items.map((i) => i.key);
    expect(oilKeys).toEqual(expect.arrayContaining(['nozzle', 'oil_filter', 'pump_strainer', 'electrodes', 'cad_cell', 'primary_control', 'smoke_test', 'oil_drafts']));
    expect(oilKeys).not.toContain('pilot_thermocouple');
    const hotWater = list.find((x) => x.applianceKind === 'hot_water_boiler' && x.fuel === null)!;
    expect(hotWater.items.map((i) => i.key)).toEqual(expect.arrayContaining(['circulator', 'expansion_tank', 'fill_pressure', 'relief_valve', 'pt_gauge']));
  });

  it('findTemplateFor prefers the fuel-specific template', async () => {
    expect((await findTemplateFor(ctx.db, t.company.id, 'steam_boiler', 'oil_no2'))!.fuel).toBe('oil_no2');
    expect((await findTemplateFor(ctx.db, t.company.id, 'steam_boiler', 'propane'))!.fuel).toBeNull();
    expect((await findTemplateFor(ctx.db, t.company.id, 'furnace', 'natural_gas'))!.applianceKind).toBe('furnace');
  });

  it('lets a manager replace a template; stored row and audit follow', async () => {
    const [tpl] = (await as.manager.get('/api/checklist-templates')).body as Template[];
    const items = [
      { key: 'combustion_test', section: 'Combustion', label: 'Combustion test', readings: ['combustion'], caution: 'On a CO finding make it safe and tell the occupant.' },
      { key: 'notes', section: 'General', label: 'Walk round', caution: '' },
    ];
    const res = await as.manager.put(`/api/checklist-templates/${tpl.id}`).send({ name: 'Short list', items });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Short list', items: [items[0], { key: 'notes', section: 'General', label: 'Walk round' }] });
    const [row] = await ctx.db.select().from(checklistTemplates).where(eq(checklistTemplates.id, tpl.id));
    expect(row.items).toEqual([items[0], { key: 'notes', section: 'General', label: 'Walk round' }]);
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'checklist_template'), eq(auditLog.entityId, tpl.id)));
    expect(audits).toHaveLength(1);
  });

  it('templates carry the readings a visit type requires; a manager may change them to readings an item records', async () => {
    const list = (await as.manager.get('/api/checklist-templates')).body as (Template & { requiredReadings: Record<string, string[]> })[];
    const steamOil = list.find((x) => x.applianceKind === 'steam_boiler' && x.fuel === 'oil_no2')!;
    expect(steamOil.requiredReadings).toEqual({ annual_maintenance: ['combustion', 'lowWaterCutoff'] });
    const hotWater = list.find((x) => x.applianceKind === 'hot_water_boiler' && x.fuel === null)!;
    expect(hotWater.requiredReadings).toEqual({ annual_maintenance: ['combustion'] });

    const body = { name: steamOil.name, items: steamOil.items };
    const unrecorded = await as.manager.put(`/api/checklist-templates/${steamOil.id}`).send({ ...body, requiredReadings: { annual_maintenance: ['fillPressurePsi'] } });
    expect(unrecorded.status).toBe(400);
    expect(unrecorded.body.error.details).toEqual({ 'requiredReadings.annual_maintenance': ["No item records fill pressure: add it to an item's readings first."] });

    const changed = await as.manager.put(`/api/checklist-templates/${steamOil.id}`).send({ ...body, requiredReadings: { annual_maintenance: ['combustion'], inspection: ['lowWaterCutoff'] } });
    expect(changed.status).toBe(200);
    expect(changed.body.requiredReadings).toEqual({ annual_maintenance: ['combustion'], inspection: ['lowWaterCutoff'] });
    // Not sent: kept as stored.
    const kept = await as.manager.put(`/api/checklist-templates/${steamOil.id}`).send(body);
    expect(kept.body.requiredReadings).toEqual({ annual_maintenance: ['combustion'], inspection: ['lowWaterCutoff'] });
    const [row] = await ctx.db.select().from(checklistTemplates).where(eq(checklistTemplates.id, steamOil.id));
    expect(row.requiredReadings).toEqual({ annual_maintenance: ['combustion'], inspection: ['lowWaterCutoff'] });
  });

  it('answers duplicate keys, unknown readings and empty lists with field errors', async () => {
    const [tpl] = (await as.owner.get('/api/checklist-templates')).body as Template[];
    const dup = await as.owner.put(`/api/checklist-templates/${tpl.id}`).send({
      name: 'x',
      items: [
        { key: 'a', section: 'S', label: 'A' },
        { key: 'a', section: 'S', label: 'B', readings: ['moonPhase'] },
      ],
    });
    expect(dup.status).toBe(400);
    expect(Object.keys(dup.body.error.details).sort()).toEqual(['items.1.key', 'items.1.readings']);
    const empty = await as.owner.put(`/api/checklist-templates/${tpl.id}`).send({ name: '', items: [] });
    expect(Object.keys(empty.body.error.details).sort()).toEqual(['items', 'name']);
    const bad = await as.owner.put(`/api/checklist-templates/${tpl.id}`).send({ name: 'x', items: [{ key: 'Bad Key', section: 'S', label: 'A' }] });
    expect(bad.body.error.details['items.0.key']).toEqual(['Use lower-case letters, digits and underscores.']);
    const [row] = await ctx.db.select().from(checklistTemplates).where(eq(checklistTemplates.id, tpl.id));
    expect(row.name).not.toBe('x');
  });

  it('refuses technicians and homeowners (403), signed out (401), another company’s template (404)', async () => {
    const [tpl] = (await as.owner.get('/api/checklist-templates')).body as Template[];
    const body = { name: 'x', items: [{ key: 'a', section: 'S', label: 'A' }] };
    expect((await as.technician.put(`/api/checklist-templates/${tpl.id}`).send(body)).status).toBe(403);
    expect((await as.homeowner.put(`/api/checklist-templates/${tpl.id}`).send(body)).status).toBe(403);
    expect((await as.homeowner.get('/api/checklist-templates')).status).toBe(403);
    expect((await as.anonymous.get('/api/checklist-templates')).status).toBe(401);
    const [foreign] = await ctx.db.select().from(checklistTemplates).where(eq(checklistTemplates.companyId, other.company.id)).limit(1);
    expect((await as.owner.put(`/api/checklist-templates/${foreign.id}`).send(body)).status).toBe(404);
    const [row] = await ctx.db.select().from(checklistTemplates).where(eq(checklistTemplates.id, foreign.id));
    expect(row.name).toBe(foreign.name);
  });
});
