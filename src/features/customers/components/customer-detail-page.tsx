import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '@shared/policy';
import { Page, Spinner } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/lib/auth';
import { useCustomer } from '../api/get-customer';
import { useCreateSite } from '../api/create-site';
import { ContactCard } from './contact-card';
import { SiteCard } from './site-card';
import { SiteForm } from './site-form';
import { InviteHomeowner } from './invite-homeowner';

export function CustomerDetailPage() {
  const { id } = useParams();
  const me = useMe();
  const customer = useCustomer(id);
  const canWrite = can(me.data?.principal, 'records:write');
  const canInvite = can(me.data?.principal, 'share:create');

  if (customer.isPending) return <Spinner />;
  if (customer.isError) {
    const missing = customer.error instanceof ApiError && (customer.error.status === 404 || customer.error.status === 400);
    return (
      <Page title={missing ? 'Customer not found' : 'Could not load the customer'}>
        <Notice kind={missing ? 'info' : 'danger'}>{missing ? 'No customer of your company has this address.' : customer.error.message}</Notice>
        <Link to="/customers" className="font-semibold underline">
          Back to customers
        </Link>
      </Page>
    );
  }

  const c = customer.data;
  const allAppliances = c.sites.flatMap((s) => s.appliances);
  return (
    <Page
      title={c.name}
      subtitle={`${c.sites.length} ${c.sites.length === 1 ? 'site' : 'sites'} · ${allAppliances.length} ${allAppliances.length === 1 ? 'appliance' : 'appliances'}`}
      actions={
        <Link to="/customers" className="flex min-h-tap items-center font-semibold underline">
          Back to customers
        </Link>
      }
    >
      <ContactCard customer={c} canWrite={canWrite} />
      {canInvite && <InviteHomeowner customer={c} />}
      <h2 className="mt-2 text-xl font-bold">Sites</h2>
      {c.sites.length === 0 && <p className="text-iron-muted">No site yet. Add the address where the appliances are.</p>}
      {c.sites.map((s) => (
        <SiteCard key={s.id} site={s} allAppliances={allAppliances} canWrite={canWrite} />
      ))}
      {canWrite && <AddSite customerId={c.id} startOpen={c.sites.length === 0} />}
    </Page>
  );
}

function AddSite({ customerId, startOpen }: { customerId: string; startOpen: boolean }) {
  const [open, setOpen] = useState(startOpen);
  const create = useCreateSite();
  if (!open) {
    return (
      <div>
        <Button variant="secondary" onClick={() => setOpen(true)}>
          + Add site
        </Button>
      </div>
    );
  }
  return (
    <Card title="Add site">
      <SiteForm
        customerId={customerId}
        submitLabel="Save site"
        onCancel={startOpen ? undefined : () => setOpen(false)}
        onSubmit={async (body) => {
          await create.mutateAsync(body);
          setOpen(false);
        }}
      />
    </Card>
  );
}
