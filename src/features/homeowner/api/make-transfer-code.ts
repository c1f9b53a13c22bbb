import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreatedTransferDto, TransferDto } from '@shared/schemas/record-transfers';

// Types only from the schema file: zod stays out of the homeowner's bundle.
export const makeTransferCode = (applianceId: string) => api<CreatedTransferDto>(`/homeowner/appliances/${applianceId}/record-transfers`, { method: 'POST' });
export const useMakeTransferCode = (applianceId: string) => useMutation({ mutationFn: () => makeTransferCode(applianceId) });

export const withdrawTransferCode = (id: string) => api<TransferDto>(`/homeowner/record-transfers/${id}/withdraw`, { method: 'POST' });
export const useWithdrawTransferCode = () => useMutation({ mutationFn: withdrawTransferCode });
