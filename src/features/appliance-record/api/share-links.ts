import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreatedShareLinkDto, ShareLinkDto, ShareLinkInput } from '@shared/schemas/homeowner';
import { applianceKeys } from '@/lib/resources/appliances';

export const listShareLinks = (applianceId: string) => api<ShareLinkDto[]>(`/appliances/${applianceId}/share-links`);
export const shareLinksQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: applianceKeys.shareLinks(applianceId), queryFn: () => listShareLinks(applianceId) });
export const useShareLinks = (applianceId: string) => useQuery(shareLinksQueryOptions(applianceId));

export function useCreateShareLink(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ShareLinkInput) => api<CreatedShareLinkDto>(`/appliances/${applianceId}/share-links`, { method: 'POST', body: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareLinksQueryOptions(applianceId).queryKey }),
  });
}

export function useRevokeShareLink(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<ShareLinkDto>(`/share-links/${id}/revoke`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareLinksQueryOptions(applianceId).queryKey }),
  });
}
