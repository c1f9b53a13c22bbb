import { useRef, useState } from 'react';
import { onlineManager } from '@tanstack/react-query';
import { ApiError, type FieldErrors } from '@/lib/api-client';
import { currentOutbox } from '@/lib/offline/offline-session';
import { MAX_PHOTO_FILES, type PhotoKind } from '@shared/schemas/photos';
import { useUploadPhotos, type UploadBatch } from '../api/upload-photos';
import { namedUniquely, rejectionsFrom, savedSummary, splitOversized, type Rejection } from './upload-batch';

export type UploadState = {
  phase: 'idle' | 'sending' | 'saved' | 'failed';
  /** Files in the batch being sent, or last sent. */
  count: number;
  percent: number;
  summary?: string;
  error?: string;
  rejected: Rejection[];
  fieldErrors: FieldErrors;
  /** What the retry button sends again: the same files (safe, the server stores each file once per record). */
  retry?: { batch: UploadBatch; label: string };
};

const IDLE: UploadState = { phase: 'idle', count: 0, percent: 0, rejected: [], fieldErrors: {} };
const photos = (n: number) => `${n} photo${n === 1 ? '' : 's'}`;
// A lost signal, a busy server or a race on the same file can pass; a refused file or field will not change by itself.
const worthRetrying = (status: number) => status === 0 || status === 408 || status === 409 || status === 429 || status >= 500;

export function usePhotoUpload(applianceId: string, visitId?: string) {
  const upload = useUploadPhotos(applianceId);
  const [state, setState] = useState<UploadState>(IDLE);
  const sending = useRef<AbortController | null>(null);

  /** No signal (or the visit itself still waits to send): the photos wait in the outbox, as files, in order. */
  async function keepForLater(batch: UploadBatch, refusedHere: Rejection[]): Promise<boolean> {
    const outbox = currentOutbox();
    if (!outbox) return false;
    const fields: Record<string, string> = { applianceId: batch.applianceId, kind: batch.kind };
    if (batch.visitId) fields.visitId = batch.visitId;
    if (batch.caption.trim()) fields.caption = batch.caption.trim();
    await outbox.add({
      kind: 'photos',
      visitId: batch.visitId ?? null,
      label: `${photos(batch.items.length)}${batch.caption.trim() ? ` · ${batch.caption.trim()}` : ''}`,
      request: { method: 'POST', path: '/photos', body: undefined, form: { fields, files: batch.items.map((i) => ({ field: 'files', blob: i.file, name: i.name })) } },
    });
    setState({
      ...IDLE,
      phase: 'saved',
      count: batch.items.length,
      percent: 100,
      summary: `No signal: ${photos(batch.items.length)} kept on this phone, sent by itself when signal returns.`,
      rejected: refusedHere,
    });
    return true;
  }

  async function send(batch: UploadBatch, refusedHere: Rejection[] = []): Promise<boolean> {
    if (!batch.items.length) {
      setState({ ...IDLE, phase: 'failed', error: 'Nothing was sent.', rejected: refusedHere });
      return false;
    }
    const waitingVisit = batch.visitId ? currentOutbox()?.holds(batch.visitId) : false;
    // Known to have no signal: straight to the outbox. A send cut off mid-way keeps the files here with "Try again".
    const noSignal = navigator.onLine === false || !onlineManager.isOnline();
    if ((noSignal || waitingVisit) && (await keepForLater(batch, refusedHere))) return true;
    setState({ ...IDLE, phase: 'sending', count: batch.items.length, rejected: refusedHere });
    const controller = new AbortController();
    sending.current = controller;
    try {
      const result = await upload.mutateAsync({
        batch,
        signal: controller.signal,
        onProgress: (percent) => setState((s) => (s.phase === 'sending' ? { ...s, percent } : s)),
      });
      setState({ ...IDLE, phase: 'saved', count: batch.items.length, percent: 100, summary: savedSummary(result), rejected: refusedHere });
      return true;
    } catch (err) {
      const e = err instanceof ApiError ? err : new ApiError(0, 'unknown', err instanceof Error ? err.message : 'The photos were not saved.');
      const { rejected, other } = rejectionsFrom(e, batch.items);
      // Kind and caption are shown under their fields; anything else the server names goes into the message.
      const { files: _files, kind, caption, ...elsewhere } = e.details ?? {};
      const fieldErrors: FieldErrors = { ...(kind && { kind }), ...(caption && { caption }) };
      other.push(...Object.values(elsewhere).flat());
      const remaining = batch.items.filter((i) => !rejected.some((r) => r.name === i.name));
      const failed: UploadState = { ...IDLE, phase: 'failed', count: batch.items.length, rejected: [...refusedHere, ...rejected], fieldErrors };
      if (rejected.length) {
        const n = batch.items.length;
        failed.error =
          n === 1 ? 'This file was not saved.' : `None of the ${n} files were saved, because ${rejected.length === 1 ? 'one was' : `${rejected.length} were`} refused.`;
        if (remaining.length) failed.retry = { batch: { ...batch, items: remaining }, label: `Send the other ${photos(remaining.length)}` };
      } else {
        failed.error = [e.message, ...other].join(' ');
        if (worthRetrying(e.status)) failed.retry = { batch, label: 'Try again' };
      }
      setState(failed);
      return false;
    } finally {
      sending.current = null;
    }
  }

  /** Sends the chosen files as one batch; resolves true when they were saved. */
  function start(files: File[], kind: PhotoKind, caption: string) {
    if (files.length > MAX_PHOTO_FILES) {
      setState({ ...IDLE, phase: 'failed', error: `Choose up to ${MAX_PHOTO_FILES} photos at a time (you chose ${files.length}).` });
      return Promise.resolve(false);
    }
    const { fits, rejected } = splitOversized(namedUniquely(files));
    return send({ applianceId, visitId, kind, caption, items: fits }, rejected);
  }

  const retry = () => (state.retry ? send(state.retry.batch, state.rejected) : Promise.resolve(false));

  /** Stops a slow upload (a weak signal); the files stay ready for "Try again". */
  const stop = () => sending.current?.abort();

  return { state, start, retry, stop };
}
