import { Link, useNavigate } from 'react-router-dom';
import { Page } from '@/components/ui/page';
import { Card } from '@/components/ui/card';
import { useCreateCustomer } from '../api/create-customer';
import { CustomerForm } from './customer-form';

export function NewCustomerPage() {
  const create = useCreateCustomer();
  const navigate = useNavigate();
  return (
    <Page
      title="New customer"
      subtitle="Add the customer first; their sites and appliances come next."
      actions={
        <Link to="/customers" className="flex min-h-tap items-center font-semibold underline">
          Back to customers
        </Link>
      }
    >
      <Card>
        <CustomerForm
          submitLabel="Save customer"
          onSubmit={async (body) => {
            const customer = await create.mutateAsync(body);
            navigate(`/customers/${customer.id}`);
          }}
        />
      </Card>
    </Page>
  );
}
