import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TransferPreviewDto } from '@shared/schemas/record-transfers';

/** A POST, so the code travels in the body and never in a URL or a cache key. */
export const previewTransfer = (code: string) => api<TransferPreviewDto>('/record-transfers/preview', { method: 'POST', body: { code } });
export const usePreviewTransfer = () => useMutation({ mutationFn: previewTransfer });
