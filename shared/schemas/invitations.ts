/**
 * Invitations by e-mail with a one-time sign-in link: team members (technician, manager) and homeowners (linked to a customer).
 */
export const INVITATION_KINDS = ['member', 'homeowner'] as const;
export type InvitationKind = (typeof INVITATION_KINDS)[number];
