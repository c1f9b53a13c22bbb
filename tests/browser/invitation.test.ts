import path from 'node:path';
import { simpleParser } from 'mailparser';
import { describe, expect, inject, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { readStoredMail } from '../../fakes/smtp';
import { fakerFor } from '../../server/db/factories/faker';
import { memberships, users } from '../../server/db/schema/index';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';

const fx = useBrowserFixture();

async function signInLinkSentTo(address: string) {
  const mails = readStoredMail(inject('outboxDir')).filter((m) => m.to.includes(address));
  expect(mails).toHaveLength(1);
  const { text } = await simpleParser(mails[0].raw);
  const link = text?.match(/http:\/\/127\.0\.0\.1:\d+\/api\/auth\/magic-link\/verify\?\S+/)?.[0];
  expect(link).toBeTruthy();
  return link!;
}

describe('invitation by e-mail', () => {
  it('the manager invites a technician; the e-mailed link opens the welcome page on their phone, and accepting lands on the search', async () => {
    const email = `${fakerFor().string.alphanumeric(12).toLowerCase()}@example.test`;
    const office = await fx.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const desk = await office.newPage();
    await signInAsMember(desk, fx.server.baseUrl, fx.t.manager.user.email);
    await desk.goto(`${fx.server.baseUrl}/team`);
    await desk.getByLabel('E-mail').fill(email);
    await desk.getByLabel('Role', { exact: true }).selectOption('technician');
    await desk.getByRole('button', { name: 'Send invitation' }).click();
    await desk.getByText(`An e-mail with a sign-in link is on its way to ${email}.`).waitFor();
    await desk.getByRole('heading', { name: 'Waiting to join' }).waitFor();
    await desk.getByText(email, { exact: true }).waitFor();
    await desk.screenshot({ path: path.join(screenshotDir(), 'team-invitations.png'), fullPage: true });

    const link = await signInLinkSentTo(email);
    expect(link.startsWith(`${fx.server.baseUrl}/api/auth/magic-link/verify?`)).toBe(true);

    const phoneContext = await fx.browser.newContext(PHONE);
    const phone = await phoneContext.newPage();
    await phone.goto(link);
    await phone.getByRole('heading', { name: `Join ${fx.t.company.name} as technician` }).waitFor();
    expect(new URL(phone.url()).pathname).toMatch(/^\/welcome\/[0-9a-f-]{36}$/);
    await phone.screenshot({ path: path.join(screenshotDir(), 'welcome-member.png'), fullPage: true });

    await phone.getByRole('button', { name: 'Join the team' }).click();
    await phone.getByText('Enter your name, as your team will see it.').waitFor();
    await phone.getByLabel('Your name').fill('Ada Brightwater');
    await phone.getByRole('button', { name: 'Join the team' }).click();
    await phone.getByRole('heading', { name: 'Find an appliance' }).waitFor();

    const [user] = await fx.server.ctx.db.select().from(users).where(eq(users.email, email));
    expect(user.name).toBe('Ada Brightwater');
    const [membership] = await fx.server.ctx.db.select().from(memberships).where(eq(memberships.userId, user.id));
    expect(membership).toMatchObject({ companyId: fx.t.company.id, role: 'technician' });

    // The office's list no longer waits for them.
    await desk.reload();
    await desk.getByRole('heading', { name: 'Team' }).waitFor();
    await desk.getByText('Ada Brightwater', { exact: true }).waitFor();
    expect(await desk.getByRole('heading', { name: 'Waiting to join' }).count()).toBe(0);
    await office.close();
    await phoneContext.close();
  });

  it('a used or expired link lands on the welcome page, which offers a new one', async () => {
    const context = await fx.browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${fx.server.baseUrl}/api/auth/magic-link/verify?token=not-a-real-token&callbackURL=${encodeURIComponent('/welcome/7b0c1f9e-3d2a-4c55-9a57-0d6f2b1e8c44')}`);
    await page.getByRole('heading', { name: 'This sign-in link has expired' }).waitFor();
    await page.getByLabel('Your e-mail').fill('nobody-invited@example.test');
    await page.getByRole('button', { name: 'Send me a new link' }).click();
    await page.getByText('If there is an open invitation for nobody-invited@example.test, a new sign-in link is on its way.').waitFor();
    await page.screenshot({ path: path.join(screenshotDir(), 'welcome-expired.png'), fullPage: true });
    await context.close();
  });
});
