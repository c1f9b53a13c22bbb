import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reminders, visits } from '../../server/db/schema/index';
import { insertCompany } from '../../server/db/factories/companies';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { startJobs, type Jobs } from '../../server/jobs/start-jobs';
import { REMINDERS_CRON, REMINDERS_QUEUE } from '../../server/jobs/reminders-job';
import { PHOTO_SWEEP_CRON, PHOTO_SWEEP_QUEUE } from '../../server/jobs/photo-sweep-job';
import { MAIL_CRON, MAIL_QUEUE } from '../../server/jobs/mail-job';
import { todayInTimeZone } from '../../shared/dates';
import { addMonths } from '../../shared/trade/iso-date';
import { closeContext } from '../../server/build-context';
import { testContext } from '../support/context';
import { eventually, mailTo, uniqueEmail } from '../support/outbox';

const ctx = testContext();
let jobs: Jobs;

beforeAll(async () => {
  // Schedules registered but not fired: the test sends the job itself, for its own company only.
  jobs = await startJobs(ctx, { cron: false });
});
afterAll(async () => {
  await jobs?.stop();
  await closeContext(ctx);
});

describe('the reminders job on pg-boss', () => {
  it('registers the daily reminder run, the queued-mail sweep and the photo sweep as cron schedules', async () => {
    const schedules = await jobs.boss.getSchedules();
    expect(schedules).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ name: REMINDERS_QUEUE, cron: REMINDERS_CRON }),
        expect.objectContaining({ name: PHOTO_SWEEP_QUEUE, cron: PHOTO_SWEEP_CRON }),
        expect.objectContaining({ name: MAIL_QUEUE, cron: MAIL_CRON }),
      ]),
    );
  });

  it('gives the daily run time to finish and retries it when it fails', async () => {
    expect(await jobs.boss.getQueue(REMINDERS_QUEUE)).toMatchObject({ expireInSeconds: 4 * 3600, retryLimit: 2 });
  });

  it('runs the reminder sweep when the job is sent, and a second job sends nothing more', async () => {
    const company = await insertCompany(ctx.db);
    const owner = await insertCustomer(ctx.db, { companyId: company.id, email: uniqueEmail() });
    const site = await insertSite(ctx.db, { companyId: company.id, customerId: owner.id });
    const a = await insertAppliance(ctx.db, { companyId: company.id, siteId: site.id });
    const visitedOn = addMonths(todayInTimeZone(company.timeZone), -14);
    await ctx.db.insert(visits).values({ companyId: company.id, applianceId: a.id, type: 'annual_maintenance', status: 'completed', visitedOn });

    const first = await jobs.boss.send(REMINDERS_QUEUE, { companyIds: [company.id] });
    expect(first).toEqual(expect.any(String));
    const done = await eventually(async () => {
      const job = await jobs.boss.getJobById(REMINDERS_QUEUE, first!);
      return job && ['completed', 'failed'].includes(job.state) ? job : null;
    });
    expect(done.state).toBe('completed');
    const rows = await ctx.db.select().from(reminders).where(eq(reminders.companyId, company.id));
    expect(rows).toEqual([expect.objectContaining({ applianceId: a.id, status: 'sent', trigger: 'schedule', dueOn: addMonths(visitedOn, 12) })]);
    expect(mailTo(owner.email!)).toHaveLength(1);

    const second = await jobs.boss.send(REMINDERS_QUEUE, { companyIds: [company.id] });
    await eventually(async () => {
      const job = await jobs.boss.getJobById(REMINDERS_QUEUE, second!);
      return job?.state === 'completed';
    });
    expect(await ctx.db.select().from(reminders).where(eq(reminders.companyId, company.id))).toHaveLength(1);
    expect(mailTo(owner.email!)).toHaveLength(1);
    // Room for both bounded waits (30 s each): the polls decide when to give up, not the default test limit.
  }, 75_000);
});
