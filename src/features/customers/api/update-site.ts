import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { SiteDto, sitePatch } from '@shared/schemas/records';
import { customerQueryOptions } from './get-customer';
import { customersListKey } from './list-customers';

export type SitePatchBody = z.output<typeof sitePatch>;

export const updateSite = ({ id, body }: { id: string; body: SitePatchBody }) =>
  api<SiteDto>(`/sites/${encodeURIComponent(id)}`, { method: 'PATCH', body });

export function useUpdateSite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateSite,
    onSuccess: (site) => {
      void qc.invalidateQueries({ queryKey: customerQueryOptions(site.customerId).queryKey });
      void qc.invalidateQueries({ queryKey: customersListKey });
    },
  });
}
