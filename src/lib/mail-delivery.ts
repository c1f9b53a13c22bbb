import type { MailDelivery } from '@shared/schemas/mail';

/** What the office is told after an invitation: "sent" only once the mail server has taken the message. */
export function invitationMailNotice(mail: MailDelivery | null, to: string): { title: string; text: string } {
  if (mail === 'sent') return { title: 'Invitation sent', text: `An e-mail with a sign-in link is on its way to ${to}.` };
  if (mail === 'queued') {
    return { title: 'Invitation saved, e-mail queued', text: `The mail server did not answer. The e-mail to ${to} goes out by itself as soon as it does.` };
  }
  return { title: 'Invitation saved, e-mail not sent', text: `The e-mail to ${to} could not be sent. Try "Send again" later.` };
}
