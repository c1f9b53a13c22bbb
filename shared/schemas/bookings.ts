/**
 * Bookings: a visit planned for a date, a time window and a technician, at one site (one or more appliances).
 * A round is one technician's bookings for one day; the week board is every technician's week; the load list is
 * the parts a round needs. Times are the company's wall-clock times ("2026-12-08T09:00"), turned into instants in
 * its time zone on the server, so a booking at 09:00 stays at 09:00 across a change of clocks.
 *
 *   POST  /bookings                          BookingDto      bookings:book (technicians: only themselves)
 *   GET   /bookings?from&to&technicianId     BookingListDto  bookings:read (the week board; from/to are dates, at most 31 days)
 *   GET   /bookings/:id                      BookingDto      bookings:read
 *   POST  /bookings/:id/move                 BookingDto      bookings:manage (a new window, technician, note)
 *   POST  /bookings/:id/confirm              BookingDto      bookings:manage
 *   POST  /bookings/:id/cancel               BookingDto      bookings:manage (reason)
 *   POST  /bookings/:id/no-access            BookingDto      bookings:book (the booked technician, or the office; reason)
 *   GET   /rounds?date&technicianId          RoundDto        bookings:read (technicianId defaults to the caller)
 *   GET   /load-list?from&to&technicianId    LoadListDto     bookings:read
 *   GET   /bookings/unbooked?from&to&…       UnbookedPageDto bookings:plan (office: due by `to`, not yet booked; paged)
 *
 * A technician cannot be in two live bookings at once: the database refuses it (exclusion constraint) and the API
 * answers 409 `booking_clash` naming the other booking.
 */
import { z } from 'zod';
import { isoDate, optionalText, requiredText, storableText } from './common';
import { APPLIANCE_KINDS, FUELS, type ApplianceKind, type Fuel, type VisitOutcome } from './enums';

export const BOOKING_STATUSES = ['booked', 'confirmed', 'done', 'cancelled', 'no_access'] as const;
export type BookingStatus = (typeof BOOKING_STATUSES)[number];
/** Statuses that hold the technician's time; the others free it. */
export const LIVE_BOOKING_STATUSES = ['booked', 'confirmed', 'done'] as const satisfies readonly BookingStatus[];
export const BOOKING_STATUS_LABELS: Record<BookingStatus, string> = {
  booked: 'Booked',
  confirmed: 'Confirmed',
  done: 'Done',
  cancelled: 'Cancelled',
  no_access: 'No access',
};

export const BOOKING_SOURCES = ['due_list', 'annual_service', 'service_request', 'reminder_reply', 'phone', 'life_record', 'follow_up'] as const;
export type BookingSource = (typeof BOOKING_SOURCES)[number];
export const BOOKING_SOURCE_LABELS: Record<BookingSource, string> = {
  due_list: 'Due list',
  annual_service: 'Annual-service list',
  service_request: 'Service request',
  reminder_reply: 'Reply to a reminder',
  phone: 'Phone call',
  life_record: 'Life record',
  follow_up: 'Follow-up',
};

export const MAX_BOOKING_APPLIANCES = 20;
export const MAX_BOOKING_MINUTES = 24 * 60;
export const MIN_BOOKING_MINUTES = 15;
/** How far ahead the office may book: a typo in the year should not book 2062. */
export const MAX_BOOKING_DAYS_AHEAD = 400;
export const MAX_BOARD_DAYS = 31;

/** The window a new booking gets by appliance kind until the company changes it (minutes). */
export const DEFAULT_BOOKING_MINUTES: Record<ApplianceKind, number> = {
  steam_boiler: 120, // common practice: a steam tune-up with the cutoff and glass work runs longer than hot water
  hot_water_boiler: 90,
  water_heater: 60,
  furnace: 60,
};

const LOCAL_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/;
/** A wall-clock time in the company's zone, to the minute: 2026-12-08T09:00. */
export const localDateTime = storableText('Give a date and time like 2026-12-08T09:00.')
  .regex(LOCAL_DATE_TIME, 'Give a date and time like 2026-12-08T09:00.')
  .refine((v) => {
    // Refinements run even after the pattern fails; only a well-formed reading is checked further.
    if (!LOCAL_DATE_TIME.test(v)) return true;
    const [date, time] = v.split('T');
    const [h, m] = time.split(':').map(Number);
    return z.iso.date().safeParse(date).success && h < 24 && m < 60;
  }, 'That date or time does not exist.');
