import { Link } from 'react-router-dom';
import { useMe } from '@/lib/auth';
import { Page } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { can } from '@shared/policy';
import { ROLE_LABELS } from '@shared/schemas/roles';
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
  const role = ROLE_LABELS[principal.role];
  return (
    <Page title={`Hello, ${me.data?.user.name}`} subtitle={`${role} · ${me.data?.company?.name}`}>
      <div className="grid gap-3 sm:grid-cols-2">
        <Card title="Team">
          <p className="mb-2">Who works for {me.data?.company?.name}, and their roles.</p>
          <Link className="font-semibold text-brass-dark underline" to="/team">
            Open the team list
          </Link>
        </Card>
        {can(principal, 'company:settings') && (
          <Card title="Company settings">
            <p className="mb-2">Name, phone and the time zone that decides what "due today" means.</p>
            <Link className="font-semibold text-brass-dark underline" to="/settings">
              Open company settings
            </Link>
          </Card>
        )}
      </div>
    </Page>
  );
}
