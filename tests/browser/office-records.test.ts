import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { useBrowserFixture } from '../support/browser';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { appliances, checklistTemplates, componentCatalog, components, customers, dueRules, sites, visitAmendments, visits } from '../../server/db/schema/index';
import type { ApplianceRecordDto, SiteDto } from '../../shared/schemas/records';
import type { VisitDto } from '../../shared/schemas/visits';
import type { DueRuleDto } from '../../shared/schemas/due';
import { LABELS } from '../../shared/schemas/enums';
import { fullCompletion } from '../support/visit-completion';
import { todayInTimeZone } from '../../shared/dates';
import { addYears } from '../../shared/trade/iso-date';

const DESKTOP = { viewport: { width: 1280, height: 800 } };

const fx = useBrowserFixture();

async function signInThroughUi(page: Page, email: string) {
  await page.goto(`${fx.server.baseUrl}/sign-in`);
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // The header's home link shows at every width (the main navigation is the desk's; a phone has the bottom bar).
  await page.getByRole('link', { name: 'Lifeplate home' }).waitFor();
}

async function apiAgent(email: string) {
  const agent = request.agent(fx.server.baseUrl);
  const res = await agent.post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD });
  expect(res.status).toBe(200);
  return agent;
}

describe('office screens for the life record (desktop)', () => {
  it('creates a customer, a site and an appliance with three parts, keeping what was typed through errors', async () => {
    const context = await fx.browser.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.manager.user.email);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Customers' }).click();
    await page.getByRole('heading', { name: 'Customers' }).waitFor();
    await page.getByRole('link', { name: 'New customer' }).click();
    await page.getByRole('heading', { name: 'New customer' }).waitFor();

    // Empty name and a bad e-mail: both named under their fields, and what was typed stays.
    await page.getByLabel('Phone', { exact: true }).fill('555-0142');
    await page.getByLabel('E-mail', { exact: true }).fill('not-an-address');
    await page.getByRole('button', { name: 'Save customer' }).click();
    await page.getByText('Name is required.').waitFor();
    await page.getByText('Enter a valid e-mail address.').waitFor();
    expect(await page.getByLabel('Phone', { exact: true }).inputValue()).toBe('555-0142');
    expect(page.url()).toMatch(/\/customers\/new$/);

    await page.getByLabel('Name', { exact: true }).fill('Odalys Threnwick');
    await page.getByLabel('E-mail', { exact: true }).fill('Odalys@Example.test');
    await page.getByLabel('No reminder e-mails').check();
    await page.getByRole('button', { name: 'Save customer' }).click();
    await page.waitForURL(/\/customers\/[0-9a-f-]{36}$/);
    const customerId = page.url().split('/').at(-1)!;
    await page.getByRole('heading', { name: 'Odalys Threnwick' }).waitFor();
    await page.getByText('Opted out of reminders').waitFor();

    // The first site: the form is open because the customer has none.
    const siteForm = page.getByRole('form', { name: 'Save site' });
    await siteForm.getByRole('button', { name: 'Save site' }).click();
    await siteForm.getByText('Street address is required.').waitFor();
    await siteForm.getByLabel('Street address').fill('14 Quarry Lane');
    await siteForm.getByLabel('Town').fill('Wrenfield');
    await siteForm.getByLabel('Postal code').fill('00731');
    await siteForm.getByLabel('Access notes').fill('Side door, dog in yard');
    await siteForm.getByLabel('Assigned technician').selectOption({ label: fx.t.technician.user.name });
    await siteForm.getByRole('button', { name: 'Save site' }).click();
    await page.getByRole('heading', { name: '14 Quarry Lane, Wrenfield 00731' }).waitFor();
    await page.getByText('Side door, dog in yard').waitFor();

    await page.getByRole('link', { name: 'Add appliance' }).click();
    await page.waitForURL(/\/appliances\/new\?siteId=/);
    await page.getByRole('heading', { name: 'New appliance' }).waitFor();
    await page.getByLabel('Kind', { exact: true }).selectOption('steam_boiler');
    await page.getByLabel('Fuel', { exact: true }).selectOption('natural_gas');
    await page.getByLabel('Construction', { exact: true }).selectOption('cast_iron');
    await page.getByLabel('Ignition type').selectOption('standing_pilot');
    await page.getByLabel('Vent type').selectOption('draft_hood');
    await page.getByLabel('Make', { exact: true }).fill('Harrowgate Foundry');
    await page.getByLabel('Serial number').fill('HF-20931');
    await page.getByLabel('Input rating (Btu/h)').fill('lots');

    // The starter set for a steam boiler on gas with a standing pilot: seven parts, each removable.
    const parts = page.locator('li[aria-label^="Part "]');
    await page.getByRole('listitem', { name: 'Part 7: steam safety valve' }).waitFor();
    expect(await parts.count()).toBe(7);
    for (const label of ['gauge glass washers', 'steam pressure control', 'siphon loop (pigtail)', 'steam safety valve']) {
      await page.getByRole('button', { name: new RegExp(`^Remove part \\d+ \\(${label.replace(/[()]/g, '\\$&')}\\)$`) }).click();
    }
    expect(await parts.count()).toBe(3);

    const thermocouple = page.getByRole('listitem', { name: 'Part 1: thermocouple' });
    await thermocouple.getByLabel('Length (in)').fill('24');
    await thermocouple.getByLabel('Original with the appliance').uncheck();
    await page.getByRole('button', { name: 'Save appliance and parts' }).click();
    await page.getByText('Input rating must be a number.').waitFor();
    await thermocouple.getByText('Give the date it was installed, or mark it original with the appliance.').waitFor();
    expect(await page.getByLabel('Serial number').inputValue()).toBe('HF-20931');
    expect(await thermocouple.getByLabel('Length (in)').inputValue()).toBe('24');

    await page.getByLabel('Input rating (Btu/h)').fill('175000');
    const glass = page.getByRole('listitem', { name: 'Part 2: gauge glass' });
    await glass.getByLabel('Length (in)').fill('12');
    await glass.getByLabel('Diameter (in)').fill('0.625');
    // The server's own check (a date after today) comes back keyed "components.0.installedOn" and lands on that part.
    await thermocouple.getByLabel('Installed on').fill(addYears(todayInTimeZone(fx.t.company.timeZone), 1));
    await page.getByRole('button', { name: 'Save appliance and parts' }).click();
    await thermocouple.getByText('The install date cannot be in the future.').waitFor();
    expect(await glass.getByLabel('Diameter (in)').inputValue()).toBe('0.625');
    expect(await page.getByLabel('Input rating (Btu/h)').inputValue()).toBe('175000');
    await thermocouple.getByLabel('Installed on').fill('2023-10-12');
    await page.getByRole('button', { name: 'Save appliance and parts' }).click();
    await page.waitForURL(/\/appliances\/[0-9a-f-]{36}$/);
    const applianceId = page.url().split('/').at(-1)!;
    // The life record opens for the new appliance.
    await page.getByText('Odalys Threnwick · 14 Quarry Lane, Wrenfield').waitFor();

    const db = fx.server.ctx.db;
    const [customer] = await db.select().from(customers).where(eq(customers.id, customerId));
    expect(customer).toMatchObject({ companyId: fx.t.company.id, name: 'Odalys Threnwick', phone: '555-0142', email: 'odalys@example.test', remindersOptOut: true });
    const [site] = await db.select().from(sites).where(eq(sites.customerId, customerId));
    expect(site).toMatchObject({ street: '14 Quarry Lane', town: 'Wrenfield', postalCode: '00731', accessNotes: 'Side door, dog in yard', assignedTechnicianId: fx.t.technician.user.id });
    const [appliance] = await db.select().from(appliances).where(eq(appliances.id, applianceId));
    expect(appliance).toMatchObject({
      siteId: site.id,
      companyId: fx.t.company.id,
      kind: 'steam_boiler',
      fuel: 'natural_gas',
      construction: 'cast_iron',
      ignitionType: 'standing_pilot',
      ventType: 'draft_hood',
      manufacturer: 'Harrowgate Foundry',
      serial: 'HF-20931',
      inputBtuh: 175000,
      firingRateGph: null,
    });
    const parts3 = await db.select().from(components).where(eq(components.applianceId, applianceId));
    const byType = Object.fromEntries(parts3.map((c) => [c.typeCode, c]));
    expect(Object.keys(byType).sort()).toEqual(['gauge_glass', 'low_water_cutoff_float', 'thermocouple']);
    expect(byType.thermocouple).toMatchObject({ spec: { lengthIn: 24 }, installedOn: '2023-10-12', originalWithAppliance: false });
    expect(byType.gauge_glass).toMatchObject({ spec: { lengthIn: 12, diameterIn: 0.625 }, originalWithAppliance: true, installedOn: null });
    expect(byType.low_water_cutoff_float).toMatchObject({ originalWithAppliance: true });

    // Back on the customer, the appliance is listed with its status in words.
    await page.goto(`${fx.server.baseUrl}/customers/${customerId}`);
    await page.getByRole('link', { name: 'Steam boiler, natural gas · Harrowgate Foundry' }).waitFor();
    await page.getByText('In service').waitFor();

    // Contact details are editable in place.
    await page.getByRole('button', { name: 'Edit contact details' }).click();
    await page.getByLabel('Phone', { exact: true }).fill('555-0199');
    await page.getByRole('button', { name: 'Save contact details' }).click();
    await page.getByRole('link', { name: '555-0199' }).waitFor();
    const [edited] = await db.select().from(customers).where(eq(customers.id, customerId));
    expect(edited).toMatchObject({ phone: '555-0199', remindersOptOut: true, email: 'odalys@example.test' });

    // A newer boiler replaces the old one; the old record stays readable.
    const manager = await apiAgent(fx.t.manager.user.email);
    const replacement = await manager
      .post('/api/appliances')
      .send({ siteId: site.id, kind: 'steam_boiler', fuel: 'natural_gas', construction: 'cast_iron', ignitionType: 'intermittent_pilot', ventType: 'draft_hood', serial: 'NC-7781' })
      .expect(201);
    const newId = (replacement.body as ApplianceRecordDto).appliance.id;
    await page.reload();
    await page.getByRole('button', { name: 'Mark replaced' }).first().waitFor();
    const oldItem = page.getByRole('listitem').filter({ has: page.getByRole('link', { name: 'Steam boiler, natural gas · Harrowgate Foundry' }) });
    await oldItem.getByRole('button', { name: 'Mark replaced' }).click();
    const replaceForm = page.getByRole('form', { name: 'Mark replaced' });
    await replaceForm.getByLabel('Removed on').fill('2026-01-05');
    await replaceForm.getByRole('button', { name: 'Mark replaced' }).click();
    await replaceForm.getByText('Pick the appliance that replaced it.').waitFor();
    expect(await replaceForm.getByLabel('Removed on').inputValue()).toBe('2026-01-05');
    await replaceForm.getByLabel('Replaced by').selectOption(newId);
    await replaceForm.getByLabel('Reason (optional)').fill('Cracked section');
    await replaceForm.getByRole('button', { name: 'Mark replaced' }).click();
    await replaceForm.waitFor({ state: 'detached' });
    await oldItem.getByText('Removed').waitFor();
    const [old] = await db.select().from(appliances).where(eq(appliances.id, applianceId));
    expect(old).toMatchObject({ status: 'removed', replacedById: newId });
    await oldItem.getByRole('link', { name: 'Steam boiler, natural gas · Harrowgate Foundry' }).click();
    await page.waitForURL(`${fx.server.baseUrl}/appliances/${applianceId}`);
    await page.getByText('Odalys Threnwick · 14 Quarry Lane, Wrenfield').waitFor();
    await context.close();
  });

  it('pages the customer list by keyset, filters it, and shows cards on a phone', async () => {
    const db = fx.server.ctx.db;
    const names = Array.from({ length: 30 }, (_, i) => `Pagewell Tester ${String(i + 1).padStart(2, '0')}`);
    for (const name of names) await db.insert(customers).values({ companyId: fx.t.company.id, name, phone: '555-0100' });

    const context = await fx.browser.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/customers`);
    await page.getByLabel('Filter').fill('Pagewell');
    await page.waitForURL(/q=Pagewell/);
    const rows = page.locator('table tbody tr');
    await rows.first().getByText('Pagewell Tester 01').waitFor();
    expect(await rows.count()).toBe(25);
    await page.getByRole('button', { name: /Next page/ }).click();
    await page.getByText('Page 2').waitFor();
    await rows.first().getByText('Pagewell Tester 26').waitFor();
    expect(await rows.allInnerTexts()).toHaveLength(5);
    expect(await page.getByRole('button', { name: /Next page/ }).isDisabled()).toBe(true);
    await page.getByRole('button', { name: /Previous page/ }).click();
    await page.getByText('Page 1').waitFor();
    await rows.first().getByText('Pagewell Tester 01').waitFor();
    await context.close();

    const phone = await fx.browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const small = await phone.newPage();
    await signInThroughUi(small, fx.t.manager.user.email);
    await small.goto(`${fx.server.baseUrl}/customers?q=Pagewell`);
    await small.getByRole('list', { name: 'Customers' }).getByRole('link', { name: 'Pagewell Tester 01' }).waitFor();
    expect(await small.locator('table').isVisible()).toBe(false);
    await phone.close();
  });

  it('shows a completed visit and its amendment to the manager', async () => {
    const tech = await apiAgent(fx.t.technician.user.email);
    const site = await tech
      .post('/api/sites')
      .send({ customerId: fx.t.customer.id, street: '3 Ferrow Court', town: 'Ashby Hollow' })
      .expect(201);
    const created = await tech
      .post('/api/appliances')
      .send({
        siteId: (site.body as SiteDto).id,
        kind: 'hot_water_boiler',
        fuel: 'natural_gas',
        construction: 'cast_iron',
        ignitionType: 'intermittent_pilot',
        ventType: 'draft_hood',
        components: [{ typeCode: 'relief_valve', spec: { setPressurePsi: 30 }, originalWithAppliance: true }],
      })
      .expect(201);
    const applianceId = (created.body as ApplianceRecordDto).appliance.id;
    const started = await tech.post('/api/visits').send({ applianceId, type: 'annual_maintenance' }).expect(200);
    const visit = started.body as VisitDto;
    const saved = await tech
      .put(`/api/visits/${visit.id}/draft`)
      .send({ revision: visit.revision, findings: 'Pilot flame lazy; cleaned the pilot orifice.' })
      .expect(200);
    await tech
      .post(`/api/visits/${visit.id}/complete`)
      .send(fullCompletion(saved.body as VisitDto))
      .expect(200);

    const context = await fx.browser.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/visits/${visit.id}`);

    const original = 'Pilot flame lazy; cleaned the pilot orifice.';
    const reason = 'Technician noted the wrong part of the pilot.';
    const corrected = 'Pilot flame lazy; cleaned the pilot tube and orifice.';
    const recorded = page.getByRole('region', { name: 'As recorded on the day' });
    await recorded.getByText(original).waitFor();

    // The visit screen's own amend form (built by the visit-screen helper).
    await page.getByRole('button', { name: /Amend this visit/ }).click();
    await page.getByLabel('Why it is being corrected').fill(reason);
    await page.getByLabel('Findings', { exact: true }).fill(corrected);
    await page.getByRole('button', { name: 'Save amendment' }).click();
    const amendmentsPanel = page.getByRole('region', { name: 'Amendments' });
    await amendmentsPanel.getByText(reason).waitFor();
    await amendmentsPanel.getByText(corrected).waitFor();
    // The original stays as it was recorded, beside the amendment.
    await recorded.getByText(original).waitFor();

    const manager = await apiAgent(fx.t.manager.user.email);
    const after = (await manager.get(`/api/visits/${visit.id}`).expect(200)).body as VisitDto;
    expect(after.status).toBe('completed');
    expect(after.amendments).toHaveLength(1);
    expect(after.amendments[0]).toMatchObject({ reason });
    expect(JSON.stringify(after.amendments[0].changes)).toContain(corrected);
    expect(after.findings).toBe(original);

    const [row] = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visit.id));
    expect(row).toMatchObject({ status: 'completed', findings: original });
    const amendments = await fx.server.ctx.db
      .select()
      .from(visitAmendments)
      .where(and(eq(visitAmendments.visitId, visit.id), eq(visitAmendments.companyId, fx.t.company.id)));
    expect(amendments.map((a) => a.reason)).toEqual([reason]);

    await page.reload();
    await recorded.getByText(original).waitFor();
    await amendmentsPanel.getByText(reason).waitFor();
    await context.close();
  });

  it('lets the manager rename and deactivate part types, edit a checklist without touching past visits, and change a due rule', async () => {
    const db = fx.server.ctx.db;
    const [template] = await db
      .select()
      .from(checklistTemplates)
      .where(and(eq(checklistTemplates.companyId, fx.t.company.id), eq(checklistTemplates.applianceKind, 'hot_water_boiler')))
      .orderBy(checklistTemplates.name)
      .limit(1);
    const before = template.items;

    // A visit started before the edit keeps its own copy of the checklist.
    const tech = await apiAgent(fx.t.technician.user.email);
    const site = await tech.post('/api/sites').send({ customerId: fx.t.customer.id, street: '27 Tanner Walk', town: 'Wrenfield' }).expect(201);
    const created = await tech
      .post('/api/appliances')
      .send({ siteId: (site.body as SiteDto).id, kind: 'hot_water_boiler', fuel: template.fuel ?? 'natural_gas', construction: 'cast_iron', ignitionType: 'direct_spark', ventType: 'power_vent' })
      .expect(201);
    const started = (await tech.post('/api/visits').send({ applianceId: (created.body as ApplianceRecordDto).appliance.id, type: 'annual_maintenance' }).expect(200)).body as VisitDto;

    const context = await fx.browser.newContext(DESKTOP);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.manager.user.email);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Parts & checklists' }).click();
    await page.getByRole('heading', { name: 'Parts & checklists' }).waitFor();

    await page.getByRole('button', { name: 'Rename thermocouple' }).click();
    await page.getByLabel('New name for "thermocouple"').fill('  ');
    await page.getByRole('button', { name: 'Save name' }).click();
    await page.getByText('Label is required.').waitFor();
    await page.getByLabel('New name for "thermocouple"').fill('pilot thermocouple');
    await page.getByRole('button', { name: 'Save name' }).click();
    await page.getByRole('button', { name: 'Rename pilot thermocouple' }).waitFor();
    await page.getByRole('button', { name: 'Deactivate thermopile' }).click();
    await page.getByRole('button', { name: 'Reactivate thermopile' }).waitFor();
    const catalog = await db.select().from(componentCatalog).where(eq(componentCatalog.companyId, fx.t.company.id));
    expect(catalog.find((c) => c.code === 'thermocouple')).toMatchObject({ label: 'pilot thermocouple', active: true });
    expect(catalog.find((c) => c.code === 'thermopile')).toMatchObject({ active: false });

    await page.getByText('Each visit keeps its own copy of the checklist').waitFor();
    await page.getByRole('button', { name: `Edit ${template.name}` }).click();
    const editor = page.getByRole('form', { name: `Edit checklist ${template.name}` });
    // No internal code on the page: part types, item keys and readings are shown by their names only.
    await page.getByRole('heading', { name: 'Part types' }).waitFor();
    expect(await page.locator('main').innerText()).not.toMatch(/\b[a-z]+(?:_[a-z0-9]+)+\b|\b[a-z]+[A-Z][A-Za-z]+\b/);
    await editor.getByText(/asks for readings: Combustion test/).first().waitFor();
    await editor.getByRole('button', { name: 'Move item 2 up' }).click();
    await editor.getByRole('button', { name: `Remove item ${before.length}` }).click();
    await editor.getByRole('button', { name: '+ Add item' }).click();
    await editor.getByRole('button', { name: 'Save checklist' }).click();
    const added = editor.getByRole('listitem', { name: `Item ${before.length}` });
    await added.getByText('Item is required.').waitFor();
    await added.getByLabel('Section').fill('Boiler room');
    await added.getByLabel('Item', { exact: true }).fill('Check the boiler room for stored combustibles');
    await added.getByLabel('Caution (optional)').fill('Keep flammable vapours away from the burner; follow local codes.');
    await editor.getByRole('button', { name: 'Save checklist' }).click();
    await editor.waitFor({ state: 'detached' });

    const [saved] = await db.select().from(checklistTemplates).where(eq(checklistTemplates.id, template.id));
    expect(saved.items.map((i) => i.key)).toEqual([
      before[1].key,
      before[0].key,
      ...before.slice(2, -1).map((i) => i.key),
      'check_the_boiler_room_for_stored_combustibles',
    ]);
    expect(saved.items.at(-1)).toMatchObject({ section: 'Boiler room', caution: 'Keep flammable vapours away from the burner; follow local codes.' });
    const manager = await apiAgent(fx.t.manager.user.email);
    const visitAfter = (await manager.get(`/api/visits/${started.id}`).expect(200)).body as VisitDto;
    expect(visitAfter.checklist.map((i) => i.key)).toEqual(started.checklist.map((i) => i.key));

    // A due rule: a fixed-age rule needs its age, then saves as company policy.
    const rules = (await manager.get('/api/due-rules').expect(200)).body as DueRuleDto[];
    const rule = rules.find((r) => r.componentType === 'expansion_tank') ?? rules[0];
    const name = `${rule.typeLabel}, ${rule.applianceKind ? LABELS.applianceKind[rule.applianceKind].toLowerCase() : 'every appliance'}`;
    await page.getByRole('button', { name: `Change rule for ${name}` }).click();
    const ruleForm = page.getByRole('form', { name: `Rule for ${name}` });
    await ruleForm.getByLabel('Inspection interval (months)').fill('6');
    await ruleForm.getByLabel('Replacement', { exact: true }).selectOption('fixed_age');
    await ruleForm.getByLabel('Replacement age (years)').fill('');
    await ruleForm.getByRole('button', { name: 'Save rule' }).click();
    await ruleForm.getByText('Give the replacement age for a fixed-age rule.').waitFor();
    await ruleForm.getByLabel('Replacement age (years)').fill('10');
    await ruleForm.getByLabel('Based on').selectOption('company_policy');
    await ruleForm.getByLabel('Source').fill('Company policy, set by the service manager');
    await ruleForm.getByRole('button', { name: 'Save rule' }).click();
    await ruleForm.waitFor({ state: 'detached' });
    const [storedRule] = await db.select().from(dueRules).where(eq(dueRules.id, rule.id));
    expect(storedRule).toMatchObject({
      companyId: fx.t.company.id,
      inspectionIntervalMonths: 6,
      replacementPolicy: 'fixed_age',
      replacementAgeYears: 10,
      basis: 'company_policy',
      source: 'Company policy, set by the service manager',
    });
    await context.close();
  });
});
