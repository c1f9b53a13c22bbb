import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { applianceKeys } from '@/lib/resources/appliances';
import type { ReceivedTransferDto, TransferRedeemInput } from '@shared/schemas/record-transfers';

export const redeemTransfer = (input: TransferRedeemInput) => api<ReceivedTransferDto>('/record-transfers/redeem', { method: 'POST', body: input });
export function useRedeemTransfer() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: redeemTransfer, onSuccess: () => qc.invalidateQueries({ queryKey: applianceKeys.all }) });
}
