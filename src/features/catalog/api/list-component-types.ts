import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CatalogEntryDto } from '@shared/schemas/records';

export const listComponentTypes = () => api<CatalogEntryDto[]>('/catalog/component-types');
export const componentTypesQueryOptions = () => queryOptions({ queryKey: ['catalog', 'component-types'], queryFn: listComponentTypes });
export const useComponentTypes = () => useQuery(componentTypesQueryOptions());
