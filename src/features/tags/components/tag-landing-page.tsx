import { Page } from '@/components/ui/page';

// Placeholder until the tag and photo screens land.
export function TagLandingPage(_props: Record<string, unknown>) {
  return <Page title="TagLandingPage">Not built yet.</Page>;
}
