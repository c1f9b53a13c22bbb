import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RadiationSurveySummaryDto } from '@shared/schemas/radiation-surveys';
import { radiationSurveyKeys } from './keys';

export const listSurveys = (applianceId: string) => api<RadiationSurveySummaryDto[]>(`/appliances/${encodeURIComponent(applianceId)}/radiation-surveys`);
export const surveysQueryOptions = (applianceId: string) => queryOptions({ queryKey: radiationSurveyKeys.list(applianceId), queryFn: () => listSurveys(applianceId) });
export const useSurveys = (applianceId: string) => useQuery(surveysQueryOptions(applianceId));
