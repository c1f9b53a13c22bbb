import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function NewAppliancePage() {
  return <Page title="NewAppliancePage">Not built yet.</Page>;
}
