import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ChecklistTemplateDto } from '@shared/schemas/records';

/** `/checklist-templates`: the catalog edits them; a visit started with no signal builds its checklist from the saved copy. */
export const checklistTemplateKeys = { all: ['checklist-templates'] as const };

export const listChecklistTemplates = () => api<ChecklistTemplateDto[]>('/checklist-templates');
export const checklistTemplatesQueryOptions = () => queryOptions({ queryKey: checklistTemplateKeys.all, queryFn: listChecklistTemplates });
export const useChecklistTemplates = () => useQuery(checklistTemplatesQueryOptions());
