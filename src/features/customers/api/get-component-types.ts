import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CatalogEntryDto } from '@shared/schemas/records';

export const getComponentTypes = () => api<CatalogEntryDto[]>('/catalog/component-types');
/** Same key as the catalog screen's list, so a rename there shows here. */
export const componentTypesQueryOptions = () => queryOptions({ queryKey: ['catalog', 'component-types'], queryFn: getComponentTypes });
export const useComponentTypes = () => useQuery(componentTypesQueryOptions());
