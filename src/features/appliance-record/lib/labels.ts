import { formatCalendarDate, formatInstant } from '@shared/format/dates';
import { formatBtuh } from '@shared/format/quantities';
import { LABELS } from '@shared/schemas/enums';
import type { ApplianceDto } from '@shared/schemas/records';
import type { Status } from '@/components/ui/status-badge';

export const DUE_STATUS: Record<string, { status: Status; word: string }> = {
  ok: { status: 'ok', word: 'OK' },
  due_soon: { status: 'soon', word: 'Due soon' },
  overdue: { status: 'due', word: 'Overdue' },
  replace_now: { status: 'unsafe', word: 'Replace now' },
};

export const dueStatus = (s: string) => DUE_STATUS[s] ?? { status: 'info' as const, word: s.replace(/_/g, ' ') };

export function applianceTitle(a: ApplianceDto) {
  return `${LABELS.applianceKind[a.kind]} · ${LABELS.fuel[a.fuel]}`;
}

export function makeModel(a: ApplianceDto) {
  return [a.manufacturer, a.model].filter(Boolean).join(' ') || 'Make and model not recorded';
}

/** A calendar date (yyyy-mm-dd) shown as written, never shifted by the phone's time zone. */
export const formatDate = (iso: string | null | undefined) => formatCalendarDate(iso);

/** An instant on the company's clocks (the reader's own zone until the company is known). */
export const formatDateTime = (iso: string, timeZone = Intl.DateTimeFormat().resolvedOptions().timeZone) => formatInstant(iso, timeZone);

export const btuh = (n: number | null) => (n == null ? null : formatBtuh(n));
