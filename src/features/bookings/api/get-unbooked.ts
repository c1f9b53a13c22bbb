import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UnbookedPageDto, UnbookedQuery } from '@shared/schemas/bookings';
import { bookingKeys } from './get-round';

export type UnbookedFilters = Omit<UnbookedQuery, 'limit'> & { limit?: number };

export const getUnbooked = (query: UnbookedFilters) => api<UnbookedPageDto>('/bookings/unbooked', { query });
export const unbookedQueryOptions = (query: UnbookedFilters) => queryOptions({ queryKey: bookingKeys.unbooked(query), queryFn: () => getUnbooked(query) });
export const useUnbooked = (query: UnbookedFilters) => useQuery(unbookedQueryOptions(query));
