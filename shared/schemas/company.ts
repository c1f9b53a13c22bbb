import { z } from 'zod';
import { nonEmptyPatch, requiredText, storableText } from './common';
import { MEMBER_ROLES } from './roles';
import { bookingMinutesSetting, type BookingMinutesSetting } from './bookings';

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
