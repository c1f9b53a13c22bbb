import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ApplianceRecordDto } from '@shared/schemas/records';

export const getApplianceRecord = (id: string) => api<ApplianceRecordDto>(`/appliances/${id}`);

export const applianceRecordQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['appliance', id], queryFn: () => getApplianceRecord(id) });

export const useApplianceRecord = (id: string) => useQuery(applianceRecordQueryOptions(id));
