import type { AppContext } from '../../context';
import { HttpError, badRequest, conflict, forbidden, gone, notFound } from '../../lib/http-error';
import { canManageMemberRole } from '../../../shared/policy';
import type { Principal } from '../../../shared/schemas/roles';
import {
  INVITATION_DAYS,
  welcomePath,
  type HomeownerInvitationInput,
  type InvitationDto,
  type MemberInvitationInput,
} from '../../../shared/schemas/invitations';
import { recordAudit } from '../../core/audit-log';
import { latestMailStatuses } from '../mail';
import { invitationsRepository as repo, type InvitationRow } from './invitations.repository';
import { invitationStatus, toInvitationDto } from './invitation-dto';
import { findCustomer } from '../../core/tenant-finders';

type Member = Extract<Principal, { kind: 'member' }>;

const expiryFromNow = () => new Date(Date.now() + INVITATION_DAYS * 86_400_000);

/** The office's side: invite team members and homeowners, list, revoke and resend. */
export function invitationsService(ctx: AppContext) {
  /**
   * The e-mail with a one-time sign-in link whose landing page is the invitation's welcome page. It is queued and tried
   * at once; while the mail server is away it stays queued and is retried (server/modules/mail/). Answers its status.
   */
  async function sendLink(row: InvitationRow) {
    try {
      await ctx.auth.api.signInMagicLink({
        body: { email: row.email, callbackURL: welcomePath(row.id), metadata: { invitationId: row.id } },
        headers: new Headers(),
      });
    } catch (err) {
      ctx.logger.error({ err, invitationId: row.id }, 'invitation mail could not be queued');
      throw new HttpError(502, 'mail_failed', 'The invitation is saved, but its e-mail could not be queued. Try "Send again" in a minute.');
    }
    return (await latestMailStatuses(ctx.db, 'invitation', [row.id])).get(row.id) ?? null;
  }

  /**
   * Someone on another company's team is invited like any other address: answering differently would tell any
   * manager who works where. Their acceptance is refused instead (acceptance.service.ts), to them alone.
   */
  async function findOurMember(companyId: string, email: string) {
    const user = await repo.findUserByEmail(ctx.db, email);
    const membership = user && (await repo.findMembership(ctx.db, user.id));
    return membership?.companyId === companyId ? membership : null;
  }

  async function refuseIfOnOurTeam(companyId: string, email: string) {
    if (!(await findOurMember(companyId, email))) return;
    const message = 'This person is already on your team.';
    throw conflict(message, { email: [message] });
  }

  async function findManageable(actor: Member, id: string) {
    const found = await repo.find(ctx.db, actor.companyId, id);
    if (!found || found.invitation.kind !== 'member') throw notFound('Invitation');
    if (!canManageMemberRole(actor, found.invitation.role!)) throw forbidden('Only an owner can change an invitation to become an owner.');
    return found;
  }

  async function create(actor: Member, values: Omit<Parameters<typeof repo.insert>[1], 'companyId' | 'invitedBy' | 'expiresAt'>) {
    const row = await ctx.db.transaction(async (tx) => {
      const inserted = await repo.insert(tx, { ...values, companyId: actor.companyId, invitedBy: actor.userId, expiresAt: expiryFromNow() });
      await recordAudit(tx, {
        companyId: actor.companyId,
        actorId: actor.userId,
        action: 'invite',
        entity: 'invitation',
        entityId: inserted.id,
        changes: { kind: inserted.kind, email: inserted.email, role: inserted.role, customerId: inserted.customerId },
      });
      return inserted;
    });
    return { row, mail: await sendLink(row) };
  }

  const inviterName = async (actor: Member) => (await repo.findUser(ctx.db, actor.userId))?.name ?? null;

  return {
    async inviteMember(actor: Member, input: MemberInvitationInput): Promise<InvitationDto> {
      if (!canManageMemberRole(actor, input.role, input.role)) {
        throw forbidden('Only an owner can invite an owner.');
      }
      await refuseIfOnOurTeam(actor.companyId, input.email);
      if (await repo.findOpenMemberInvitation(ctx.db, actor.companyId, input.email)) {
        const message = 'An invitation to this address is already open. Use "Send again" in the list below.';
        throw conflict(message, { email: [message] });
      }
      const { row, mail } = await create(actor, { kind: 'member', email: input.email, role: input.role });
      return toInvitationDto(row, await inviterName(actor), mail);
    },

    async listPending(actor: Member): Promise<InvitationDto[]> {
      const rows = await repo.listPendingMembers(ctx.db, actor.companyId);
      const mail = await latestMailStatuses(ctx.db, 'invitation', rows.map((r) => r.invitation.id));
      return rows.map((r) => toInvitationDto(r.invitation, r.invitedByName, mail.get(r.invitation.id)));
    },

    async revoke(actor: Member, id: string): Promise<InvitationDto> {
      const { invitation, invitedByName } = await findManageable(actor, id);
      if (invitation.acceptedAt) throw conflict('This invitation was already accepted. Deactivate the member instead.');
      if (invitation.revokedAt) return toInvitationDto(invitation, invitedByName);
      const row = await ctx.db.transaction(async (tx) => {
        const updated = await repo.update(tx, actor.companyId, id, { revokedAt: new Date() });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'revoke', entity: 'invitation', entityId: id });
        return updated;
      });
      return toInvitationDto(row, invitedByName);
    },

    /** A fresh sign-in link; a lapsed invitation gets another seven days. */
    async resend(actor: Member, id: string): Promise<InvitationDto> {
      const { invitation, invitedByName } = await findManageable(actor, id);
      const status = invitationStatus(invitation);
      if (status === 'accepted' || status === 'revoked') throw gone(`This invitation was ${status}; invite the person again instead.`);
      await refuseIfOnOurTeam(actor.companyId, invitation.email);
      const row = await ctx.db.transaction(async (tx) => {
        const updated = await repo.update(tx, actor.companyId, id, { expiresAt: expiryFromNow() });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'resend', entity: 'invitation', entityId: id });
        return updated;
      });
      return toInvitationDto(row, invitedByName, await sendLink(row));
    },

    async inviteHomeowner(actor: Member, customerId: string, input: HomeownerInvitationInput): Promise<InvitationDto> {
      const customer = await findCustomer(ctx.db, actor.companyId, customerId);
      if (!customer) throw notFound('Customer');
      const email = input.email ?? customer.email?.trim().toLowerCase();
      if (!email) {
        const message = 'This customer has no e-mail address. Type the address to send the invitation to.';
        throw badRequest(message, { email: [message] });
      }
      if (await findOurMember(actor.companyId, email)) {
        const message = 'This address belongs to a member of your team. Use the homeowner\'s own address.';
        throw conflict(message, { email: [message] });
      }
      const { row, mail } = await create(actor, { kind: 'homeowner', email, customerId });
      return toInvitationDto(row, await inviterName(actor), mail);
    },
  };
}
