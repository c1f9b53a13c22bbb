import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ApplianceRecordDto } from '@shared/schemas/records';

/** The appliance behind a visit: fuel and vent for the live results, current parts for the swap list. Same key as the record page. */
export const getAppliance = (id: string) => api<ApplianceRecordDto>(`/appliances/${id}`);
export const applianceQueryOptions = (id: string) => queryOptions({ queryKey: ['appliance', id], queryFn: () => getAppliance(id) });
export const useAppliance = (id: string) => useQuery(applianceQueryOptions(id));
