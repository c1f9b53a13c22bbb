// The public face of the share-links module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { hashShareToken, resolveShareToken } from './resolve-share-token';
export { shareLinksService } from './share-links.service';

import { shareLinksRepository } from './share-links.repository';

export const insertShareLink = (...args: Parameters<typeof shareLinksRepository.insert>) => shareLinksRepository.insert(...args);
