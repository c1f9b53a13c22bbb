import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { PhotoDto } from '@shared/schemas/photos';
import { photosQueryOptions } from './list-photos';
import { applianceKeys } from '@/lib/resources/appliances';

export type PhotoChange = { caption?: string | null; homeownerVisible?: boolean };

export const updatePhoto = (id: string, change: PhotoChange) => api<PhotoDto>(`/photos/${id}`, { method: 'PATCH', body: change });

export function useUpdatePhoto(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: PhotoChange }) => updatePhoto(id, change),
    onSuccess: (updated) => {
      qc.setQueryData(photosQueryOptions(applianceId).queryKey, (list) => list?.map((p) => (p.id === updated.id ? updated : p)));
      // The timeline entry's homeowner visibility follows the photo's.
      void qc.invalidateQueries({ queryKey: applianceKeys.record(applianceId) });
    },
  });
}
