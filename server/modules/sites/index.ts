// The public face of the sites module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).

import { sitesRepository } from './sites.repository';

export const findSiteDto = (...args: Parameters<typeof sitesRepository.find>) => sitesRepository.find(...args);
export const sitesOfCustomers = (...args: Parameters<typeof sitesRepository.listForCustomers>) => sitesRepository.listForCustomers(...args);
