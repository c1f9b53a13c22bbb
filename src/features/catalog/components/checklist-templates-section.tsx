import { formatInstant } from '@shared/format/dates';
import { useState } from 'react';
import { LABELS } from '@shared/schemas/enums';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { useChecklistTemplates } from '@/lib/resources/checklist-templates';
import { ChecklistTemplateEditor } from './checklist-template-editor';
import { RECORD_WORDS } from '@shared/glossary';

export function ChecklistTemplatesSection() {
  const templates = useChecklistTemplates();
  const [editingId, setEditingId] = useState<string | null>(null);
  const editing = templates.data?.find((t) => t.id === editingId);

  return (
    <Card title={<span id="checklist-templates">{RECORD_WORDS.checklistTemplates}</span>}>
      <div className="mb-3">
        <Notice title="Edits never change history">
          Each visit keeps its own copy of the checklist from the day it was started. Changing a template here only
          changes visits started afterwards; completed and open visits keep the items they had.
        </Notice>
      </div>
      {templates.isPending && <Spinner />}
      {templates.isError && <Notice kind="danger" title="Could not load the checklists">{templates.error.message}</Notice>}
      {editing ? (
        <ChecklistTemplateEditor key={editing.id} template={editing} onClose={() => setEditingId(null)} />
      ) : (
        <ul className="divide-y divide-plate-line rounded-plate border border-plate-line">
          {templates.data?.map((t) => (
            <li key={t.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
              <div className="min-w-48 flex-1">
                <p className="font-semibold">{t.name}</p>
                <p className="text-sm text-iron-muted">
                  {LABELS.applianceKind[t.applianceKind]}
                  {t.fuel ? `, ${LABELS.fuel[t.fuel].toLowerCase()}` : ', any fuel'} · {t.items.length} items · changed{' '}
                  {formatInstant(t.updatedAt, Intl.DateTimeFormat().resolvedOptions().timeZone)}
                </p>
              </div>
              <Button variant="secondary" onClick={() => setEditingId(t.id)} aria-label={`Edit ${t.name}`}>
                Edit
              </Button>
            </li>
          ))}
          {templates.data?.length === 0 && <li className="px-3 py-2 text-iron-muted">No checklist templates yet.</li>}
        </ul>
      )}
    </Card>
  );
}
