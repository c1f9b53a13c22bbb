import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { SiteDto, siteInput } from '@shared/schemas/records';
import { customerQueryOptions } from './get-customer';
import { customersListKey } from './list-customers';

export type SiteBody = z.output<typeof siteInput>;

export const createSite = (body: SiteBody) => api<SiteDto>('/sites', { method: 'POST', body });

export function useCreateSite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createSite,
    onSuccess: (site) => {
      void qc.invalidateQueries({ queryKey: customerQueryOptions(site.customerId).queryKey });
      void qc.invalidateQueries({ queryKey: customersListKey });
    },
  });
}
