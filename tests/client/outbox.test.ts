import 'fake-indexeddb/auto';
import { createStore } from 'idb-keyval';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Outbox, type NewOutboxEntry, type OutboxHandlers } from '@/lib/offline/outbox';

// The outbox against a real IndexedDB implementation (fake-indexeddb) and a stubbed fetch: order, keys, refusals.

type Sent = { method: string; url: string; key: string | null; body: unknown };

let stores = 0;
const freshStore = () => createStore(`outbox-test-${++stores}`, 'entries');
const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function server(answer: (req: Sent, n: number) => Response | 'no-signal') {
  const sent: Sent[] = [];
  vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
    const req = { method: init.method ?? 'GET', url, key: new Headers(init.headers).get('Idempotency-Key'), body: init.body ? JSON.parse(String(init.body)) : undefined };
    const reply = answer(req, sent.length);
    sent.push(req);
    if (reply === 'no-signal') throw new TypeError('Failed to fetch');
    return reply;
  });
  return sent;
}

const entry = (visitId: string, label: string, body: Record<string, unknown> = {}): NewOutboxEntry => ({
  kind: 'part-swap',
  visitId,
  label,
  request: { method: 'POST', path: `/visits/${visitId}/swaps`, body: { label, ...body } },
});

let running: Outbox[] = [];
function outboxOn(store = freshStore(), handlers: OutboxHandlers = {}) {
  const box = new Outbox('user-1', store, handlers);
  running.push(box);
  return box;
}

afterEach(() => {
  for (const box of running) box.stop();
  running = [];
  vi.unstubAllGlobals();
});

