import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ServiceRequestDto, ServiceRequestPatch } from '@shared/schemas/service-requests';
import { serviceRequestsKey } from './list-service-requests';

export const updateServiceRequest = (id: string, patch: ServiceRequestPatch) => api<ServiceRequestDto>(`/service-requests/${id}`, { method: 'PATCH', body: patch });

export function useUpdateServiceRequest() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, status }: { id: string } & ServiceRequestPatch) => updateServiceRequest(id, { status }),
    onSuccess: () => qc.invalidateQueries({ queryKey: serviceRequestsKey }),
  });
}
