import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { HomeownerApplianceSummary, HomeownerViewDto } from '@shared/schemas/homeowner';

export const getMyAppliances = () => api<HomeownerApplianceSummary[]>('/homeowner/appliances');
export const myAppliancesQueryOptions = () => queryOptions({ queryKey: ['homeowner', 'appliances'], queryFn: getMyAppliances });
export const useMyAppliances = () => useQuery(myAppliancesQueryOptions());

export const getMyAppliance = (id: string) => api<HomeownerViewDto>(`/homeowner/appliances/${id}`);
export const myApplianceQueryOptions = (id: string) => queryOptions({ queryKey: ['homeowner', 'appliances', id], queryFn: () => getMyAppliance(id) });
export const useMyAppliance = (id: string) => useQuery(myApplianceQueryOptions(id));
