import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { ApplianceRecordDto, applianceInput } from '@shared/schemas/records';
import { customerQueryOptions } from './get-customer';
import { customersListKey } from './list-customers';

export type ApplianceBody = z.output<typeof applianceInput>;

export const createAppliance = (body: ApplianceBody) => api<ApplianceRecordDto>('/appliances', { method: 'POST', body });

export function useCreateAppliance() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createAppliance,
    onSuccess: (record) => {
      void qc.invalidateQueries({ queryKey: customerQueryOptions(record.customer.id).queryKey });
      void qc.invalidateQueries({ queryKey: customersListKey });
    },
  });
}