export type LocalDateTime = z.infer<typeof localDateTime>;

const uuid = z.uuid('Not a valid id.');

const windowFields = {
  start: localDateTime,
  end: localDateTime,
};

/** End after start and within a day: checked here so every field is named at once; the past is checked on the server (company's clock). */
function checkWindow(v: { start?: string; end?: string }, ctx: z.RefinementCtx) {
  if (typeof v.start !== 'string' || typeof v.end !== 'string' || !LOCAL_DATE_TIME.test(v.start) || !LOCAL_DATE_TIME.test(v.end)) return;
  const minutes = localMinutesBetween(v.start, v.end);
  if (minutes <= 0) ctx.addIssue({ code: 'custom', path: ['end'], message: 'The end must be after the start.' });
  else if (minutes < MIN_BOOKING_MINUTES) ctx.addIssue({ code: 'custom', path: ['end'], message: `A booking is at least ${MIN_BOOKING_MINUTES} minutes.` });
  else if (minutes > MAX_BOOKING_MINUTES) ctx.addIssue({ code: 'custom', path: ['end'], message: 'A booking cannot be longer than a day.' });
}

/** Minutes between two wall-clock readings, as the clock on the wall shows them (a change of clocks is the server's business). */
/** A wall-clock reading `minutes` later on the same clock ("2026-12-08T23:30" + 60 → "2026-12-09T00:30"); no zone involved. */
export function addMinutesToLocal(local: string, minutes: number): string {
  return new Date(Date.parse(`${local}:00Z`) + minutes * 60_000).toISOString().slice(0, 16);
}

export function localMinutesBetween(start: string, end: string): number {
  const toMs = (v: string) => Date.parse(`${v}:00Z`);
  const minutes = Math.round((toMs(end) - toMs(start)) / 60_000);
  return Number.isFinite(minutes) ? minutes : 0;
}

export const bookingInput = z
  .object({
    applianceIds: z
      .array(uuid, 'Choose at least one appliance.')
      .min(1, 'Choose at least one appliance.')
      .max(MAX_BOOKING_APPLIANCES, `At most ${MAX_BOOKING_APPLIANCES} appliances in one booking.`)
      .refine((ids) => new Set(ids).size === ids.length, 'An appliance is listed twice.'),
    technicianId: uuid,
    ...windowFields,
    source: z.enum(BOOKING_SOURCES, 'Choose where this booking came from.').default('phone'),
    serviceRequestId: uuid.optional(),
    note: optionalText(1000),
  })
  .superRefine(checkWindow);
export type BookingInput = z.input<typeof bookingInput>;

export const bookingMoveInput = z
  .object({
    ...windowFields,
    technicianId: uuid.optional(),
    note: optionalText(1000),
  })
  .superRefine(checkWindow);
export type BookingMoveInput = z.input<typeof bookingMoveInput>;

export const bookingReasonInput = z.object({ reason: requiredText('A reason', 500) });
export type BookingReasonInput = z.input<typeof bookingReasonInput>;

const dateRange = z
  .object({ from: isoDate, to: isoDate, technicianId: uuid.optional() })
  .refine((v) => v.to >= v.from, { path: ['to'], message: 'The last day must be on or after the first.' })
  .refine((v) => localMinutesBetween(`${v.from}T00:00`, `${v.to}T00:00`) / 1440 < MAX_BOARD_DAYS, {
    path: ['to'],
    message: `Show at most ${MAX_BOARD_DAYS} days at once.`,
  });

export const bookingListQuery = dateRange;
export type BookingListQuery = z.input<typeof bookingListQuery>;
export const loadListQuery = dateRange;
export type LoadListQuery = z.input<typeof loadListQuery>;
/** The unbooked queue: due (or overdue, or failed at the last check) by `to`, with no live booking still ahead. */
export const unbookedQuery = z
  .object({
    from: isoDate,
    to: isoDate,
    applianceKind: z.enum(APPLIANCE_KINDS, 'Choose a kind of appliance.').optional(),
    fuel: z.enum(FUELS, 'Choose a fuel.').optional(),
    town: storableText().trim().max(120, 'At most 120 characters.').optional(),
    search: storableText().trim().max(120, 'At most 120 characters.').optional(),
    technicianId: uuid.optional(),
    after: storableText().max(100).optional(),
    limit: z.coerce.number('Give a number.').int('Whole numbers only.').min(1, 'At least 1.').max(100, 'At most 100.').default(50),
  })
  .refine((v) => v.to >= v.from, { path: ['to'], message: 'The last day must be on or after the first.' });
