import { useMe } from '@/lib/auth';
import { Page } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { FindPage } from '@/features/find/components/find-page';
import { NoRolePage } from './no-role';

/** Each role lands on its own home: the technician's search, the office's overview, the homeowner's appliances. */
export function HomePage() {
  const me = useMe();
  const principal = me.data?.principal;
  if (!principal) return <NoRolePage />;
  if (principal.kind === 'homeowner') {
    return (
      <Page title={`Hello, ${me.data?.user.name}`} subtitle={`Your heating is looked after by ${me.data?.company?.name}.`}>
        <Card title="Your service company">
          <p>
            {me.data?.company?.name} · <a className="font-semibold underline" href={`tel:${me.data?.company?.phone}`}>{me.data?.company?.phone}</a>
          </p>
        </Card>
      </Page>
    );
  }
  // Every member starts from finding an appliance: the technician at the door, the office on the phone.
  return <FindPage />;
}
