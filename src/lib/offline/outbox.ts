import { del, entries, set, type UseStore } from 'idb-keyval';
import { api, ApiError, type FieldErrors } from '@/lib/api-client';

/*
 * Writes made with no signal wait here, in order, in the signed-in person's IndexedDB, and are sent when the connection
 * returns (the browser's `online` event, a retry with backoff, and on app start). Each carries its own
 * Idempotency-Key (IETF draft "The Idempotency-Key HTTP Header Field"), so a write the server took but whose answer
 * was lost is answered again from the server's store rather than made twice.
 */

export type OutboxKind = 'visit-start' | 'visit-complete' | 'part-swap' | 'photos';

/** A multipart request kept whole: its text fields and its files as Blobs (IndexedDB stores them as they are). */
export type OutboxForm = { fields: Record<string, string>; files: { field: string; blob: Blob; name: string }[] };

export type OutboxRequest = { method: 'POST' | 'PUT'; path: string; body: unknown; form?: OutboxForm };

function formData({ fields, files }: OutboxForm) {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  for (const f of files) form.append(f.field, f.blob, f.name);
  return form;
}

export type OutboxEntry = {
  /** Order of sending: the time it was queued, in microseconds, made unique. */
  seq: number;
  idempotencyKey: string;
  kind: OutboxKind;
  /** The visit it belongs to: a refused write holds back the later writes of the same visit, never the others. */
  visitId: string | null;
  /** What the technician reads on the waiting list ("Finish the visit: Boiler, 12 Tinderwick Lane"). */
  label: string;
  request: OutboxRequest;
  queuedAt: number;
  attempts: number;
  state: 'waiting' | 'refused';
  refusal?: { status: number; message: string; details?: FieldErrors };
  /** Set once a 409 has been answered by rebasing the write on the server's copy: a second 409 is refused. */
  rebased?: boolean;
  /** Whatever the feature that queued it needs to show or redo it (the visit as the phone started it). */
  meta?: Record<string, unknown>;
};

export type NewOutboxEntry = Pick<OutboxEntry, 'kind' | 'visitId' | 'label' | 'request' | 'meta'>;

export type OutboxSnapshot = {
  entries: readonly OutboxEntry[];
  sending: boolean;
  /** When the next automatic try is due, after a failure for lack of signal. */
  nextTryAt: number | null;
};

export type OutboxHandlers = {
  /** The server took the write: put its answer where the screens read it. */
  onSent?: (entry: OutboxEntry, response: unknown) => void | Promise<void>;
  /** A 409: return the write redone on the server's current copy, or null to leave it refused with its reason. */
  onConflict?: (entry: OutboxEntry) => Promise<OutboxRequest | null>;
};

const RETRY_MS = [2_000, 5_000, 10_000, 20_000, 30_000];

// Also the server's 409 "this key's first request is still running" (a retry that overtook the lost first try):
// waiting is right, a new key would run the write twice.
const offlineOrServerTrouble = (e: unknown) =>
  e instanceof ApiError && (e.offline || e.status >= 500 || e.status === 401 || e.status === 408 || e.status === 429 || e.code === 'idempotency_key_in_progress');

export class Outbox {
  private list: OutboxEntry[] = [];
  private snapshot: OutboxSnapshot = { entries: [], sending: false, nextTryAt: null };
  private listeners = new Set<() => void>();
  private sending = false;
  private again = false;
  private failures = 0;
  private timer: ReturnType<typeof setTimeout> | undefined;
  private nextTryAt: number | null = null;
  private lastSeq = 0;
  private running = false;
  private loaded: Promise<void> | null = null;

  constructor(
    readonly userId: string,
    private readonly store: UseStore,
    private handlers: OutboxHandlers = {},
  ) {}

  /** Reads what is waiting (in order); safe to call more than once. */
  load(): Promise<void> {
    this.loaded ??= entries<number, OutboxEntry>(this.store).then(
      (rows) => {
        this.list = rows.map(([, e]) => e).sort((a, b) => a.seq - b.seq);
        this.lastSeq = this.list.at(-1)?.seq ?? 0;
        this.emit();
      },
      () => undefined,
    );
    return this.loaded;
  }

  setHandlers(handlers: OutboxHandlers) {
    this.handlers = handlers;
  }

