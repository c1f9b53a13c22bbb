import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { DueRuleDto, dueRuleInput } from '@shared/schemas/due';
import { applianceKeys } from '@/lib/resources/appliances';
import { dueRulesQueryOptions } from './list-due-rules';

export type DueRuleBody = z.output<typeof dueRuleInput>;

export const updateDueRule = ({ id, body }: { id: string; body: DueRuleBody }) =>
  api<DueRuleDto>(`/due-rules/${encodeURIComponent(id)}`, { method: 'PUT', body });

export function useUpdateDueRule() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateDueRule,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: dueRulesQueryOptions().queryKey });
      // Due dates everywhere were recomputed on the server.
      void qc.invalidateQueries({ queryKey: ['due'] });
      void qc.invalidateQueries({ queryKey: applianceKeys.all });
    },
  });
}
