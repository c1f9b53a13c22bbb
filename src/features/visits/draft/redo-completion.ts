import type { OutboxEntry, OutboxRequest } from '@/lib/offline/outbox';
import type { VisitDto } from '@shared/schemas/visits';
import { getVisit } from '../api/get-visit';
import { fieldsFromVisit, rebase, toPayload, type DraftFields } from './draft-fields';

/**
 * A completion sent from the outbox met a 409 (the visit changed since it was finished: a part swap sent just before,
 * or someone in the office). Like a draft save, it is rebased once on the server's copy, keeping what was typed on
 * the phone; a visit already completed elsewhere is left refused, with its reason, for the technician to see.
 */
export async function redoCompletion(entry: OutboxEntry): Promise<OutboxRequest | null> {
  const stored = entry.meta?.rebase as { base: DraftFields; fields: DraftFields } | undefined;
  if (!entry.visitId || !stored) return null;
  const fresh: VisitDto = await getVisit(entry.visitId);
  if (fresh.status === 'completed') return null;
  const merged = rebase(stored.base, stored.fields, fieldsFromVisit(fresh));
  return { ...entry.request, body: toPayload(merged, fresh.revision) };
}
