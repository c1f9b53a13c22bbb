import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { MakeupWaterDto, MakeupWaterEntryInput } from '@shared/schemas/makeup-water';
import { applianceKeys } from '@/lib/resources/appliances';

export const getMakeupWater = (applianceId: string) => api<MakeupWaterDto>(`/appliances/${applianceId}/makeup-water`);
export const makeupWaterQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: applianceKeys.makeupWater(applianceId), queryFn: () => getMakeupWater(applianceId) });
export const useMakeupWater = (applianceId: string) => useQuery(makeupWaterQueryOptions(applianceId));

export const addMakeupWater = ({ applianceId, entry }: { applianceId: string; entry: MakeupWaterEntryInput }) =>
  api<MakeupWaterDto>(`/appliances/${applianceId}/makeup-water`, { method: 'POST', body: entry });

export function useAddMakeupWater(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (entry: MakeupWaterEntryInput) => addMakeupWater({ applianceId, entry }),
    onSuccess: (data) => {
      qc.setQueryData(makeupWaterQueryOptions(applianceId).queryKey, data);
      void qc.invalidateQueries({ queryKey: applianceKeys.timeline(applianceId) });
    },
  });
}
