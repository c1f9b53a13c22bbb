import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreatedTransferDto, TransferDto } from '@shared/schemas/record-transfers';
import { applianceKeys } from '@/lib/resources/appliances';

export const listRecordTransfers = (applianceId: string) => api<TransferDto[]>(`/appliances/${applianceId}/record-transfers`);
export const recordTransfersQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: applianceKeys.recordTransfers(applianceId), queryFn: () => listRecordTransfers(applianceId) });
export const useRecordTransfers = (applianceId: string) => useQuery(recordTransfersQueryOptions(applianceId));

export function useCreateRecordTransfer(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<CreatedTransferDto>(`/appliances/${applianceId}/record-transfers`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: applianceKeys.record(applianceId) }),
  });
}

export function useWithdrawRecordTransfer(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<TransferDto>(`/record-transfers/${id}/withdraw`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: applianceKeys.record(applianceId) }),
  });
}
