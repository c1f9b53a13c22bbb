/**
 * Reminder e-mails to customers, sent by the scheduled job or by the office, once per appliance, kind, part and due period.
 *
 *   POST /reminders/annual-service/:applianceId   ReminderDto          reminders:send
 *   GET  /reminders                               ReminderDto[]        records:read
 *   GET  /unsubscribe/:token                      UnsubscribeStatusDto public (no sign-in; the token names the customer)
 *   POST /unsubscribe/:token                      UnsubscribeStatusDto public (RFC 8058 one-click)
 *   GET  /dev/outbox                              OutboxMessageDto[]   reminders:send, development and test only
 */
export const REMINDER_KINDS = ['annual_service', 'part_due'] as const;
export type ReminderKind = (typeof REMINDER_KINDS)[number];
export const REMINDER_STATUSES = ['pending', 'sent', 'failed', 'opted_out', 'no_email'] as const;
export type ReminderStatus = (typeof REMINDER_STATUSES)[number];
export const REMINDER_TRIGGERS = ['schedule', 'office'] as const;
export type ReminderTrigger = (typeof REMINDER_TRIGGERS)[number];
