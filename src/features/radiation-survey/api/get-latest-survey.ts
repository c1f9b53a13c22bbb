import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LatestRadiationSurveyDto } from '@shared/schemas/radiation-surveys';
import { radiationSurveyKeys } from './keys';

export const getLatestSurvey = (applianceId: string) => api<LatestRadiationSurveyDto>(`/appliances/${encodeURIComponent(applianceId)}/radiation-surveys/latest`);
export const latestSurveyQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: radiationSurveyKeys.latest(applianceId), queryFn: () => getLatestSurvey(applianceId) });
export const useLatestSurvey = (applianceId: string) => useQuery(latestSurveyQueryOptions(applianceId));
