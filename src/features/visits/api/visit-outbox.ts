import { ApiError } from '@/lib/api-client';
import { currentOutbox } from '@/lib/offline/offline-session';
import type { OutboxEntry } from '@/lib/offline/outbox';
import type { VisitDraftInput, VisitDto } from '@shared/schemas/visits';
import type { DraftFields } from '../draft/draft-fields';

/*
 * The visit's writes that go through the outbox when there is no signal (see src/lib/offline/outbox.ts): the
 * completion and part swaps. A visit started with no signal is queued by the life record's "Start visit".
 */

const noSignal = () => typeof navigator !== 'undefined' && navigator.onLine === false;

/** True when a write of this visit must go to the outbox: no signal, or earlier writes of the visit still waiting. */
export const mustQueue = (visitId: string) => Boolean(currentOutbox()) && (noSignal() || Boolean(currentOutbox()?.holds(visitId)));

export const isNoSignal = (e: unknown) => e instanceof ApiError && (e.offline || e.status >= 500);

export const isWaitingBehind = (visitId: string) => currentOutbox()?.holds(visitId) ?? false;

/** How the open visit screen names its visit ("Finish the visit · Ada Quill, 12 Tinderwick Lane"), for the waiting list. */
const visitNames = new Map<string, string>();
export function nameVisitForOutbox(visitId: string, label: string) {
  visitNames.set(visitId, label);
}

export async function queueCompletion(visitId: string, body: VisitDraftInput, rebase: { base: DraftFields; fields: DraftFields }) {
  const label = visitNames.get(visitId) ?? 'Finish the visit';
  const outbox = currentOutbox();
  if (!outbox) throw new ApiError(0, 'offline', 'No signal: completing needs the server. Everything is saved on this phone.');
  await outbox.add({ kind: 'visit-complete', visitId, label, request: { method: 'POST', path: `/visits/${visitId}/complete`, body }, meta: { rebase } });
}

export async function queueSwap(visitId: string, body: Record<string, unknown>, label: string) {
  const outbox = currentOutbox();
  if (!outbox) throw new ApiError(0, 'offline', 'No signal. Try again when you have signal; nothing was recorded yet.');
  await outbox.add({ kind: 'part-swap', visitId, label, request: { method: 'POST', path: `/visits/${visitId}/swaps`, body } });
}

/** The visit as the phone made it when it was started with no signal, until the server has it. */
export function locallyStartedVisit(visitId: string): VisitDto | null {
  const entry = currentOutbox()?.find((e) => e.kind === 'visit-start' && e.visitId === visitId);
  return (entry?.meta?.localVisit as VisitDto | undefined) ?? null;
}

export const queuedOf = (entries: readonly OutboxEntry[], visitId: string, kind: OutboxEntry['kind']) => entries.filter((e) => e.visitId === visitId && e.kind === kind);
