import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CompanyDto } from '@shared/schemas/company';

export const getCompany = () => api<CompanyDto>('/company');
export const companyQueryOptions = () => queryOptions({ queryKey: ['company'], queryFn: getCompany });
export const useCompany = () => useQuery(companyQueryOptions());
