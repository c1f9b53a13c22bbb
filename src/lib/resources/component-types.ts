import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CatalogEntryDto } from '@shared/schemas/records';

/** `/catalog/component-types`: the catalog screen and the new-appliance form share one entry, so a rename shows in both. */
export const componentTypeKeys = { all: ['catalog', 'component-types'] as const };

export const getComponentTypes = () => api<CatalogEntryDto[]>('/catalog/component-types');
export const componentTypesQueryOptions = () => queryOptions({ queryKey: componentTypeKeys.all, queryFn: getComponentTypes });
export const useComponentTypes = () => useQuery(componentTypesQueryOptions());
