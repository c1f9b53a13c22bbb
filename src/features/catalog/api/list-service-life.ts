import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ServiceLifeDto } from '@shared/schemas/service-life';

export const listServiceLife = () => api<ServiceLifeDto[]>('/service-life');
export const serviceLifeQueryOptions = () => queryOptions({ queryKey: ['service-life'], queryFn: listServiceLife });
export const useServiceLife = () => useQuery(serviceLifeQueryOptions());
