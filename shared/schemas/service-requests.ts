/**
 * A homeowner's request to book a service visit, from the share page or the signed-in homeowner view.
 *
 *   POST  /share/:token/service-requests              ServiceRequestCreatedDto  public (404 unknown, 410 expired or revoked, 429 past the daily limit)
 *   POST  /homeowner/appliances/:id/service-requests  ServiceRequestCreatedDto  homeowner (own appliances only, else 404)
 *   GET   /service-requests                           ServiceRequestPage        records:read  (?status, after, limit; newest first)
 *   PATCH /service-requests/:id                       ServiceRequestDto         records:write (status scheduled | closed)
 *
 * The office hears by e-mail (owners and managers); a failed e-mail never loses the request, it stays in the list.
 */
import type { MailDelivery } from './mail';
import { z } from 'zod';
import { optionalText, storableText } from './common';
import { CONTACT_NEEDED_MESSAGE, NAME_NEEDED_MESSAGE, SERVICE_REQUEST_LIMITS as MAX } from './service-request-limits';

export const SERVICE_REQUEST_VIAS = ['share_link', 'homeowner_account', 'booking_reply'] as const;
export type ServiceRequestVia = (typeof SERVICE_REQUEST_VIAS)[number];
export const SERVICE_REQUEST_STATUSES = ['new', 'scheduled', 'closed'] as const;
export type ServiceRequestStatus = (typeof SERVICE_REQUEST_STATUSES)[number];
export const SERVICE_REQUEST_STATUS_LABELS: Record<ServiceRequestStatus, string> = { new: 'New', scheduled: 'Scheduled', closed: 'Closed' };

const PHONE_CHARS = /^[0-9+().\-\s/xXet]*$/;
const phone = optionalText(MAX.contactPhone).refine(
  (v) => !v || (PHONE_CHARS.test(v) && (v.match(/\d/g)?.length ?? 0) >= 7),
  'Give a phone number with at least 7 digits, like 555-0142.',
);
const email = optionalText(MAX.contactEmail).refine((v) => !v || z.email().safeParse(v).success, 'Check the e-mail address, like name@example.com.');

export const serviceRequestInput = z
  .object({
    contactName: storableText(NAME_NEEDED_MESSAGE).trim().min(1, NAME_NEEDED_MESSAGE).max(MAX.contactName, `At most ${MAX.contactName} characters.`),
    contactPhone: phone,
    contactEmail: email,
    preferredTimes: optionalText(MAX.preferredTimes),
    message: optionalText(MAX.message),
  })
  .refine((v) => Boolean(v.contactPhone || v.contactEmail), {
    path: ['contactPhone'],
    message: CONTACT_NEEDED_MESSAGE,
    // Checked even when another field is wrong, so every missing piece is named at once.
    when: (payload) => {
      const v = payload.value as Record<string, unknown> | undefined;
      return Boolean(v) && typeof v === 'object';
    },
  });
export type ServiceRequestInput = z.input<typeof serviceRequestInput>;

export type ServiceRequestCreatedDto = { id: string; company: { name: string; phone: string } };

export const serviceRequestListQuery = z.object({
  status: z.enum(SERVICE_REQUEST_STATUSES, 'Choose new, scheduled or closed.').optional(),
  after: storableText().max(300).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export type ServiceRequestListQuery = z.input<typeof serviceRequestListQuery>;

export const serviceRequestPatch = z.object({ status: z.enum(['scheduled', 'closed'], 'Choose scheduled or closed.') });
export type ServiceRequestPatch = z.input<typeof serviceRequestPatch>;

export type ServiceRequestDto = {
  id: string;
  status: ServiceRequestStatus;
  via: ServiceRequestVia;
  createdAt: string;
  contactName: string;
  contactPhone: string | null;
  contactEmail: string | null;
  preferredTimes: string | null;
  message: string | null;
  officeNotifiedAt: string | null;
  /** The e-mail to the office: `queued` while the mail server is away; null when there was nobody to tell. */
  officeMail: MailDelivery | null;
  handledAt: string | null;
  handledByName: string | null;
  customerName: string | null;
  /** The booking made from this request, once there is one. */
  booking: { id: string; startsAt: string } | null;
  appliance: { id: string; title: string; address: string };
};
export type ServiceRequestPage = { items: ServiceRequestDto[]; nextCursor: string | null; newCount: number };
