/**
 * Invitations by e-mail with a one-time sign-in link: team members (technician, manager) and homeowners (linked to a customer).
 * Routes (all under /api):
 *
 *   POST /team/invitations                     InvitationDto          team:manage   (201; sends or queues the e-mail, see `mail`; 409 if the address is already on a team)
 *   GET  /team/invitations                     InvitationDto[]        team:manage   (member invitations neither accepted nor revoked, newest first)
 *   POST /team/invitations/:id/revoke          InvitationDto          team:manage
 *   POST /team/invitations/:id/resend          InvitationDto          team:manage   (a fresh link; renews the 7 days)
 *   POST /customers/:id/homeowner-invitation   InvitationDto          share:create  (201; e-mail defaults to the customer's)
 *   GET  /invitations/:id                      InviteeInvitationDto   signed-in     (only for the invited address, else 404)
 *   POST /invitations/:id/accept               InviteeInvitationDto   signed-in     (404 someone else's, 410 expired/revoked/accepted)
 *
 * better-auth's magic-link endpoints, answered the same whether or not a link was sent:
 *   POST /auth/sign-in/magic-link {email, callbackURL}   sends only to an open invitation's address or an existing member/homeowner
 *   GET  /auth/magic-link/verify?token=&callbackURL=     signs in (a new user only for an invited address) and redirects
 */
import { z } from 'zod';
import type { MailDelivery } from './mail';
import { storableText } from './common';
import { MEMBER_ROLES, type MemberRole } from './roles';

export const INVITATION_KINDS = ['member', 'homeowner'] as const;
export type InvitationKind = (typeof INVITATION_KINDS)[number];

export const INVITATION_STATUSES = ['open', 'expired', 'accepted', 'revoked'] as const;
export type InvitationStatus = (typeof INVITATION_STATUSES)[number];

/** How long an invitation stays open. */
export const INVITATION_DAYS = 7;
/** How long one e-mailed sign-in link works: long enough for an e-mail read the next morning. */
export const SIGN_IN_LINK_HOURS = 24;

export const welcomePath = (invitationId: string) => `/welcome/${invitationId}`;

const emailAddress = storableText('Enter an e-mail address.')
  .trim()
  .toLowerCase()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'At most 254 characters.')
  .pipe(z.email('Enter a valid e-mail address, like name@example.com.'));

export const memberInvitationInput = z.object({
  email: emailAddress,
  role: z.enum(MEMBER_ROLES, 'Choose technician or service manager.'),
});
export type MemberInvitationInput = z.infer<typeof memberInvitationInput>;

export const homeownerInvitationInput = z.object({
  /** Left out or blank: the customer's own e-mail. */
  email: z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), emailAddress.optional()),
});
export type HomeownerInvitationInput = z.infer<typeof homeownerInvitationInput>;

export const acceptInvitationInput = z.object({
  /** Asked of new team members, whose account has no name yet. */
  name: z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? undefined : v),
    storableText('Enter your name.').trim().max(120, 'At most 120 characters.').optional(),
  ),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInput>;

/** The office's view of an invitation. */
export type InvitationDto = {
  id: string;
  kind: InvitationKind;
  email: string;
  role: MemberRole | null;
  customerId: string | null;
  status: InvitationStatus;
  invitedByName: string | null;
  createdAt: string;
  expiresAt: string;
  /** The latest invitation e-mail: `queued` until the mail server has taken it (null if none was written). */
  mail: MailDelivery | null;
};

/** What the invited person sees on the welcome page. */
export type InviteeInvitationDto = {
  id: string;
  kind: InvitationKind;
  role: MemberRole | null;
  companyName: string;
  status: InvitationStatus;
  /** A team member's account has no name yet: the welcome page asks for it. */
  needsName: boolean;
};
