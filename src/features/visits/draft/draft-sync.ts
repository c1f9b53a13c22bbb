import { ApiError } from '@/lib/api-client';
import type { VisitDraftInput, VisitDto } from '@shared/schemas/visits';
import { fieldsFromVisit, payloadKey, rebase, toPayload, type DraftFields, type FieldErrors } from './draft-fields';
import { clearDraft, loadDraft, saveDraft } from './draft-storage';

export type SyncStatus = 'saved' | 'pending' | 'saving' | 'queued' | 'invalid' | 'conflict' | 'error' | 'completed' | 'finished-offline';

export type SyncSnapshot = {
  fields: DraftFields;
  status: SyncStatus;
  /** Field errors from the server's last refusal (400), keyed like the server's details. */
  errors: FieldErrors;
  message: string | null;
  revision: number;
};

export type DraftTransport = {
  put: (visitId: string, body: VisitDraftInput) => Promise<VisitDto>;
  get: (visitId: string) => Promise<VisitDto>;
  complete: (visitId: string, body: VisitDraftInput) => Promise<VisitDto>;
  /** True while earlier writes of this visit wait in the outbox (a visit started with no signal): saves wait too. */
  waitingBehind?: (visitId: string) => boolean;
  /** Puts the completion in the outbox when there is no signal; `rebase` lets a 409 on replay be redone. */
  queueComplete?: (visitId: string, body: VisitDraftInput, rebase: { base: DraftFields; fields: DraftFields }) => Promise<void>;
};

const SAVE_AFTER_MS = 1000;
const RETRY_MS = [2000, 4000, 8000, 15000];

const isRetryable = (e: unknown): e is ApiError => e instanceof ApiError && (e.offline || e.status >= 500);
const isConflict = (e: unknown) => e instanceof ApiError && e.status === 409;

/**
 * Keeps one draft visit in step with the server. Every edit goes to localStorage first; saves are debounced and
 * coalesced (one request in flight, always the latest state, never the same state twice); failures for lack of
 * signal are retried with backoff and on the browser's `online` event; a 409 is rebased on the fresh copy once.
 */
export class DraftSync {
  private base: DraftFields;
  private baseRevision: number;
  private fields: DraftFields;
  private dirty: boolean;
  private lastSentKey: string;
  private status: SyncStatus = 'saved';
  private errors: FieldErrors = {};
  private message: string | null = null;
  private snapshot: SyncSnapshot;
  private timer: ReturnType<typeof setTimeout> | undefined;
  private attempt = 0;
  private inFlight: Promise<void> | null = null;
  private listeners = new Set<() => void>();
  private running = false;
  private stopped = false;

