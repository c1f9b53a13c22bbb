import { Page } from '@/components/ui/page';

// Placeholder until the tag and photo screens land.
export function TagBatchesPage(_props: Record<string, unknown>) {
  return <Page title="TagBatchesPage">Not built yet.</Page>;
}
