import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReplacementProspectDto } from '@shared/schemas/fleet';

export const getReplacementProspects = () => api<ReplacementProspectDto[]>('/fleet/replacement-prospects');
export const replacementProspectsQueryOptions = () => queryOptions({ queryKey: ['fleet', 'replacement-prospects'], queryFn: getReplacementProspects });
export const useReplacementProspects = () => useQuery(replacementProspectsQueryOptions());
