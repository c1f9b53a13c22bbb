import { applianceKeys } from '@/lib/resources/appliances';

/** Under the appliance's record key, so invalidating the record (or every record) refreshes its surveys too. */
export const radiationSurveyKeys = {
  all: (applianceId: string) => [...applianceKeys.record(applianceId), 'radiation-surveys'] as const,
  latest: (applianceId: string) => [...radiationSurveyKeys.all(applianceId), 'latest'] as const,
  list: (applianceId: string) => [...radiationSurveyKeys.all(applianceId), 'list'] as const,
  history: (applianceId: string) => [...applianceKeys.timeline(applianceId), 'proposal-history'] as const,
};
