import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportFileDto } from '@shared/schemas/imports';
import { importKeys } from './list-imports';

export const getImport = (id: string) => api<ImportFileDto>(`/imports/${encodeURIComponent(id)}`);
export const importQueryOptions = (id: string) =>
  queryOptions({
    queryKey: importKeys.one(id),
    queryFn: () => getImport(id),
    // Poll while the file is being imported, so the progress bar moves; stop once it is done.
    refetchInterval: (q) => (q.state.data?.status === 'queued' || q.state.data?.status === 'importing' ? 1000 : false),
  });
export const useImport = (id: string | null) => useQuery({ ...importQueryOptions(id ?? ''), enabled: Boolean(id) });
