import type { InvitationDto, InvitationStatus } from '../../../shared/schemas/invitations';
import { mailDelivery, type MailStatus } from '../../../shared/schemas/mail';
import type { InvitationRow } from './invitations.repository';

export function invitationStatus(r: InvitationRow, now = new Date()): InvitationStatus {
  if (r.acceptedAt) return 'accepted';
  if (r.revokedAt) return 'revoked';
  return r.expiresAt <= now ? 'expired' : 'open';
}

export const toInvitationDto = (r: InvitationRow, invitedByName: string | null, mail?: MailStatus | null): InvitationDto => ({
  id: r.id,
  kind: r.kind,
  email: r.email,
  role: r.role,
  customerId: r.customerId,
  status: invitationStatus(r),
  invitedByName,
  createdAt: r.createdAt.toISOString(),
  expiresAt: r.expiresAt.toISOString(),
  mail: mail ? mailDelivery(mail) : null,
});
