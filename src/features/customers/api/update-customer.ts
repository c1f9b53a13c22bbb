import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { CustomerDto, customerPatch } from '@shared/schemas/records';
import { customerQueryOptions } from './get-customer';
import { customersListKey } from './list-customers';

export type CustomerPatchBody = z.output<typeof customerPatch>;

export const updateCustomer = ({ id, body }: { id: string; body: CustomerPatchBody }) =>
  api<CustomerDto>(`/customers/${encodeURIComponent(id)}`, { method: 'PATCH', body });

export function useUpdateCustomer() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateCustomer,
    onSuccess: (_data, { id }) => {
      void qc.invalidateQueries({ queryKey: customerQueryOptions(id).queryKey });
      void qc.invalidateQueries({ queryKey: customersListKey });
    },
  });
}
