import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DueRuleDto } from '@shared/schemas/due';

export const listDueRules = () => api<DueRuleDto[]>('/due-rules');
export const dueRulesQueryOptions = () => queryOptions({ queryKey: ['due-rules'], queryFn: listDueRules });
export const useDueRules = () => useQuery(dueRulesQueryOptions());