  constructor(
    private readonly visitId: string,
    server: VisitDto,
    private readonly transport: DraftTransport,
    private readonly onServer: (v: VisitDto) => void,
  ) {
    const serverFields = fieldsFromVisit(server);
    const stored = server.status === 'draft' ? loadDraft(visitId) : null;
    this.base = serverFields;
    this.baseRevision = server.revision;
    this.fields = serverFields;
    this.dirty = false;
    this.lastSentKey = payloadKey(serverFields);
    if (stored && stored.baseRevision >= server.revision) {
      // This phone's copy builds on what the server has (or more): it holds everything, including unfinished readings.
      this.fields = stored.fields;
      this.dirty = stored.dirty;
    } else if (stored?.dirty) {
      // The server moved on while this phone held unsent changes: put them back on top of the fresh copy.
      this.fields = rebase(stored.base, stored.fields, serverFields);
      this.dirty = true;
    }
    if (this.dirty && payloadKey(this.fields) === this.lastSentKey) this.dirty = false;
    this.status = this.dirty ? 'pending' : 'saved';
    this.snapshot = this.makeSnapshot();
    this.persist();
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

  /** Listens for the signal coming back; safe to call again after stop() (React may mount twice). */
  start() {
    if (this.running) return;
    this.running = true;
    this.stopped = false;
    window.addEventListener('online', this.onOnline);
    if (this.dirty) this.schedule(0);
  }

  stop() {
    this.running = false;
    window.removeEventListener('online', this.onOnline);
    clearTimeout(this.timer);
  }

  edit(change: (f: DraftFields) => DraftFields) {
    if (this.status === 'completed') return;
    this.fields = change(this.fields);
    this.dirty = payloadKey(this.fields) !== this.lastSentKey || this.dirty;
    this.attempt = 0;
    this.status = navigator.onLine ? 'pending' : 'queued';
    this.persist();
    this.emit();
    this.schedule(SAVE_AFTER_MS);
  }

  /** The server's copy changed through another route (a part swap): adopt its revision, keeping local changes. */
  adopt(server: VisitDto) {
    if (server.revision <= this.baseRevision) return;
    const serverFields = fieldsFromVisit(server);
    this.fields = rebase(this.base, this.fields, serverFields);
    this.base = serverFields;
    this.baseRevision = server.revision;
    this.lastSentKey = payloadKey(serverFields);
    this.dirty = payloadKey(this.fields) !== this.lastSentKey;
    this.persist();
    this.emit();
    if (this.dirty) this.schedule(SAVE_AFTER_MS);
  }

  retryNow = () => {
    this.attempt = 0;
    this.schedule(0);
  };

  /**
   * Sends the final state with the complete call; the local copy is cleared only once the server has it. With no
   * signal the completion goes to the outbox instead and this resolves to null: the visit is finished on this phone.
   */
  async complete(): Promise<VisitDto | null> {
    clearTimeout(this.timer);
    await this.inFlight;
    const send = () => this.transport.complete(this.visitId, toPayload(this.fields, this.baseRevision));
    let done: VisitDto;
    try {
      try {
        if (this.transport.waitingBehind?.(this.visitId)) throw new ApiError(0, 'offline', 'Earlier changes of this visit are still waiting to send.');
        done = await send();
      } catch (e) {
        if (!isConflict(e)) throw e;
        await this.rebaseOnServer();
        done = await send();
      }
    } catch (e) {
      if (isRetryable(e) && this.transport.queueComplete) {
        await this.transport.queueComplete(this.visitId, toPayload(this.fields, this.baseRevision), { base: this.base, fields: this.fields });
        // The draft stays in localStorage until the server has the visit: a refused completion reopens with everything.
        this.stopped = true;
        this.status = 'finished-offline';
        this.emit();
        return null;
      }
      // Not completed: the draft carries on saving as before.
      if (this.dirty) this.schedule(0);
      throw e;
    }
    this.stopped = true;
    this.status = 'completed';
    this.dirty = false;
    clearDraft(this.visitId);
    this.onServer(done);
    this.emit();
    return done;
  }

  private onOnline = () => this.retryNow();

  private schedule(ms: number) {
    clearTimeout(this.timer);
    if (!this.running || this.stopped) return;
    this.timer = setTimeout(() => void this.flush(), ms);
  }

  private async flush(conflictRetry = false): Promise<void> {
    if (this.inFlight) {
      await this.inFlight;
      return this.flush(conflictRetry);
    }
    if (!this.dirty || this.stopped) return;
    const key = payloadKey(this.fields);
    if (key === this.lastSentKey) {
      this.dirty = false;
      this.setStatus('saved');
      this.persist();
      return;
    }
    if (this.transport.waitingBehind?.(this.visitId)) {
      this.afterFailure(new ApiError(0, 'offline', 'Waiting for earlier changes of this visit to send.'), conflictRetry);
      return;
    }
    this.setStatus('saving');
    let resolve!: () => void;
    this.inFlight = new Promise<void>((r) => (resolve = r));
    try {
      const saved = await this.transport.put(this.visitId, toPayload(this.fields, this.baseRevision));
      this.base = fieldsFromVisit(saved);
      this.baseRevision = saved.revision;
      this.lastSentKey = key;
      this.dirty = payloadKey(this.fields) !== key;
      this.attempt = 0;
      this.errors = {};
      this.message = null;
      this.status = this.dirty ? 'pending' : 'saved';
      this.persist();
      this.onServer(saved);
      this.emit();
      if (this.dirty) this.schedule(SAVE_AFTER_MS);
    } catch (e) {
      this.afterFailure(e, conflictRetry);
    } finally {
      this.inFlight = null;
      resolve();
    }
  }

  private afterFailure(e: unknown, conflictRetry: boolean) {
    if (isRetryable(e)) {
      this.setStatus('queued');
      // The server may ask for longer (a 503 while its database restarts); the draft stays on the phone meanwhile.
      const backoff = RETRY_MS[Math.min(this.attempt++, RETRY_MS.length - 1)];
      this.schedule(Math.max(backoff, e.retryAfterMs ?? 0));
    } else if (isConflict(e) && !conflictRetry) {
      void this.rebaseOnServer().then(
        () => this.flush(true),
        (err: unknown) => this.afterFailure(err, true),
      );
    } else if (isConflict(e)) {
      this.message = 'This visit was changed somewhere else at the same time. Your changes are kept on this phone.';
      this.setStatus('conflict');
    } else if (e instanceof ApiError && e.status === 400) {
      this.errors = e.details ?? {};
      this.message = e.message;
      this.setStatus('invalid');
    } else {
      this.message = e instanceof Error ? e.message : 'Not saved.';
      this.setStatus('error');
    }
  }

  private async rebaseOnServer() {
    const fresh = await this.transport.get(this.visitId);
    this.onServer(fresh);
    if (fresh.status === 'completed') {
      this.stopped = true;
      this.message = 'This visit was completed on another device. What you typed here is kept on this phone but was not sent.';
      this.setStatus('conflict');
      throw new ApiError(409, 'completed', this.message);
    }
    const serverFields = fieldsFromVisit(fresh);
    this.fields = rebase(this.base, this.fields, serverFields);
    this.base = serverFields;
    this.baseRevision = fresh.revision;
    this.lastSentKey = payloadKey(serverFields);
    this.dirty = payloadKey(this.fields) !== this.lastSentKey;
    this.persist();
    this.emit();
  }

  private persist() {
    saveDraft(this.visitId, { v: 1, base: this.base, baseRevision: this.baseRevision, fields: this.fields, dirty: this.dirty, editedAt: Date.now() });
  }

  private setStatus(s: SyncStatus) {
    this.status = s;
    this.emit();
  }

  private makeSnapshot(): SyncSnapshot {
    return { fields: this.fields, status: this.status, errors: this.errors, message: this.message, revision: this.baseRevision };
  }

  private emit() {
    this.snapshot = this.makeSnapshot();
    for (const l of this.listeners) l();
  }
}
