import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReminderDto } from '@shared/schemas/reminders';
import { remindersQueryOptions } from './get-reminders';

export const sendAnnualReminder = (applianceId: string) =>
  api<ReminderDto>(`/reminders/annual-service/${encodeURIComponent(applianceId)}`, { method: 'POST' });

export function useSendAnnualReminder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: sendAnnualReminder,
    onSettled: () => qc.invalidateQueries({ queryKey: remindersQueryOptions().queryKey.slice(0, 1) }),
  });
}
