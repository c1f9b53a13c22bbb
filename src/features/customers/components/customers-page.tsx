import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function CustomersPage() {
  return <Page title="CustomersPage">Not built yet.</Page>;
}
