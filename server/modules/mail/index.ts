// The public face of the mail module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { createMailQueue } from './mail-queue';
export type { MailQueue } from './mail-queue';

import { outgoingMailRepository } from './outgoing-mail.repository';

export const latestMailStatuses = (...args: Parameters<typeof outgoingMailRepository.latestStatuses>) => outgoingMailRepository.latestStatuses(...args);
