/**
 * Field limits of a service request, without zod, so the homeowner's form can set maxLength and stay small.
 * shared/schemas/service-requests.ts enforces the same numbers on the server.
 */
export const SERVICE_REQUEST_LIMITS = {
  contactName: 120,
  contactPhone: 40,
  contactEmail: 254,
  preferredTimes: 300,
  message: 2000,
} as const;

/** Requests one share link may send in a day: enough for a family, too few to flood the office. */
export const SHARE_LINK_REQUESTS_PER_DAY = 5;

export const NAME_NEEDED_MESSAGE = 'Your name is required.';
export const CONTACT_NEEDED_MESSAGE = 'Give a phone number or an e-mail address, so the office can reach you.';
