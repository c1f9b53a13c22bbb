import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function ApplianceRecordPage() {
  return <Page title="ApplianceRecordPage">Not built yet.</Page>;
}