export type UnbookedQuery = z.input<typeof unbookedQuery>;

export type UnbookedItemDto = {
  appliance: { id: string; kind: ApplianceKind; fuel: Fuel; title: string };
  site: { id: string; street: string; town: string; assignedTechnicianId: string | null; assignedTechnicianName: string | null };
  customer: { id: string; name: string };
  /** The earliest due date among its parts (today for a part that failed at the last check). */
  firstDueOn: string;
  overdue: boolean;
  /** What is due, in words, as a booking card says it. */
  due: string[];
};
/** A page of the queue, with what the booking form needs: the team and the company's window lengths. */
export type UnbookedPageDto = {
  items: UnbookedItemDto[];
  nextCursor: string | null;
  technicians: { id: string; name: string }[];
  bookingMinutes: BookingMinutesSetting;
};

export const roundQuery = z.object({ date: isoDate, technicianId: uuid.optional() });
export type RoundQuery = z.input<typeof roundQuery>;

export type BookingApplianceDto = {
  id: string;
  kind: ApplianceKind;
  fuel: Fuel;
  title: string;
  lastOutcome: VisitOutcome | null;
  lastVisitOn: string | null;
  /** What is due at this appliance, in words ("Annual service due Jan 6, 2027"; "Thermocouple, 24 in: replace"). */
  due: string[];
};

export type BookingDto = {
  id: string;
  status: BookingStatus;
  source: BookingSource;
  /** Instants (ISO 8601, UTC). */
  startsAt: string;
  endsAt: string;
  /** The same window on the company's wall clock: 2026-12-08T09:00. */
  start: LocalDateTime;
  end: LocalDateTime;
  timeZone: string;
  technician: { id: string; name: string };
  site: { id: string; street: string; town: string; postalCode: string | null; accessNotes: string | null };
  customer: { id: string; name: string; phone: string | null };
  appliances: BookingApplianceDto[];
  note: string | null;
  /** Why it was cancelled or why there was no access. */
  statusReason: string | null;
  serviceRequestId: string | null;
  /** Visits started from this booking. */
  visitIds: string[];
  bookedBy: { id: string; name: string } | null;
  createdAt: string;
  updatedAt: string;
};

export type BookingListDto = { from: string; to: string; timeZone: string; technicians: { id: string; name: string }[]; bookings: BookingDto[] };

export type LoadListLineDto = {
  /** Grouping key: component type and its specification ("thermocouple|24 in"). */
  specKey: string;
  label: string;
  count: number;
  /** Why each is wanted: by age, by condition. */
  reasons: ('age' | 'condition')[];
  appliances: { applianceId: string; bookingId: string; customerName: string }[];
};
export type LoadListDto = { from: string; to: string; technicianId: string | null; lines: LoadListLineDto[] };

export type RoundDto = { date: string; timeZone: string; technician: { id: string; name: string }; bookings: BookingDto[]; loadList: LoadListDto };

/** Booking window lengths by appliance kind (a company setting). */
export const bookingMinutesSetting = z.object(
  Object.fromEntries(
    (Object.keys(DEFAULT_BOOKING_MINUTES) as ApplianceKind[]).map((k) => [
      k,
      z
        .number('Give the minutes as a number.')
        .int('Whole minutes.')
        .min(MIN_BOOKING_MINUTES, `At least ${MIN_BOOKING_MINUTES} minutes.`)
        .max(MAX_BOOKING_MINUTES, 'At most a day.'),
    ]),
  ) as Record<ApplianceKind, z.ZodNumber>,
);
export type BookingMinutesSetting = z.infer<typeof bookingMinutesSetting>;

/** The next live booking of one appliance, as its life record shows it. `isToday` lets the record start the booked visit. */
export type NextBookingDto = {
  id: string;
  status: BookingStatus;
  start: string;
  end: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  technician: { id: string; name: string };
  isToday: boolean;
};
