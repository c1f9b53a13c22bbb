import type { Mail } from '../../lib/mailer';
import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import { ROLE_LABELS, type MemberRole } from '../../../shared/schemas/roles';
import { SIGN_IN_LINK_HOURS, type InvitationKind } from '../../../shared/schemas/invitations';

export type InvitationMailFacts = {
  companyId: string;
  kind: InvitationKind;
  role: MemberRole | null;
  companyName: string;
  invitedByName: string | null;
  expiresAt: Date;
};

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const longDate = (d: Date) => d.toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', timeZone: 'UTC' });

/** Paragraphs of plain words around one button-like link, as text and as HTML. */
function compose(to: string, subject: string, before: string[], linkLabel: string, url: string, after: string[]): Mail {
  const text = [...before, `${linkLabel}:\n${url}`, ...after].join('\n\n');
  const para = (p: string) => `<p style="margin:0 0 16px">${escapeHtml(p)}</p>`;
  const html = [
    '<div style="font-family:sans-serif;font-size:16px;line-height:1.5;color:#1f2328;max-width:560px">',
    ...before.map(para),
    `<p style="margin:0 0 16px"><a href="${escapeHtml(url)}" style="display:inline-block;padding:12px 20px;background:#2b2f33;color:#ffffff;text-decoration:none;border-radius:6px;font-weight:bold">${escapeHtml(linkLabel)}</a></p>`,
    para(`If the button does not work, copy this address into your browser: ${url}`),
    ...after.map(para),
    '</div>',
  ].join('\n');
  return { to, subject, text, html };
}

const linkNote = `The link signs you in once and works for ${SIGN_IN_LINK_HOURS} hours.`;

/** Marked with the company, so the development outbox shows it to that company. */
export function invitationMail(to: string, url: string, facts: InvitationMailFacts): Mail {
  return { ...invitationMailBody(to, url, facts), headers: { [COMPANY_MAIL_HEADER]: facts.companyId } };
}

function invitationMailBody(to: string, url: string, facts: InvitationMailFacts): Mail {
  const from = facts.invitedByName ? `${facts.invitedByName} at ${facts.companyName}` : facts.companyName;
  const lapse = `If it has stopped working, open it anyway and ask for a new one: the invitation stays open until ${longDate(facts.expiresAt)}.`;
  const ignore = 'If you were not expecting this, you can ignore this e-mail; nothing happens unless you open the link.';
  if (facts.kind === 'member') {
    const role = ROLE_LABELS[facts.role ?? 'technician'].toLowerCase();
    return compose(
      to,
      `${facts.companyName} invited you to join their team on Lifeplate`,
      [`${from} invited you to join their team on Lifeplate as a ${role}.`, 'Lifeplate keeps the life record of every boiler the company looks after: visits, parts swapped, readings and what is due next.'],
      'Join the team',
      url,
      [`${linkNote} ${lapse}`, ignore],
    );
  }
  return compose(
    to,
    `See your boiler's record from ${facts.companyName}`,
    [
      `${facts.companyName} keeps a record of the heating equipment they look after for you: each service visit, the parts they replaced, and what is due next.`,
      'Open the link below to see it, in plain words, whenever you like. No password is needed.',
    ],
    'See my record',
    url,
    [`${linkNote} ${lapse}`, ignore],
  );
}

export function signInMail(to: string, url: string): Mail {
  return compose(
    to,
    'Your Lifeplate sign-in link',
    ['Someone asked for a link to sign in to Lifeplate with this address. We hope it was you.'],
    'Sign in',
    url,
    [linkNote, 'If you did not ask for it, ignore this e-mail: nobody can sign in without the link.'],
  );
}
