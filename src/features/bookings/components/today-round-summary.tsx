import { Link } from 'react-router-dom';
import { todayInTimeZone } from '@shared/dates';
import { Card } from '@/components/ui/card';
import { useMe } from '@/lib/auth';
import { useRound } from '../api/get-round';

const clock = (local: string) => local.slice(11, 16);

/** On the technician's home: how many visits today and the next one, one tap to the round. */
export function TodayRoundSummary() {
  const me = useMe();
  const today = todayInTimeZone(me.data?.company?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
  const round = useRound(today);
  if (!round.data) return null;
  const live = round.data.bookings.filter((b) => b.status === 'booked' || b.status === 'confirmed');
  const next = live[0];
  return (
    <Card title="Today’s round">
      <p>
        {live.length === 0 ? 'No visits left to do today.' : `${live.length} ${live.length === 1 ? 'visit' : 'visits'} to do today.`}
        {next && ` Next: ${clock(next.start)}, ${next.customer.name}, ${next.site.street}.`}
      </p>
      <Link className="inline-flex min-h-tap items-center font-semibold underline" to="/round">
        Open the round
      </Link>
    </Card>
  );
}