  subscribe = (listener: () => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

  /** True while anything of this visit waits or was refused: later writes of the visit must wait behind it. */
  holds(visitId: string) {
    return this.list.some((e) => e.visitId === visitId);
  }

  find(predicate: (e: OutboxEntry) => boolean) {
    return this.list.find(predicate);
  }

  async add(entry: NewOutboxEntry): Promise<OutboxEntry> {
    await this.load();
    const seq = Math.max(Date.now() * 1000, this.lastSeq + 1);
    this.lastSeq = seq;
    const full: OutboxEntry = { ...entry, seq, idempotencyKey: crypto.randomUUID(), queuedAt: Date.now(), attempts: 0, state: 'waiting' };
    // Written to IndexedDB before anything says "queued": a closed tab or a phone restart must not lose it.
    await set(seq, full, this.store);
    this.list = [...this.list, full];
    this.emit();
    this.kick(0);
    return full;
  }

  /** The technician gave up on a refused write (or it was redone another way). */
  async discard(seq: number) {
    await del(seq, this.store);
    this.list = this.list.filter((e) => e.seq !== seq);
    this.emit();
    this.kick(0);
  }

  /** Listens for the signal and sends what is waiting; stop() on sign-out or when another person signs in. */
  start() {
    if (this.running) return;
    this.running = true;
    window.addEventListener('online', this.onOnline);
    void this.load().then(() => this.kick(0));
  }

  stop() {
    this.running = false;
    window.removeEventListener('online', this.onOnline);
    clearTimeout(this.timer);
  }

  /** Sends now (the "Send now" button, the online event). */
  retryNow = () => {
    this.failures = 0;
    this.kick(0);
  };

  private onOnline = () => this.retryNow();

  private kick(ms: number) {
    clearTimeout(this.timer);
    if (!this.running) return;
    this.nextTryAt = ms > 0 ? Date.now() + ms : null;
    this.timer = setTimeout(() => void this.replay(), ms);
    this.emit();
  }

  /** Sends in order; a refused write holds back only later writes of its own visit. */
  async replay(): Promise<void> {
    if (this.sending) {
      this.again = true;
      return;
    }
    this.sending = true;
    this.nextTryAt = null;
    this.emit();
    try {
      for (;;) {
        this.again = false;
        const held = new Set(this.list.filter((e) => e.state === 'refused').map((e) => e.visitId));
        const next = this.list.find((e) => e.state === 'waiting' && !(e.visitId && held.has(e.visitId)));
        if (!next || !this.running) break;
        const outcome = await this.send(next);
        if (outcome === 'wait') {
          const backoff = RETRY_MS[Math.min(this.failures++, RETRY_MS.length - 1)];
          this.sending = false;
          this.kick(backoff);
          return;
        }
        this.failures = 0;
      }
    } finally {
      if (this.sending) {
        this.sending = false;
        this.emit();
        if (this.again) this.kick(0);
      }
    }
  }

  private async send(queued: OutboxEntry): Promise<'sent' | 'redone' | 'refused' | 'wait'> {
    const entry = { ...queued, attempts: queued.attempts + 1 };
    await this.replace(entry);
    try {
      const response = await api<unknown>(entry.request.path, {
        method: entry.request.method,
        body: entry.request.form ? formData(entry.request.form) : entry.request.body,
        headers: { 'Idempotency-Key': entry.idempotencyKey },
      });
      await del(entry.seq, this.store);
      this.list = this.list.filter((e) => e.seq !== entry.seq);
      this.emit();
      await this.handlers.onSent?.(entry, response);
      return 'sent';
    } catch (e) {
      if (offlineOrServerTrouble(e)) return 'wait';
      if (e instanceof ApiError && e.status === 409 && !entry.rebased && this.handlers.onConflict) {
        const redone = await this.handlers.onConflict(entry).catch((err: unknown) => (offlineOrServerTrouble(err) ? 'wait' : null));
        if (redone === 'wait') return 'wait';
        if (redone) {
          // A new body is a new request: the old key would answer 422 ("this key was used for another body").
          await this.replace({ ...entry, request: redone, rebased: true, idempotencyKey: crypto.randomUUID() });
          return 'redone';
        }
      }
      const refusal =
        e instanceof ApiError
          ? { status: e.status, message: e.message, ...(e.details ? { details: e.details } : {}) }
          : { status: 0, message: e instanceof Error ? e.message : 'Not sent.' };
      await this.replace({ ...entry, state: 'refused', refusal });
      return 'refused';
    }
  }

  private async replace(entry: OutboxEntry) {
    await set(entry.seq, entry, this.store);
    this.list = this.list.map((e) => (e.seq === entry.seq ? entry : e));
    this.emit();
  }

  private emit() {
    this.snapshot = { entries: this.list, sending: this.sending, nextTryAt: this.nextTryAt };
    for (const l of this.listeners) l();
  }
}