describe('the outbox', () => {
  it('sends queued writes in order, each with its own Idempotency-Key, and forgets each once the server has it', async () => {
    const sent = server(() => json({ ok: true }));
    const onSent = vi.fn();
    const box = outboxOn(freshStore(), { onSent });
    await box.add(entry('v1', 'first'));
    await box.add(entry('v1', 'second'));
    await box.add(entry('v2', 'third'));
    box.start();
    await vi.waitFor(() => expect(box.getSnapshot().entries).toEqual([]));
    expect(sent.map((s) => [s.method, s.url, (s.body as { label: string }).label])).toEqual([
      ['POST', '/api/visits/v1/swaps', 'first'],
      ['POST', '/api/visits/v1/swaps', 'second'],
      ['POST', '/api/visits/v2/swaps', 'third'],
    ]);
    expect(new Set(sent.map((s) => s.key)).size).toBe(3);
    expect(sent.every((s) => /^[0-9a-f-]{36}$/.test(s.key ?? ''))).toBe(true);
    expect(onSent.mock.calls.map(([e]) => e.label)).toEqual(['first', 'second', 'third']);
  });

  it('keeps everything, in order, with no signal; a new start (a reload) finds it and sends it with the same keys', async () => {
    const store = freshStore();
    let signal = false;
    const sent = server(() => (signal ? json({}) : 'no-signal'));
    const first = outboxOn(store);
    first.start();
    await first.add(entry('v1', 'start'));
    await first.add(entry('v1', 'finish'));
    await vi.waitFor(() => expect(sent.length).toBeGreaterThanOrEqual(1));
    first.stop();
    const keysBefore = first.getSnapshot().entries.map((e) => e.idempotencyKey);
    expect(first.getSnapshot().entries.map((e) => [e.label, e.state])).toEqual([
      ['start', 'waiting'],
      ['finish', 'waiting'],
    ]);

    signal = true;
    const again = outboxOn(store);
    await again.load();
    expect(again.getSnapshot().entries.map((e) => e.label)).toEqual(['start', 'finish']);
    again.start();
    await vi.waitFor(() => expect(again.getSnapshot().entries).toEqual([]));
    const delivered = sent.filter((s, i) => i >= sent.length - 2);
    expect(delivered.map((s) => s.key)).toEqual(keysBefore);
  });

  it('shows a refusal (400) with its field errors, holds back that visit’s later writes, and lets the others go', async () => {
    const sent = server((req) =>
      (req.body as { label: string }).label === 'bad swap'
        ? json({ error: { code: 'validation_failed', message: 'Check the fields.', details: { cause: ['Say why the old part came out.'] } } }, 400)
        : json({}),
    );
    const box = outboxOn();
    await box.add(entry('v1', 'bad swap'));
    await box.add(entry('v1', 'finish v1'));
    await box.add(entry('v2', 'finish v2'));
    box.start();
    await vi.waitFor(() => expect(sent.map((s) => (s.body as { label: string }).label)).toEqual(['bad swap', 'finish v2']));
    await vi.waitFor(() => expect(box.getSnapshot().sending).toBe(false));
    expect(box.getSnapshot().entries.map((e) => [e.label, e.state, e.refusal?.details])).toEqual([
      ['bad swap', 'refused', { cause: ['Say why the old part came out.'] }],
      ['finish v1', 'waiting', undefined],
    ]);
    expect(box.holds('v1')).toBe(true);
    expect(box.holds('v2')).toBe(false);

    // Discarding the refused write lets the visit's next one go.
    await box.discard(box.getSnapshot().entries[0].seq);
    await vi.waitFor(() => expect(box.getSnapshot().entries).toEqual([]));
    expect(sent.map((s) => (s.body as { label: string }).label)).toEqual(['bad swap', 'finish v2', 'finish v1']);
  });

  it('answers a 409 once by redoing the write on the server’s copy under a new key, and refuses a second 409', async () => {
    const sent = server((req) => ((req.body as { revision: number }).revision === 0 ? json({ error: { code: 'conflict', message: 'Changed elsewhere.' } }, 409) : json({ revision: 2 })));
    const onConflict = vi.fn(async () => ({ method: 'POST' as const, path: '/visits/v1/complete', body: { revision: 1 } }));
    const box = outboxOn(freshStore(), { onConflict });
    await box.add({ kind: 'visit-complete', visitId: 'v1', label: 'finish', request: { method: 'POST', path: '/visits/v1/complete', body: { revision: 0 } } });
    box.start();
    await vi.waitFor(() => expect(box.getSnapshot().entries).toEqual([]));
    expect(sent.map((s) => (s.body as { revision: number }).revision)).toEqual([0, 1]);
    expect(sent[0].key).not.toBe(sent[1].key);

    const always409 = server(() => json({ error: { code: 'conflict', message: 'Changed elsewhere.' } }, 409));
    await box.add({ kind: 'visit-complete', visitId: 'v2', label: 'finish v2', request: { method: 'POST', path: '/visits/v2/complete', body: { revision: 0 } } });
    await vi.waitFor(() => expect(box.getSnapshot().entries.map((e) => e.state)).toEqual(['refused']));
    expect(always409).toHaveLength(2);
    expect(box.getSnapshot().entries[0].refusal).toMatchObject({ status: 409, message: 'Changed elsewhere.' });
  });

  it('waits, keeping its key, while the server says the same key’s first request is still running', async () => {
    const sent = server((_req, n) => (n === 0 ? json({ error: { code: 'idempotency_key_in_progress', message: 'Still working on it.' } }, 409) : json({})));
    const onConflict = vi.fn(async () => null);
    const box = outboxOn(freshStore(), { onConflict });
    await box.add(entry('v1', 'swap'));
    box.start();
    await vi.waitFor(() => expect(sent).toHaveLength(1));
    expect(box.getSnapshot().entries.map((e) => e.state)).toEqual(['waiting']);
    box.retryNow();
    await vi.waitFor(() => expect(box.getSnapshot().entries).toEqual([]));
    expect(sent.map((s) => s.key)).toEqual([sent[0].key, sent[0].key]);
    expect(onConflict).not.toHaveBeenCalled();
  });
});
