import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { useBrowserFixture } from '../support/browser';
import { seriousAxeViolations } from '../support/axe';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { auditLog } from '../../server/db/schema/index';
import type { ApplianceRecordDto, SiteDto } from '../../shared/schemas/records';
import type { VisitDto } from '../../shared/schemas/visits';
import { fullCompletion } from '../support/visit-completion';

// A common office screen width.
const DESK = { viewport: { width: 1366, height: 768 } };

const fx = useBrowserFixture();

async function signInThroughUi(page: Page, email: string) {
  await page.goto(`${fx.server.baseUrl}/sign-in`);
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('link', { name: 'Lifeplate home' }).waitFor();
}

async function apiAgent(email: string) {
  const agent = request.agent(fx.server.baseUrl);
  const res = await agent.post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD });
  expect(res.status).toBe(200);
  return agent;
}

const ORIGINAL = 'Pilot flame lazy; cleaned the pilot orifice.';
const CORRECTED = 'Pilot flame lazy; cleaned the pilot tube and orifice.';
const REASON = 'The technician named the wrong part of the pilot.';

async function completedVisit() {
  const tech = await apiAgent(fx.t.technician.user.email);
  const site = await tech.post('/api/sites').send({ customerId: fx.t.customer.id, street: '8 Tallow Row', town: 'Ashby Hollow' }).expect(201);
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
  const saved = await tech.put(`/api/visits/${visit.id}/draft`).send({ revision: visit.revision, findings: ORIGINAL }).expect(200);
  await tech.post(`/api/visits/${visit.id}/complete`).send(fullCompletion(saved.body as VisitDto)).expect(200);
  return { applianceId, visitId: visit.id };
}

describe('record of changes (desk, 1366 px)', () => {
  it('a manager amends a visit and reads the change with its reason, on the visit and on the life record', async () => {
    const { applianceId, visitId } = await completedVisit();
    const context = await fx.browser.newContext(DESK);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/visits/${visitId}`);
    await page.getByRole('region', { name: 'As recorded on the day' }).getByText(ORIGINAL).waitFor();

    await page.getByRole('button', { name: /Amend this visit/ }).click();
    await page.getByLabel('Why it is being corrected').fill(REASON);
    await page.getByLabel('Findings', { exact: true }).fill(CORRECTED);
    await page.getByRole('button', { name: 'Save amendment' }).click();
    await page.getByRole('region', { name: 'Amendments' }).getByText(REASON).waitFor();

    const history = page.getByRole('region', { name: 'Record of changes' });
    await history.locator('summary').click();
    const changes = history.getByRole('list', { name: 'Changes, newest first' });
    const newest = changes.locator(':scope > li').first();
    await newest.getByText('Amended the findings', { exact: true }).waitFor();
    await newest.getByText(REASON).waitFor();
    await newest.getByText(`Changed the findings from “${ORIGINAL}” to “${CORRECTED}”.`).waitFor();
    await newest.getByText(new RegExp(`· ${fx.t.manager.user.name}$`)).waitFor();
    await changes.getByText('Completed the visit', { exact: true }).waitFor();
    await changes.getByText('Started a visit (annual maintenance)', { exact: true }).waitFor();
    // Opened, the section has no serious or critical axe violation.
    expect(await seriousAxeViolations(page)).toEqual([]);
    const shown = await history.innerText();
    // Words only: no action codes, entity names or ISO instants.
    expect(shown).not.toMatch(/\b(amend|save_draft|complete|visit_report_\w+)\b/);
    expect(shown).not.toMatch(/\d{4}-\d{2}-\d{2}T/);

    // The entry on screen is the audit row the amendment wrote.
    const [row] = await fx.server.ctx.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.companyId, fx.t.company.id), eq(auditLog.entity, 'visit'), eq(auditLog.entityId, visitId), eq(auditLog.action, 'amend')));
    expect(row.changes).toMatchObject({ reason: REASON, changes: { findings: CORRECTED } });
    expect(await newest.getAttribute('data-change')).toBe(String(row.id));

    // The life record gathers the same change with the record's own.
    await page.goto(`${fx.server.baseUrl}/appliances/${applianceId}`);
    const recordHistory = page.getByRole('region', { name: 'Record of changes' });
    await recordHistory.locator('summary').click();
    const recordChanges = recordHistory.getByRole('list', { name: 'Changes, newest first' });
    await recordChanges.locator(':scope > li').first().getByText('Amended the findings', { exact: true }).waitFor();
    await recordChanges.getByText(REASON).waitFor();
    await recordChanges.getByText('Created the life record', { exact: true }).waitFor();
    // Each visit's change names its visit, in words, and opens it.
    const visitLink = recordChanges.locator(':scope > li').first().getByRole('link', { name: /^Visit of / });
    expect(await visitLink.getAttribute('href')).toBe(`/visits/${visitId}`);
    expect(await visitLink.innerText()).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await context.close();
  });

  it('shows the technician no history of changes', async () => {
    const { applianceId, visitId } = await completedVisit();
    const context = await fx.browser.newContext(DESK);
    const page = await context.newPage();
    await signInThroughUi(page, fx.t.technician.user.email);
    await page.goto(`${fx.server.baseUrl}/visits/${visitId}`);
    await page.getByRole('region', { name: 'As recorded on the day' }).getByText(ORIGINAL).waitFor();
    expect(await page.getByRole('region', { name: 'Record of changes' }).count()).toBe(0);
    await page.goto(`${fx.server.baseUrl}/appliances/${applianceId}`);
    await page.getByRole('region', { name: 'History' }).waitFor();
    expect(await page.getByRole('region', { name: 'Record of changes' }).count()).toBe(0);
    await context.close();
  });
});
