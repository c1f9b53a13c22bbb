// The public face of the invitations module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { invitationMail, signInMail } from './invitation-mail';

import { invitationsRepository } from './invitations.repository';

export const findOpenInvitationForMail = (...args: Parameters<typeof invitationsRepository.findOpenForMail>) => invitationsRepository.findOpenForMail(...args);
export const hasOpenInvitation = (...args: Parameters<typeof invitationsRepository.hasOpenInvitation>) => invitationsRepository.hasOpenInvitation(...args);
export const isKnownPerson = (...args: Parameters<typeof invitationsRepository.isKnownPerson>) => invitationsRepository.isKnownPerson(...args);
