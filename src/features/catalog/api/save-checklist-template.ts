import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { ChecklistTemplateDto, checklistTemplateInput } from '@shared/schemas/records';
import { checklistTemplatesQueryOptions } from '@/lib/resources/checklist-templates';

export type ChecklistTemplateBody = z.output<typeof checklistTemplateInput>;

export const saveChecklistTemplate = ({ id, body }: { id: string; body: ChecklistTemplateBody }) =>
  api<ChecklistTemplateDto>(`/checklist-templates/${encodeURIComponent(id)}`, { method: 'PUT', body });

export function useSaveChecklistTemplate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: saveChecklistTemplate,
    onSuccess: () => qc.invalidateQueries({ queryKey: checklistTemplatesQueryOptions().queryKey }),
  });
}
