// The public face of the appliances module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { wholeYearsBetween } from './appliance-age';
export { applianceLabel } from './appliance-label';
export { loadApplianceRecord } from './appliance-record';
export { appliancesService } from './appliances.service';
export { occurredAtForDate } from './occurred-at';

import { appliancesRepository } from './appliances.repository';

export const applianceSummariesForSites = (...args: Parameters<typeof appliancesRepository.summariesForSites>) => appliancesRepository.summariesForSites(...args);
