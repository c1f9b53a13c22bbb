import { useState } from 'react';
import type { CustomerDto } from '@shared/schemas/records';
import { LABELS } from '@shared/schemas/enums';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import { useUpdateCustomer } from '../api/update-customer';
import { CustomerForm } from './customer-form';

export function ContactCard({ customer, canWrite }: { customer: CustomerDto; canWrite: boolean }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateCustomer();

  if (editing) {
    return (
      <Card title="Edit contact details">
        <CustomerForm
          initial={customer}
          submitLabel="Save contact details"
          onCancel={() => setEditing(false)}
          onSubmit={async (body) => {
            await update.mutateAsync({ id: customer.id, body });
            setEditing(false);
          }}
        />
      </Card>
    );
  }

  return (
    <Card
      title="Contact details"
      action={
        canWrite && (
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit contact details
          </Button>
        )
      }
    >
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold">Kind</dt>
        <dd>{LABELS.customerKind[customer.kind]}</dd>
        <dt className="font-semibold">Phone</dt>
        <dd>{customer.phone ? <a href={`tel:${customer.phone}`} className="underline">{customer.phone}</a> : 'Not given'}</dd>
        <dt className="font-semibold">E-mail</dt>
        <dd className="break-all">{customer.email ? <a href={`mailto:${customer.email}`} className="underline">{customer.email}</a> : 'Not given'}</dd>
        <dt className="font-semibold">Reminders</dt>
        <dd>
          {customer.remindersOptOut ? (
            <StatusBadge status="info">Opted out of reminders</StatusBadge>
          ) : (
            <StatusBadge status="ok">Gets reminders</StatusBadge>
          )}
        </dd>
        {customer.notes && (
          <>
            <dt className="font-semibold">Notes</dt>
            <dd className="whitespace-pre-line">{customer.notes}</dd>
          </>
        )}
      </dl>
    </Card>
  );
}
