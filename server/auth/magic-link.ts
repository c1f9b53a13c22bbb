import { z } from 'zod';
import { magicLink } from 'better-auth/plugins';
import type { Logger } from 'pino';
import type { Db } from '../db/client';
import type { MailQueue } from '../modules/mail';
import { findOpenInvitationForMail, hasOpenInvitation, isKnownPerson } from '../modules/invitations';
import { invitationMail, signInMail } from '../modules/invitations';
import { SIGN_IN_LINK_HOURS } from '../../shared/schemas/invitations';

export type MagicLinkDeps = { mail: Pick<MailQueue, 'send'>; logger: Pick<Logger, 'debug' | 'info' | 'warn' | 'error'> };

const SIGN_IN_PATH = '/sign-in/magic-link';
const VERIFY_PATH = '/magic-link/verify';
const requestBody = z.object({ email: z.email() });

/**
 * E-mailed one-time sign-in links. Mail goes only to an address with an open invitation or to someone Lifeplate
 * already knows (the hook below); everyone else gets the same answer and no mail, so the endpoint tells nobody
 * which addresses exist. A link may create an account only while its address still has an open invitation.
 */
export function magicLinkAuth(db: Db, deps: MagicLinkDeps) {
  const mayReceiveLink = async (email: string) => (await hasOpenInvitation(db, email)) || isKnownPerson(db, email);

  /** Queued as the invitation's mail (replacing a link of it still waiting) or as a plain sign-in link. */
  async function queueMail(email: string, url: string, invitationId: unknown) {
    const invited = typeof invitationId === 'string' && z.uuid().safeParse(invitationId).success ? await findOpenInvitationForMail(db, invitationId, email) : null;
    if (!invited) return deps.mail.send(signInMail(email, url), { kind: 'sign_in', companyId: null });
    const { invitation, companyName, invitedByName } = invited;
    const mail = invitationMail(email, url, { companyId: invitation.companyId, kind: invitation.kind, role: invitation.role, companyName, invitedByName, expiresAt: invitation.expiresAt });
    return deps.mail.send(mail, { kind: 'invitation', companyId: invitation.companyId, refId: invitation.id, replacesQueued: true });
  }

  const plugin = magicLink({
    expiresIn: SIGN_IN_LINK_HOURS * 60 * 60,
    storeToken: 'hashed',
    async sendMagicLink({ email, url, metadata }, ctx) {
      const send = () => queueMail(email, url, metadata?.invitationId);
      // From the browser the answer must not wait on the mail, or its timing would tell who may receive one.
      // A server-side call (an invitation being sent) waits, so the office learns whether it went or is queued.
      if (ctx?.request) {
        send().catch((err: unknown) => deps.logger.error({ err }, 'sign-in link mail could not be queued'));
        return;
      }
      await send();
    },
  });

  /** Run from auth.ts's `hooks.before`. */
  const beforeHook = async (ctx: { path?: string; body?: unknown; json: (body: { status: boolean }) => unknown }) => {
    if (ctx.path !== SIGN_IN_PATH) return;
    const parsed = requestBody.safeParse(ctx.body);
    if (!parsed.success) return; // the endpoint itself answers 400
    if (await mayReceiveLink(parsed.data.email)) return;
    return ctx.json({ status: true });
  };

  const databaseHooks = {
    user: {
      create: {
        async before(user: { email: string }, ctx?: { path?: string } | null) {
          if (ctx?.path === VERIFY_PATH && !(await hasOpenInvitation(db, user.email))) return false;
        },
      },
    },
  };

  return { plugin, beforeHook, databaseHooks, paths: { signIn: SIGN_IN_PATH, verify: VERIFY_PATH } };
}
