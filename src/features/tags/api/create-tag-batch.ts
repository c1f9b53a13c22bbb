import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TagBatchDto, TagBatchInput } from '@shared/schemas/tags';
import { tagBatchesQueryOptions } from './list-tag-batches';

export const createTagBatch = (input: TagBatchInput) => api<TagBatchDto>('/tag-batches', { method: 'POST', body: input });

export function useCreateTagBatch() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createTagBatch, onSuccess: () => qc.invalidateQueries({ queryKey: tagBatchesQueryOptions().queryKey }) });
}
