import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PhotoDto } from '@shared/schemas/photos';
import { applianceKeys } from '@/lib/resources/appliances';

export const listPhotos = (applianceId: string) => api<PhotoDto[]>('/photos', { query: { applianceId } });

// Under the appliance's key, so invalidating ['appliance', id] after a change refreshes the record and its photos together.
export const photosQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: applianceKeys.photos(applianceId), queryFn: () => listPhotos(applianceId) });

export const usePhotos = (applianceId: string) => useQuery(photosQueryOptions(applianceId));
