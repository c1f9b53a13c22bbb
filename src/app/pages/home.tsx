import { useMe } from '@/lib/auth';
import { MyAppliancesPage } from '@/features/homeowner/components/my-appliances-page';
import { FindPage } from '@/features/find/components/find-page';
import { TodayRoundSummary } from '@/features/bookings/components/today-round-summary';
import { NoRolePage } from './no-role';

/** Each role lands on its own home: the technician's search, the office's overview, the homeowner's appliances. */
export function HomePage() {
  const me = useMe();
  const principal = me.data?.principal;
  if (!principal) return <NoRolePage />;
  if (principal.kind === 'homeowner') return <MyAppliancesPage />;
  // Every member starts from finding an appliance: the technician at the door, the office on the phone.
  return <FindPage below={principal.role === 'technician' ? <TodayRoundSummary /> : undefined} />;
}
