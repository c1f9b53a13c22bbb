import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ServiceRequestCreatedDto, ServiceRequestInput } from '@shared/schemas/service-requests';
import { serviceRequestPath, type RecordSource } from './record-source';

// Types only from the schema file: zod stays out of the homeowner's bundle; the server validates and names each field.
export const sendServiceRequest = (source: RecordSource, input: ServiceRequestInput) =>
  api<ServiceRequestCreatedDto>(serviceRequestPath(source), { method: 'POST', body: input });

export const useSendServiceRequest = (source: RecordSource) => useMutation({ mutationFn: (input: ServiceRequestInput) => sendServiceRequest(source, input) });
