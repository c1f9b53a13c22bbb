import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { useBrowserFixture } from '../support/browser';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { auditLog, dueRules } from '../../server/db/schema/index';
import { swappedPart } from '../support/swap-history';

const fx = useBrowserFixture();

describe('learned service life on the due rules (desktop)', () => {
  it('a manager sees the learned median beside the rule and adopts it', async () => {
    const db = fx.server.ctx.db;
    // 36 flame sensors worn out at 2…7 years; their boilers were replaced whole in 2018.
    for (let i = 0; i < 36; i += 1) await swappedPart(db, fx.t, 'flame_sensor', '2010-03-01', `${2012 + (i % 6)}-03-01`, 'wear_or_failure', '2018-03-01');

    const context = await fx.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await page.goto(`${fx.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail', { exact: true }).fill(fx.t.manager.user.email);
    await page.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Parts & checklists' }).click();

    const panel = page.getByRole('region', { name: /Service life learned for flame sensor/ });
    await panel.waitFor();
    await panel.getByText(/36 worn out or failed, 2012–2017/).waitFor();
    await panel.getByRole('img', { name: /still in service by age/ }).waitFor();
    const adopt = panel.getByRole('button', { name: /Adopt the learned service life/ });
    const label = (await adopt.textContent()) ?? '';
    const years = Number(/Adopt (\d+) years as the planning age/.exec(label)?.[1]);
    expect(years).toBeGreaterThanOrEqual(2);
    await adopt.click();
    await page.getByText(/Source: Learned from 36 swaps, 2012–2017/).first().waitFor();
    await page.getByText('Learned from our fleet').first().waitFor();

    const rules = await db.select().from(dueRules).where(and(eq(dueRules.companyId, fx.t.company.id), eq(dueRules.componentType, 'flame_sensor')));
    // Age is not a fault: the learned median is a planning age, the part replaced on condition.
    expect(rules.some((r) => r.basis === 'learned' && r.planningAgeYears === years && r.replacementAgeYears === null && r.replacementPolicy === 'on_condition')).toBe(true);
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.companyId, fx.t.company.id), eq(auditLog.action, 'adopt_learned_life')));
    expect(audits).toHaveLength(1);
    await context.close();
  });
});
