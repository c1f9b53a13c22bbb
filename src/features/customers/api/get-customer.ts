import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CustomerDetailDto } from '@shared/schemas/records';

export const getCustomer = (id: string) => api<CustomerDetailDto>(`/customers/${encodeURIComponent(id)}`);
export const customerQueryOptions = (id: string) => queryOptions({ queryKey: ['customers', 'detail', id], queryFn: () => getCustomer(id) });
export const useCustomer = (id: string | undefined) => useQuery({ ...customerQueryOptions(id ?? ''), enabled: Boolean(id) });
