import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ChecklistTemplateDto } from '@shared/schemas/records';

export const listChecklistTemplates = () => api<ChecklistTemplateDto[]>('/checklist-templates');
export const checklistTemplatesQueryOptions = () => queryOptions({ queryKey: ['checklist-templates'], queryFn: listChecklistTemplates });
export const useChecklistTemplates = () => useQuery(checklistTemplatesQueryOptions());
