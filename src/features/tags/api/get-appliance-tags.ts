import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TagDto } from '@shared/schemas/tags';

export const getApplianceTags = (applianceId: string) => api<TagDto[]>(`/appliances/${applianceId}/tags`);

export const applianceTagsQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: ['appliance-tags', applianceId], queryFn: () => getApplianceTags(applianceId) });

export const useApplianceTags = (applianceId: string) => useQuery(applianceTagsQueryOptions(applianceId));
