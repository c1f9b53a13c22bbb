/**
 * E-mail goes out through a durable queue (the outgoing_mail table): tried at once, and retried with backoff by a
 * scheduled job while the mail server is away. Screens show `queued` until the server has taken the message.
 */
export const MAIL_KINDS = ['invitation', 'sign_in', 'service_request', 'visit_report', 'booking_notice'] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** `sending` is a claimed try in progress; `cancelled` is a message a newer one replaced (a fresh invitation link). */
export const MAIL_STATUSES = ['queued', 'sending', 'sent', 'failed', 'cancelled'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

/** What the office is told about one e-mail: waiting for the mail server, taken by it, or given up on. */
export type MailDelivery = 'queued' | 'sent' | 'failed';

export const mailDelivery = (status: MailStatus): MailDelivery =>
  status === 'sent' ? 'sent' : status === 'queued' || status === 'sending' ? 'queued' : 'failed';
