import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DueRuleDto } from '@shared/schemas/due';
import { dueRulesQueryOptions } from './list-due-rules';

export const adoptLearnedLife = (ruleId: string) => api<DueRuleDto>(`/due-rules/${encodeURIComponent(ruleId)}/adopt-learned-life`, { method: 'POST' });

export function useAdoptLearnedLife() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: adoptLearnedLife,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: dueRulesQueryOptions().queryKey });
      // Due dates everywhere were recomputed on the server.
      void qc.invalidateQueries({ queryKey: ['due'] });
      void qc.invalidateQueries({ queryKey: ['appliances'] });
    },
  });
}
