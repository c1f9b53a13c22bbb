import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CustomerDetailDto, CustomerListItem, Page } from '@shared/schemas/records';

/** The receiving company's own customers matching a name, for filing a received record under an existing site. */
export const findCustomers = (q: string) => api<Page<CustomerListItem>>('/customers', { query: { q, limit: 5 } });
export const customerMatchesQueryOptions = (q: string) =>
  queryOptions({ queryKey: ['record-transfers', 'customers', q] as const, queryFn: () => findCustomers(q), enabled: q.trim().length >= 2 });
export const useCustomerMatches = (q: string) => useQuery(customerMatchesQueryOptions(q));

export const getCustomer = (id: string) => api<CustomerDetailDto>(`/customers/${id}`);
export const customerSitesQueryOptions = (id: string | null) =>
  queryOptions({ queryKey: ['record-transfers', 'customer', id] as const, queryFn: () => getCustomer(id!), enabled: Boolean(id) });
export const useCustomerSites = (id: string | null) => useQuery(customerSitesQueryOptions(id));
