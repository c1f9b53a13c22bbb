import { formatVisitWindow } from '../../../shared/format/dates';
import type { BookingNoticeKind } from '../../../shared/schemas/booking-notices';

export type BookingNoticeWords = {
  kind: BookingNoticeKind;
  customerName: string;
  company: { name: string; phone: string };
  address: string;
  startsAt: Date;
  endsAt: Date;
  timeZone: string;
  /** The technician's first name only: the homeowner needs to know who knocks, not more. */
  technicianFirstName: string;
  /** "your boiler and water heater" */
  what: string;
  /** The previous window, for a move. */
  before?: { startsAt: Date; endsAt: Date } | null;
  /** Whether any appliance burns gas (natural gas or propane): the gas line is shown only then. */
  burnsGas: boolean;
  replyUrl: string | null;
  unsubscribeUrl: string;
};

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The usual cautions, short and deferring to local practice (common practice). */
export const GAS_SAFETY_LINE =
  'If you smell gas, leave the house and call your gas utility’s emergency number from outside, or follow your local emergency practice. Do not wait for our visit.';
export const CO_SAFETY_LINE = 'If a carbon monoxide alarm sounds, get everyone into fresh air and call for help from outside.';
const safetyLines = (w: BookingNoticeWords) => [...(w.burnsGas ? [GAS_SAFETY_LINE] : []), CO_SAFETY_LINE];

const PREPARE = [
  'Clear a path to the boiler room or wherever the equipment stands, and leave about 3 feet around it free.',
  'Please keep pets in another room while we work.',
  'If the equipment has been running, its surfaces and pipes may be hot; there is no need to switch it off for us.',
];

export function bookingNoticeSubject(w: BookingNoticeWords): string {
  const day = formatVisitWindow(w.startsAt, w.endsAt, w.timeZone);
  switch (w.kind) {
    case 'booked':
      return `Your visit is booked: ${day}`;
    case 'moved':
      return `Your visit has a new time: ${day}`;
    case 'cancelled':
      return `Your visit on ${day.split(',').slice(0, 3).join(',')} is cancelled`;
    case 'day_before':
      return `See you tomorrow: ${day}`;
  }
}

function opening(w: BookingNoticeWords): string[] {
  const window = formatVisitWindow(w.startsAt, w.endsAt, w.timeZone);
  switch (w.kind) {
    case 'booked':
      return [`Thank you for booking with ${w.company.name}. ${w.technicianFirstName} will come to look after ${w.what} at ${w.address}:`, window];
    case 'moved':
      return [
        `We have moved your visit for ${w.what} at ${w.address}. The new time is:`,
        window,
        ...(w.before ? [`(It was ${formatVisitWindow(w.before.startsAt, w.before.endsAt, w.timeZone)}.) ${w.technicianFirstName} will come.`] : [`${w.technicianFirstName} will come.`]),
      ];
    case 'cancelled':
      return [
        `Your visit for ${w.what} at ${w.address} on ${window} is cancelled. We are sorry for any trouble.`,
        `To book another time, reply to this e-mail or call us on ${w.company.phone}.`,
      ];
    case 'day_before':
      return [`A friendly reminder: ${w.technicianFirstName} from ${w.company.name} comes tomorrow to look after ${w.what} at ${w.address}:`, window];
  }
}

function lines(w: BookingNoticeWords): string[] {
  const live = w.kind !== 'cancelled';
  return [
    `Hello ${w.customerName},`,
    '',
    ...opening(w),
    '',
    ...(live
      ? [
          'To get ready:',
          ...PREPARE.map((s) => `- ${s}`),
          '',
          'The calendar invitation attached puts the visit in your calendar.',
          ...(w.replyUrl ? ['', 'Does this time not suit you? Tell us why and when would be better, and the office will call you:', w.replyUrl] : []),
          '',
        ]
      : ['The attached calendar file takes the visit out of your calendar.', '']),
    ...safetyLines(w),
    '',
    `Thank you, ${w.company.name} (${w.company.phone})`,
    '',
    `You get this e-mail because ${w.company.name} services your heating equipment. To stop e-mails from us, open: ${w.unsubscribeUrl}`,
  ];
}

export const bookingNoticeText = (w: BookingNoticeWords) => lines(w).join('\n') + '\n';

export function bookingNoticeHtml(w: BookingNoticeWords): string {
  const e = escapeHtml;
  const live = w.kind !== 'cancelled';
  const [first, ...rest] = opening(w);
  return [
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${e(bookingNoticeSubject(w))}</title></head>`,
    '<body style="font-family: sans-serif; line-height: 1.5; color: #23272B;">',
    `<p>Hello ${e(w.customerName)},</p>`,
    `<p>${e(first)}</p>`,
    ...rest.map((l, i) => (i === 0 && live ? `<p><strong>${e(l)}</strong></p>` : `<p>${e(l)}</p>`)),
    ...(live
      ? [
          '<p>To get ready:</p>',
          `<ul>${PREPARE.map((s) => `<li>${e(s)}</li>`).join('')}</ul>`,
          '<p>The calendar invitation attached puts the visit in your calendar.</p>',
          ...(w.replyUrl ? [`<p>Does this time not suit you? <a href="${e(w.replyUrl)}">Tell us why and when would be better</a>, and the office will call you.</p>`] : []),
        ]
      : ['<p>The attached calendar file takes the visit out of your calendar.</p>']),
    `<p><strong>${safetyLines(w).map(e).join('<br>')}</strong></p>`,
    `<p>Thank you,<br>${e(w.company.name)} (${e(w.company.phone)})</p>`,
    `<p style="font-size: 0.9em;">You get this e-mail because ${e(w.company.name)} services your heating equipment. <a href="${e(w.unsubscribeUrl)}">Stop e-mails from us</a>.</p>`,
    '</body></html>',
  ].join('\n');
}
