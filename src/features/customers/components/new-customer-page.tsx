import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function NewCustomerPage() {
  return <Page title="NewCustomerPage">Not built yet.</Page>;
}
