import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function FindPage() {
  return <Page title="FindPage">Not built yet.</Page>;
}
