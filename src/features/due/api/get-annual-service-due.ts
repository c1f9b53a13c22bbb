import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AnnualServiceDueDto } from '@shared/schemas/fleet';

export const getAnnualServiceDue = () => api<AnnualServiceDueDto>('/fleet/annual-service-due');
export const annualServiceDueQueryOptions = () => queryOptions({ queryKey: ['fleet', 'annual-service-due'], queryFn: getAnnualServiceDue });
export const useAnnualServiceDue = () => useQuery(annualServiceDueQueryOptions());
