import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportFileDto } from '@shared/schemas/imports';

export const importKeys = { all: ['imports'] as const, one: (id: string) => ['imports', id] as const };

export const listImports = () => api<ImportFileDto[]>('/imports');
export const importsQueryOptions = () => queryOptions({ queryKey: importKeys.all, queryFn: listImports });
export const useImports = () => useQuery(importsQueryOptions());
