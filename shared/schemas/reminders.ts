/**
 * Reminder e-mails to customers, sent by the scheduled job or by the office, once per appliance, kind, part and due period.
 *
 *   POST /reminders/annual-service/:applianceId   ReminderDto          reminders:send
 *   GET  /reminders?limit=&before=&applianceId=  RemindersPageDto     records:read (newest first, keyset)
 *   GET  /unsubscribe/:token                      UnsubscribeStatusDto public (no sign-in; the token names the customer)
 *   POST /unsubscribe/:token                      UnsubscribeStatusDto public (RFC 8058 one-click)
 *   GET  /dev/outbox?limit=                       OutboxMessageDto[]   reminders:send; mounted only when FAKE_SMTP_OUTBOX is set (404 otherwise)
 */
import { z } from 'zod';
import { storableText } from './common';

export const REMINDER_KINDS = ['annual_service', 'part_due'] as const;
export type ReminderKind = (typeof REMINDER_KINDS)[number];
export const REMINDER_STATUSES = ['pending', 'sent', 'failed', 'opted_out', 'no_email'] as const;
export type ReminderStatus = (typeof REMINDER_STATUSES)[number];
export const REMINDER_TRIGGERS = ['schedule', 'office'] as const;
export type ReminderTrigger = (typeof REMINDER_TRIGGERS)[number];

export const reminderApplianceParams = z.object({ applianceId: z.uuid('Not a valid appliance id.') });

export const remindersListQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  /** Keyset cursor from the previous page's nextCursor. */
  before: storableText().max(100).optional(),
  applianceId: z.uuid().optional(),
});

export type ReminderDto = {
  id: string;
  applianceId: string;
  customerId: string;
  customerName: string;
  kind: ReminderKind;
  /** The part's name for a part-due reminder, null for annual service. */
  partLabel: string | null;
  dueOn: string;
  status: ReminderStatus;
  trigger: ReminderTrigger;
  toEmail: string | null;
  attempts: number;
  lastError: string | null;
  sentAt: string | null;
  createdAt: string;
};
export type RemindersPageDto = { items: ReminderDto[]; nextCursor: string | null };

export const unsubscribeParams = z.object({ token: storableText().min(1).max(200) });
export type UnsubscribeStatusDto = { companyName: string; companyPhone: string; optedOut: boolean };

export const outboxQuery = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) });
/** A file sent with a message; `text` holds a calendar invitation's own text (text/calendar), so it can be read here. */
export type OutboxAttachmentDto = { filename: string; contentType: string; size: number; text: string | null };
export type OutboxMessageDto = { id: string; to: string[]; subject: string; date: string; text: string; html: string | null; attachments: OutboxAttachmentDto[] };
