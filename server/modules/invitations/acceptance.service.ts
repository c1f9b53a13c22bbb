import type { AppContext } from '../../context';
import { conflict, forbidden, gone, notFound, validationFailed } from '../../lib/http-error';
import type { AcceptInvitationInput, InviteeInvitationDto } from '../../../shared/schemas/invitations';
import { recordAudit } from '../../core/audit-log';
import { invitationsRepository as repo } from './invitations.repository';
import { invitationStatus } from './invitation-dto';

type SignedIn = { userId: string; email: string };
type Found = NonNullable<Awaited<ReturnType<typeof repo.findForInvitee>>>;

const GONE: Record<'expired' | 'revoked' | 'accepted', string> = {
  expired: 'This invitation has expired. Ask the company to send a new one.',
  revoked: 'This invitation was withdrawn by the company.',
  accepted: 'This invitation has already been accepted.',
};

/** The invited person's side: see the invitation meant for their address, and accept it. */
export function acceptanceService(ctx: AppContext) {
  /** Someone else's invitation answers exactly like one that does not exist. */
  async function findOwn(who: SignedIn, id: string) {
    const found = await repo.findForInvitee(ctx.db, id, who.email);
    if (!found) throw notFound('Invitation');
    return found;
  }

  async function toDto({ invitation, companyName }: Found, userId: string): Promise<InviteeInvitationDto> {
    const user = await repo.findUser(ctx.db, userId);
    return {
      id: invitation.id,
      kind: invitation.kind,
      role: invitation.role,
      companyName,
      status: invitationStatus(invitation),
      needsName: invitation.kind === 'member' && !user?.name.trim(),
    };
  }

  return {
    async get(who: SignedIn, id: string) {
      return toDto(await findOwn(who, id), who.userId);
    },

    async accept(who: SignedIn, id: string, input: AcceptInvitationInput): Promise<InviteeInvitationDto> {
      const found = await findOwn(who, id);
      const { invitation } = found;
      const status = invitationStatus(invitation);
      if (status !== 'open') throw gone(GONE[status]);
      const user = (await repo.findUser(ctx.db, who.userId))!;
      // A password account made with someone else's address has not proved it; the e-mailed link does.
      if (!user.emailVerified) throw forbidden('Open the sign-in link from the invitation e-mail first: it proves the address is yours.');
      const membership = await repo.findMembership(ctx.db, user.id);
      if (membership) {
        throw conflict(membership.companyId === invitation.companyId ? 'You are already on this team.' : 'You already belong to another company\'s team on Lifeplate.');
      }
      if (invitation.kind === 'member' && !input.name && !user.name.trim()) throw validationFailed({ name: ['Enter your name, as your team will see it.'] });
      if (invitation.kind === 'homeowner') {
        const elsewhere = (await repo.homeownerCompanies(ctx.db, user.id)).filter((c) => c !== invitation.companyId);
        if (elsewhere.length) throw conflict('This address already sees records from another company. Ask for the invitation to go to a different address.');
      }

      await ctx.db.transaction(async (tx) => {
        const accepted = await repo.markAccepted(tx, invitation.id, user.id);
        if (!accepted) throw gone(GONE.accepted);
        if (invitation.kind === 'member') {
          await repo.insertMembership(tx, { companyId: invitation.companyId, userId: user.id, role: invitation.role! });
        } else {
          await repo.linkHomeowner(tx, { companyId: invitation.companyId, userId: user.id, customerId: invitation.customerId! });
        }
        if (input.name) await repo.setUserName(tx, user.id, input.name);
        await recordAudit(tx, {
          companyId: invitation.companyId,
          actorId: user.id,
          action: 'accept',
          entity: 'invitation',
          entityId: invitation.id,
          changes: { kind: invitation.kind, role: invitation.role, customerId: invitation.customerId },
        });
        found.invitation = accepted;
      });
      return toDto(found, user.id);
    },
  };
}
