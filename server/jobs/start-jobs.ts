import PgBoss from 'pg-boss';
import type { AppContext } from '../context';
import { PHOTO_SWEEP_CRON, PHOTO_SWEEP_QUEUE, photoSweepJob } from './photo-sweep-job';
import { REMINDERS_CRON, REMINDERS_QUEUE, remindersJob } from './reminders-job';
import { MAIL_CRON, MAIL_QUEUE, mailJob } from './mail-job';
import { IMPORT_CRON, IMPORT_QUEUE, importJob } from './import-job';
import { IDEMPOTENCY_SWEEP_CRON, IDEMPOTENCY_SWEEP_QUEUE, idempotencySweepJob } from './idempotency-sweep-job';
import { BOOKING_REMINDERS_CRON, BOOKING_REMINDERS_QUEUE, bookingRemindersJob } from './booking-reminders-job';

export const JOBS_SCHEMA = 'pgboss';

type Job = {
  queue: string;
  cron: string;
  /** How long one run may take before pg-boss counts it as failed, and how often a failed run is tried again. */
  options: { expireInSeconds: number; retryLimit: number; retryDelay: number; retryBackoff?: boolean };
  run: (ctx: AppContext, data: unknown) => Promise<unknown>;
};
const JOBS: Job[] = [
  // A retry is safe: the unique key keeps a reminder from being recorded (and so sent) twice.
  { queue: REMINDERS_QUEUE, cron: REMINDERS_CRON, options: { expireInSeconds: 4 * 3600, retryLimit: 2, retryDelay: 600 }, run: remindersJob },
  // The same guard: booking_notices' key (booking, kind, revision) keeps a retried run from sending a reminder twice.
  {
    queue: BOOKING_REMINDERS_QUEUE,
    cron: BOOKING_REMINDERS_CRON,
    options: { expireInSeconds: 3600, retryLimit: 2, retryDelay: 600 },
    run: bookingRemindersJob,
  },
  // Each message keeps its own tries and backoff in outgoing_mail; this retries a run that failed as a whole (database away).
  { queue: MAIL_QUEUE, cron: MAIL_CRON, options: { expireInSeconds: 15 * 60, retryLimit: 3, retryDelay: 30, retryBackoff: true }, run: mailJob },
  // Each import claims itself by status, so a run that overlaps another finds nothing to claim.
  { queue: IMPORT_QUEUE, cron: IMPORT_CRON, options: { expireInSeconds: 3600, retryLimit: 2, retryDelay: 60 }, run: (ctx) => importJob(ctx) },
  { queue: PHOTO_SWEEP_QUEUE, cron: PHOTO_SWEEP_CRON, options: { expireInSeconds: 3600, retryLimit: 1, retryDelay: 600 }, run: (ctx) => photoSweepJob(ctx) },
  // A delete by age: a run that overlaps or repeats another deletes nothing twice.
  {
    queue: IDEMPOTENCY_SWEEP_QUEUE,
    cron: IDEMPOTENCY_SWEEP_CRON,
    options: { expireInSeconds: 15 * 60, retryLimit: 1, retryDelay: 300 },
    run: (ctx) => idempotencySweepJob(ctx),
  },
];

/**
 * pg-boss on the app's own PostgreSQL (its tables in their own schema). Each cron fires once per tick across all
 * running servers, because pg-boss keeps the schedule in the database.
 * `cron: false` registers the schedules but does not fire them (tests send jobs by hand).
 */
export async function startJobs(ctx: AppContext, options: { cron?: boolean } = {}) {
  const boss = new PgBoss({
    connectionString: ctx.config.DATABASE_URL,
    schema: JOBS_SCHEMA,
    max: 3,
    schedule: options.cron ?? true,
    application_name: 'lifeplate-jobs',
  });
  boss.on('error', (err) => ctx.logger.warn({ err }, 'job queue error'));
  await boss.start();
  for (const job of JOBS) {
    await boss.createQueue(job.queue, { name: job.queue, ...job.options });
    // createQueue leaves an existing queue as it was; this brings its options up to date.
    await boss.updateQueue(job.queue, { name: job.queue, ...job.options });
    await boss.schedule(job.queue, job.cron, {}, { tz: 'UTC' });
    await boss.work(job.queue, async (jobs) => {
      for (const j of jobs) {
        try {
          await job.run(ctx, j.data);
        } catch (err) {
          // pg-boss marks the job failed (and retries it); the log says why.
          ctx.logger.warn({ err, queue: job.queue }, 'scheduled job failed');
          throw err;
        }
      }
    });
  }
  return {
    boss,
    /** Waits (bounded) for a running job to finish, then closes pg-boss's own connections. */
    stop: () => boss.stop({ graceful: true, timeout: 10_000 }),
  };
}

export type Jobs = Awaited<ReturnType<typeof startJobs>>;
