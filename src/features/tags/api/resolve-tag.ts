import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PublicTagDto, TagResolutionDto } from '@shared/schemas/tags';

/** What the signed-in caller may know about a tag; 404 when it is not theirs to see. */
export const resolveTag = (code: string) => api<TagResolutionDto>(`/tags/${encodeURIComponent(code)}/resolve`);

/** What anyone may know: whose tag it is and their phone. */
export const getPublicTag = (code: string) => api<PublicTagDto>(`/public/tags/${encodeURIComponent(code)}`);

// A 404 is an answer here (not this caller's tag), so it is never retried.
export const tagResolutionQueryOptions = (code: string) =>
  queryOptions({ queryKey: ['tag-resolve', code], queryFn: () => resolveTag(code), retry: false, staleTime: 0 });

export const publicTagQueryOptions = (code: string) => queryOptions({ queryKey: ['public-tag', code], queryFn: () => getPublicTag(code), retry: false });
