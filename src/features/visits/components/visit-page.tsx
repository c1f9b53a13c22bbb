import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function VisitPage() {
  return <Page title="VisitPage">Not built yet.</Page>;
}
