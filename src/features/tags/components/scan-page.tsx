import { Page } from '@/components/ui/page';

// Placeholder until the tag and photo screens land.
export function ScanPage(_props: Record<string, unknown>) {
  return <Page title="ScanPage">Not built yet.</Page>;
}
