import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TagAssignInput, TagDto } from '@shared/schemas/tags';
import { applianceTagsQueryOptions } from './get-appliance-tags';
import { tagResolutionQueryOptions } from './resolve-tag';

export const assignTag = (input: TagAssignInput) => api<TagDto>('/tags/assign', { method: 'POST', body: input });

export function useAssignTag() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: assignTag,
    // The record's timeline gains a line too; it refetches when the record is opened.
    onSuccess: (tag) =>
      Promise.all([
        qc.invalidateQueries({ queryKey: applianceTagsQueryOptions(tag.applianceId ?? '').queryKey }),
        qc.invalidateQueries({ queryKey: tagResolutionQueryOptions(tag.code).queryKey }),
      ]),
  });
}
