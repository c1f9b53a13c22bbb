import { Page } from '@/components/ui/page';
import { ChecklistTemplatesSection } from './checklist-templates-section';
import { ComponentCatalogSection } from './component-catalog-section';
import { DueRulesSection } from './due-rules-section';

export function CatalogPage() {
  return (
    <Page title="Parts & checklists" subtitle="What your technicians pick from, check and get reminded of.">
      <nav aria-label="On this page" className="flex flex-wrap gap-x-4 text-sm font-semibold">
        <a href="#component-catalog" className="flex min-h-tap items-center underline">Component catalog</a>
        <a href="#checklist-templates" className="flex min-h-tap items-center underline">Checklist templates</a>
        <a href="#due-rules" className="flex min-h-tap items-center underline">Due rules</a>
      </nav>
      <ComponentCatalogSection />
      <ChecklistTemplatesSection />
      <DueRulesSection />
    </Page>
  );
}
