import { z } from 'zod';
import { nonEmptyPatch, requiredText, storableText } from './common';
import { MEMBER_ROLES } from './roles';
import { bookingMinutesSetting, type BookingMinutesSetting } from './bookings';

/** The company's "due soon" window: due dates from today through this many days ahead read "Due soon". */
export const DUE_SOON_DAYS_DEFAULT = 60;
export const DUE_SOON_DAYS_MIN = 7;
export const DUE_SOON_DAYS_MAX = 180;

const timeZones = new Set(Intl.supportedValuesOf('timeZone'));

export const companySettingsInput = nonEmptyPatch(
  z.object({
    name: requiredText('Company name', 120).optional(),
    phone: requiredText('Phone', 40).optional(),
    timeZone: storableText()
      .refine((tz) => timeZones.has(tz) || tz === 'UTC', 'Pick a time zone from the list, e.g. America/New_York.')
      .optional(),
    underFiringTolerancePct: z
      .number('Give a percentage.')
      .int('Use a whole percentage.')
      .min(1, 'At least 1 %.')
      .max(50, 'At most 50 %.')
      .nullable()
      .optional(),
    dueSoonDays: z
      .number('Give a number of days.')
      .int('Use whole days.')
      .min(DUE_SOON_DAYS_MIN, `At least ${DUE_SOON_DAYS_MIN} days.`)
      .max(DUE_SOON_DAYS_MAX, `At most ${DUE_SOON_DAYS_MAX} days.`)
      .optional(),
    /** Window lengths by appliance kind; the kinds named replace the stored ones, the rest stay. */
    bookingMinutes: z
      .strictObject(bookingMinutesSetting.partial().shape, {
        error: (iss) => (iss.code === 'unrecognized_keys' ? 'Not an appliance kind: window lengths are set per kind (steam boiler, water heater…).' : undefined),
      })
      .optional(),
  }),
);
export type CompanySettingsInput = z.infer<typeof companySettingsInput>;

export const memberRoleInput = z.object({ role: z.enum(MEMBER_ROLES, 'Choose owner, manager or technician.') });

export type CompanyDto = {
  id: string;
  name: string;
  phone: string;
  timeZone: string;
  today: string;
  underFiringTolerancePct: number | null;
  /** "Due soon" covers due dates from today through this many days ahead. */
  dueSoonDays: number;
  /** Every kind, the company's own minutes over the defaults. */
  bookingMinutes: BookingMinutesSetting;
};
export type MemberDto = {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: (typeof MEMBER_ROLES)[number];
  active: boolean;
};
