import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RadiationSurveyDto, RadiationSurveyInput } from '@shared/schemas/radiation-surveys';
import { radiationSurveyKeys } from './keys';

export const createSurvey = ({ applianceId, survey }: { applianceId: string; survey: RadiationSurveyInput }) =>
  api<RadiationSurveyDto>(`/appliances/${encodeURIComponent(applianceId)}/radiation-surveys`, { method: 'POST', body: survey });

export function useCreateSurvey(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (survey: RadiationSurveyInput) => createSurvey({ applianceId, survey }),
    onSuccess: (survey) => {
      qc.setQueryData(radiationSurveyKeys.latest(applianceId), { survey });
      void qc.invalidateQueries({ queryKey: radiationSurveyKeys.all(applianceId) });
    },
  });
}
