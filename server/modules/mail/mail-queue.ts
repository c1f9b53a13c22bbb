import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db, DbOrTx } from '../../db/client';
import { serviceRequests } from '../../db/schema/index';
import type { Mail, Mailer } from '../../lib/mailer';
import { open, seal } from '../../lib/sealed-box';
import type { MailKind, MailStatus } from '../../../shared/schemas/mail';
import { MAIL_LEASE_SECONDS, MAIL_MAX_ATTEMPTS, isPermanentSmtpFailure, mailRetryDelaySeconds } from './mail-retry';
import { outgoingMailRepository as repo, type MailFilter, type OutgoingMailRow } from './outgoing-mail.repository';

/** Exported for tests, which open a queued message to see whose it is. */
export const MAIL_SEAL_PURPOSE = 'outgoing-mail';

export type MailMeta = {
  kind: MailKind;
  companyId: string | null;
  refId?: string | null;
  /** Cancel the still-queued messages about the same record (a fresh sign-in link makes an older one pointless). */
  replacesQueued?: boolean;
};

type Deps = { db: Db; mailer: Pick<Mailer, 'send'>; logger: Pick<Logger, 'warn'>; secret: string; clock?: () => Date };

const after = (at: Date, seconds: number) => new Date(at.getTime() + seconds * 1000);

/**
 * Every e-mail is first written to outgoing_mail (inside the caller's transaction where there is one), then tried at
 * once; a message the mail server did not take stays queued, and the `mail-delivery` job retries it with backoff.
 * Delivery is at least once: a process that dies after the server took a message but before it was marked sent
 * sends it again when the try's lease runs out.
 */
export function createMailQueue(deps: Deps) {
  const now = deps.clock ?? (() => new Date());

  async function enqueue(db: DbOrTx, mail: Mail, meta: MailMeta): Promise<string> {
    if (meta.replacesQueued && meta.refId) await repo.cancelQueued(db, meta.kind, meta.refId);
    return repo.insert(db, {
      kind: meta.kind,
      companyId: meta.companyId,
      refId: meta.refId ?? null,
      sealed: seal(deps.secret, MAIL_SEAL_PURPOSE, JSON.stringify(mail)),
      nextAttemptAt: now(),
    });
  }

  async function attempt(row: OutgoingMailRow, at: Date): Promise<Exclude<MailStatus, 'sending' | 'cancelled'>> {
    let mail: Mail;
    try {
      mail = JSON.parse(open(deps.secret, MAIL_SEAL_PURPOSE, row.sealed ?? '')) as Mail;
    } catch {
      await repo.markNotSent(deps.db, row.id, { status: 'failed', nextAttemptAt: at, lastError: 'the stored message could not be opened' });
      return 'failed';
    }
    let messageId: string;
    try {
      messageId = (await deps.mailer.send(mail)).messageId;
    } catch (err) {
      const giveUp = row.attempts >= MAIL_MAX_ATTEMPTS || isPermanentSmtpFailure(err);
      const status = giveUp ? 'failed' : 'queued';
      const lastError = err instanceof Error ? err.message.slice(0, 500) : String(err);
      await repo.markNotSent(deps.db, row.id, { status, nextAttemptAt: after(at, mailRetryDelaySeconds(row.attempts)), lastError });
      // The error's codes only: its message may name the recipients.
      const { code, responseCode } = (err ?? {}) as { code?: unknown; responseCode?: unknown };
      deps.logger.warn({ mailId: row.id, kind: row.kind, attempt: row.attempts, code, responseCode }, giveUp ? 'e-mail given up' : 'e-mail not taken by the mail server; queued for another try');
      return status;
    }
    const sentAt = now();
    await deps.db.transaction(async (tx) => {
      await repo.markSent(tx, row.id, sentAt, messageId);
      if (row.kind === 'service_request' && row.refId) {
        await tx.update(serviceRequests).set({ officeNotifiedAt: sentAt }).where(eq(serviceRequests.id, row.refId));
      }
    });
    return 'sent';
  }

  /** The first try of a message just written; answers its status afterwards (`queued` while the server is away). */
  async function deliver(id: string): Promise<MailStatus> {
    const at = now();
    const row = await repo.claimFresh(deps.db, id, after(at, MAIL_LEASE_SECONDS));
    if (!row) return (await repo.status(deps.db, id)) ?? 'failed';
    return attempt(row, at);
  }

  /** The job's sweep: every due message, oldest first, until the queue is empty or the mail server fails again. */
  async function deliverDue(options: MailFilter & { now?: Date; max?: number } = {}) {
    const at = options.now ?? now();
    const counts = { sent: 0, queued: 0, failed: 0 };
    for (let i = 0; i < (options.max ?? 500); i++) {
      const row = await repo.claimNextDue(deps.db, at, after(at, MAIL_LEASE_SECONDS), options);
      if (!row) break;
      const status = await attempt(row, at);
      counts[status] += 1;
      // Still away: the rest wait for the next run instead of each timing out now.
      if (status === 'queued') break;
    }
    return counts;
  }

  return {
    enqueue,
    deliver,
    deliverDue,
    /** Enqueue outside any transaction, then try at once. */
    send: async (mail: Mail, meta: MailMeta) => deliver(await enqueue(deps.db, mail, meta)),
  };
}

export type MailQueue = ReturnType<typeof createMailQueue>;
