import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TagBatchDto } from '@shared/schemas/tags';

export const listTagBatches = () => api<TagBatchDto[]>('/tag-batches');

export const tagBatchesQueryOptions = () => queryOptions({ queryKey: ['tag-batches'], queryFn: listTagBatches });

export const useTagBatches = () => useQuery(tagBatchesQueryOptions());

/** The printable sheet; opened by the browser itself (a plain link), so the session cookie goes along. */
export const tagBatchPdfUrl = (batchId: string) => `/api/tag-batches/${batchId}/pdf`;
