import { Page } from '@/components/ui/page';

// Placeholder until the life-record screens land.
export function CatalogPage() {
  return <Page title="CatalogPage">Not built yet.</Page>;
}
