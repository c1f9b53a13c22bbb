import { Page } from '@/components/ui/page';
import { ChecklistTemplatesSection } from './checklist-templates-section';
import { ComponentCatalogSection } from './component-catalog-section';
import { DueRulesSection } from './due-rules-section';
import { RECORD_WORDS } from '@shared/glossary';

export function CatalogPage() {
  return (
    <Page title={RECORD_WORDS.catalogPage} subtitle="What your technicians pick from, check and get reminded of.">
      <nav aria-label="On this page" className="flex flex-wrap gap-x-4 text-sm font-semibold">
        <a href="#part-types" className="flex min-h-tap items-center underline">{RECORD_WORDS.partTypes}</a>
        <a href="#checklist-templates" className="flex min-h-tap items-center underline">{RECORD_WORDS.checklistTemplates}</a>
        <a href="#due-rules" className="flex min-h-tap items-center underline">{RECORD_WORDS.dueRules}</a>
      </nav>
      <ComponentCatalogSection />
      <ChecklistTemplatesSection />
      <DueRulesSection />
    </Page>
  );
}
