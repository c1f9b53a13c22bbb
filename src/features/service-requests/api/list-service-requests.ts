import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ServiceRequestPage, ServiceRequestStatus } from '@shared/schemas/service-requests';

export type ServiceRequestFilter = ServiceRequestStatus | 'all';

export const listServiceRequests = (q: { status?: ServiceRequestStatus; after?: string; limit?: number }) =>
  api<ServiceRequestPage>('/service-requests', { query: q });

/** Root key of every service-request query (the list pages and the nav's count), for invalidation after a change. */
export const serviceRequestsKey = ['service-requests'] as const;

export const serviceRequestsQueryOptions = (filter: ServiceRequestFilter) =>
  infiniteQueryOptions({
    queryKey: [...serviceRequestsKey, 'list', filter],
    queryFn: ({ pageParam }) => listServiceRequests({ status: filter === 'all' ? undefined : filter, after: pageParam, limit: 30 }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });
export const useServiceRequests = (filter: ServiceRequestFilter) => useInfiniteQuery(serviceRequestsQueryOptions(filter));

export const newServiceRequestCountQueryOptions = () =>
  queryOptions({
    queryKey: [...serviceRequestsKey, 'new-count'],
    queryFn: () => listServiceRequests({ status: 'new', limit: 1 }),
    select: (page) => page.newCount,
    staleTime: 30_000,
  });
export const useNewServiceRequestCount = (enabled: boolean) => useQuery({ ...newServiceRequestCountQueryOptions(), enabled });
