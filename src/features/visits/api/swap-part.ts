import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import type { z } from 'zod';
import type { swapInput } from '@shared/schemas/visits';
import { applianceKeys } from '@/lib/resources/appliances';
import { visitQueryOptions } from './get-visit';
import { isNoSignal, mustQueue, queueSwap } from './visit-outbox';

export type SwapInput = z.input<typeof swapInput>;

export const swapPart = ({ visitId, ...body }: SwapInput & { visitId: string }) => api<VisitDto>(`/visits/${visitId}/swaps`, { method: 'POST', body });

/** With no signal the swap waits in the outbox (resolves to null) and is sent, in order, when signal returns. */
async function swapOrQueue(input: SwapInput & { visitId: string; label: string }): Promise<VisitDto | null> {
  const { label, ...request } = input;
  const { visitId, ...body } = request;
  if (mustQueue(visitId)) {
    await queueSwap(visitId, body, label);
    return null;
  }
  try {
    return await swapPart(request);
  } catch (e) {
    if (!isNoSignal(e)) throw e;
    await queueSwap(visitId, body, label);
    return null;
  }
}

export function useSwapPart() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: swapOrQueue,
    // Not paused for lack of signal: with none, the swap goes to the outbox at once.
    networkMode: 'always',
    onSuccess: (visit) => {
      if (!visit) return;
      qc.setQueryData(visitQueryOptions(visit.id).queryKey, visit);
      return qc.invalidateQueries({ queryKey: applianceKeys.record(visit.applianceId) });
    },
  });
}
