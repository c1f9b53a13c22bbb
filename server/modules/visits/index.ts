// The public face of the visits module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { keyReadings, resultsToStore } from './visit-results';
export type { VisitRow } from './visits.repository';
export { visitsService } from './visits.service';

import { visitsRepository } from './visits.repository';

export const findVisit = (...args: Parameters<typeof visitsRepository.findVisit>) => visitsRepository.findVisit(...args);
export const visitUserNames = (...args: Parameters<typeof visitsRepository.userNames>) => visitsRepository.userNames(...args);
export const swapsOfVisit = (...args: Parameters<typeof visitsRepository.swapsOfVisit>) => visitsRepository.swapsOfVisit(...args);
export const amendmentsOfVisit = (...args: Parameters<typeof visitsRepository.amendmentsOfVisit>) => visitsRepository.amendmentsOfVisit(...args);
