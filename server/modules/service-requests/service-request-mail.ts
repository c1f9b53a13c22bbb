import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import type { Mail } from '../../lib/mailer';
import { LABELS } from '../../../shared/schemas/enums';
import type { ServiceRequestVia } from '../../../shared/schemas/service-requests';

export type RequestForMail = {
  id: string;
  companyId: string;
  via: ServiceRequestVia;
  contactName: string;
  contactPhone: string | null;
  contactEmail: string | null;
  preferredTimes: string | null;
  message: string | null;
};
export type ApplianceForMail = {
  kind: keyof typeof LABELS.applianceKind;
  fuel: keyof typeof LABELS.fuel;
  location: string | null;
  street: string;
  town: string;
  customerName: string | null;
};

const VIA_WORDS: Record<ServiceRequestVia, string> = {
  share_link: 'the share link for this appliance (no sign-in)',
  homeowner_account: 'the homeowner’s own sign-in',
  booking_reply: 'the “this time does not suit me” link in a booking e-mail',
};

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export const serviceRequestLink = (baseUrl: string, id: string) => `${baseUrl}/service-requests?request=${id}`;

/** The office's e-mail about one request: the same facts as text and as HTML, every typed value escaped. */
export function serviceRequestMail(baseUrl: string, request: RequestForMail, appliance: ApplianceForMail): Omit<Mail, 'to'> {
  const address = `${appliance.street}, ${appliance.town}`;
  const what = `${LABELS.applianceKind[appliance.kind]}, ${LABELS.fuel[appliance.fuel].toLowerCase()}${appliance.location ? ` (${appliance.location})` : ''}`;
  const link = serviceRequestLink(baseUrl, request.id);
  const rows: [string, string | null][] = [
    ['Name', request.contactName],
    ['Phone', request.contactPhone],
    ['E-mail', request.contactEmail],
    ['Preferred times', request.preferredTimes],
    ['Appliance', what],
    ['Address', address],
    ['Customer on file', appliance.customerName],
    ['Sent through', VIA_WORDS[request.via]],
  ];
  const given = rows.filter((r): r is [string, string] => Boolean(r[1]));

  const text = [
    'A homeowner asked to book a service visit.',
    '',
    ...given.map(([k, v]) => `${k}: ${v}`),
    '',
    request.message ? `Message:\n${request.message}\n` : 'No message.\n',
    `Open it in the service requests list: ${link}`,
    request.contactEmail ? 'Replying to this e-mail reaches the homeowner.' : '',
  ]
    .filter((line, i, all) => line !== '' || all[i - 1] !== '')
    .join('\n');

  const html = [
    '<p>A homeowner asked to book a service visit.</p>',
    '<table cellpadding="4" style="border-collapse:collapse">',
    ...given.map(([k, v]) => `<tr><th align="left" valign="top">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`),
    '</table>',
    request.message ? `<p><strong>Message</strong></p><p style="white-space:pre-wrap">${escapeHtml(request.message)}</p>` : '<p>No message.</p>',
    `<p><a href="${escapeHtml(link)}">Open it in the service requests list</a></p>`,
    request.contactEmail ? '<p>Replying to this e-mail reaches the homeowner.</p>' : '',
  ].join('\n');

  return {
    subject: `Service request: ${address}`,
    text,
    html,
    // The address alone: it passed the e-mail check, while a typed name could carry characters a header must not.
    headers: { [COMPANY_MAIL_HEADER]: request.companyId, ...(request.contactEmail ? { 'Reply-To': request.contactEmail } : {}) },
  };
}
