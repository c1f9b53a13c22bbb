import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CompanyDto, CompanySettingsInput } from '@shared/schemas/company';
import { companyQueryOptions } from './get-company';

export const updateCompany = (input: CompanySettingsInput) => api<CompanyDto>('/company', { method: 'PATCH', body: input });

export function useUpdateCompany() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateCompany,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: companyQueryOptions().queryKey });
      void qc.invalidateQueries({ queryKey: ['me'] });
    },
  });
}
