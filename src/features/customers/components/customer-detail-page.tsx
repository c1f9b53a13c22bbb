import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function CustomerDetailPage() {
  return <Page title="CustomerDetailPage">Not built yet.</Page>;
}
