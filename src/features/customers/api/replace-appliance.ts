import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { ApplianceRecordDto, replaceApplianceInput } from '@shared/schemas/records';
import { applianceKeys } from '@/lib/resources/appliances';
import { customerQueryOptions } from './get-customer';

export type ReplaceBody = z.output<typeof replaceApplianceInput>;

export const replaceAppliance = ({ id, body }: { id: string; body: ReplaceBody }) =>
  api<ApplianceRecordDto>(`/appliances/${encodeURIComponent(id)}/replace`, { method: 'POST', body });

export function useReplaceAppliance() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: replaceAppliance,
    onSuccess: (record) => {
      void qc.invalidateQueries({ queryKey: customerQueryOptions(record.customer.id).queryKey });
      // The old and the new appliance's life records both changed.
      void qc.invalidateQueries({ queryKey: applianceKeys.all });
    },
  });
}
