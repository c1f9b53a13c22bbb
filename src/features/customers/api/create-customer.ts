import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { CustomerDto, customerInput } from '@shared/schemas/records';
import { customersListKey } from './list-customers';

export type CustomerBody = z.output<typeof customerInput>;

export const createCustomer = (body: CustomerBody) => api<CustomerDto>('/customers', { method: 'POST', body });

export function useCreateCustomer() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createCustomer, onSuccess: () => qc.invalidateQueries({ queryKey: customersListKey }) });
}
