// The public face of the catalog module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { seedCompanyCatalog } from './seed-catalog';

import { catalogRepository } from './catalog.repository';

export const catalogLabels = (...args: Parameters<typeof catalogRepository.labels>) => catalogRepository.labels(...args);
