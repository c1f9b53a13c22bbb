import { eq } from 'drizzle-orm';
import type { Db } from '../client';
import { companies } from '../schema/index';
import { unannouncedBookings } from '../../modules/booking-notices';
import { queueBookingNotice, type NoticeDeps } from '../../modules/booking-notices';
import { DEMO_COMPANY } from './demo-accounts';

/**
 * The seed writes its bookings straight to the tables, so nobody was told of them. This queues the homeowners'
 * confirmations (with their calendar invitations) of the demo company's future booked and confirmed visits, so a
 * newcomer finds them in the mail fake's outbox. Only bookings without any notice are announced, and the notice's
 * key keeps each once, so running it at every start sends nothing twice. Answers the ids of the queued messages.
 */
export async function queueDemoBookingConfirmations(db: Db, deps: NoticeDeps, { now = new Date() }: { now?: Date } = {}): Promise<string[]> {
  const [demo] = await db.select({ id: companies.id }).from(companies).where(eq(companies.name, DEMO_COMPANY.name)).limit(1);
  if (!demo) return [];
  const mailIds: string[] = [];
  for (const b of await unannouncedBookings(db, demo.id, now)) {
    const notice = await db.transaction((tx) => queueBookingNotice(deps, tx, b.id, 'booked'));
    if (notice?.mailId) mailIds.push(notice.mailId);
  }
  return mailIds;
}
