import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CustomerListItem, Page } from '@shared/schemas/records';

export type CustomerSort = 'name' | 'town' | 'created';
export type CustomerListParams = { q?: string; sort: CustomerSort; after?: string; limit?: number };

export const listCustomers = (params: CustomerListParams) => api<Page<CustomerListItem>>('/customers', { query: params });

export const customersQueryOptions = (params: CustomerListParams) =>
  queryOptions({ queryKey: ['customers', 'list', params], queryFn: () => listCustomers(params), placeholderData: keepPreviousData });

/** Root key for every customer list page, for invalidation after a write. */
export const customersListKey = ['customers', 'list'] as const;

export const useCustomers = (params: CustomerListParams) => useQuery(customersQueryOptions(params));
