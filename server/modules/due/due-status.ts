import { daysBetween } from '../../../shared/trade/iso-date';
import { formatCalendarDate } from '../../../shared/format/dates';
import type { DueStatus } from '../../../shared/trade/due-dates';

export type StoredDue = { dueOn: string | null; dueKind: 'inspection' | 'replacement' | null; dueReason: string | null; conditionFailed: boolean };

/**
 * Status and full reason for a component's stored due date on `today`, worded exactly as computeComponentDue words
 * them (the stored reason is the part that does not change from day to day).
 */
export function describeStoredDue(due: StoredDue, today: string, horizonDays: number): { status: DueStatus; reason: string } | null {
  if (due.conditionFailed) return { status: 'replace_now', reason: due.dueReason ?? 'Failed on condition at inspection: replace now.' };
  if (!due.dueOn || !due.dueKind) return null;
  const daysLeft = daysBetween(today, due.dueOn);
  const status: DueStatus = daysLeft < 0 ? 'overdue' : daysLeft <= horizonDays ? 'due_soon' : 'ok';
  const when =
    daysLeft < 0
      ? `was due ${formatCalendarDate(due.dueOn)} (${-daysLeft} days ago)`
      : daysLeft === 0
        ? `is due today (${formatCalendarDate(due.dueOn)})`
        : `is due ${formatCalendarDate(due.dueOn)}, in ${daysLeft} days`;
  const what = due.dueKind === 'replacement' ? 'Replacement' : 'Inspection';
  return { status, reason: `${what} ${when}: ${due.dueReason}.` };
}
