import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bookingNotices, reminders, visits } from '../../server/db/schema/index';
import { insertBooking } from '../../server/db/factories/bookings';
import { insertMember } from '../../server/db/factories/users';
import { insertCompany } from '../../server/db/factories/companies';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { startJobs, type Jobs } from '../../server/jobs/start-jobs';
import { REMINDERS_CRON, REMINDERS_QUEUE } from '../../server/jobs/reminders-job';
import { PHOTO_SWEEP_CRON, PHOTO_SWEEP_QUEUE } from '../../server/jobs/photo-sweep-job';
import { MAIL_CRON, MAIL_QUEUE } from '../../server/jobs/mail-job';
import { BOOKING_REMINDERS_CRON, BOOKING_REMINDERS_QUEUE } from '../../server/jobs/booking-reminders-job';
import { todayInTimeZone } from '../../shared/dates';
import { addDays, addMonths } from '../../shared/trade/iso-date';
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
  it('registers the daily reminder run, the day-before booking reminders, the queued-mail sweep and the photo sweep as cron schedules', async () => {
    const schedules = await jobs.boss.getSchedules();
    expect(schedules).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ name: REMINDERS_QUEUE, cron: REMINDERS_CRON }),
        expect.objectContaining({ name: PHOTO_SWEEP_QUEUE, cron: PHOTO_SWEEP_CRON }),
        expect.objectContaining({ name: MAIL_QUEUE, cron: MAIL_CRON }),
        expect.objectContaining({ name: BOOKING_REMINDERS_QUEUE, cron: BOOKING_REMINDERS_CRON }),
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

  it('runs the day-before booking reminders when the job is sent, and a second job sends nothing more', async () => {
    const company = await insertCompany(ctx.db);
    const { user: technician } = await insertMember(ctx.db, { companyId: company.id, role: 'technician' });
    const owner = await insertCustomer(ctx.db, { companyId: company.id, email: uniqueEmail() });
    const site = await insertSite(ctx.db, { companyId: company.id, customerId: owner.id });
    const a = await insertAppliance(ctx.db, { companyId: company.id, siteId: site.id });
    // Noon tomorrow and the day after on the company's clocks: should midnight pass before the job runs, its
    // "tomorrow" is the second one, and still exactly one booking is reminded.
    const tomorrow = addDays(todayInTimeZone(company.timeZone), 1);
    const ids: string[] = [];
    for (const day of [tomorrow, addDays(tomorrow, 1)]) {
      const b = await insertBooking(ctx.db, { companyId: company.id, siteId: site.id, technicianId: technician.id, applianceIds: [a.id], start: `${day}T12:00`, end: `${day}T13:00`, timeZone: company.timeZone });
      ids.push(b.id);
    }
    const run = async () => {
      const id = await jobs.boss.send(BOOKING_REMINDERS_QUEUE, { companyIds: [company.id] });
      return eventually(async () => {
        const job = await jobs.boss.getJobById(BOOKING_REMINDERS_QUEUE, id!);
        return job && ['completed', 'failed'].includes(job.state) ? job : null;
      });
    };
    expect((await run()).state).toBe('completed');
    expect((await run()).state).toBe('completed');
    const notices = await ctx.db.select().from(bookingNotices).where(eq(bookingNotices.companyId, company.id));
    expect(notices).toEqual([expect.objectContaining({ kind: 'day_before', outcome: 'sent' })]);
    expect(ids).toContain(notices[0].bookingId);
    expect(mailTo(owner.email!)).toHaveLength(1);
  }, 75_000);
});
