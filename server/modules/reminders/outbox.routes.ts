import { Router } from 'express';
import { simpleParser } from 'mailparser';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { outboxQuery, type OutboxMessageDto } from '../../../shared/schemas/reminders';
import type { AppConfig } from '../../config';
import { COMPANY_MAIL_HEADER, isLoopbackHost } from '../../lib/mailer';
import { readStoredMail } from '../../../fakes/smtp-outbox';

/** Only while mail really goes to the local fake (its folder named, the mail server on this machine). */
export const devOutboxEnabled = (config: Pick<AppConfig, 'FAKE_SMTP_OUTBOX' | 'SMTP_HOST'>) => Boolean(config.FAKE_SMTP_OUTBOX) && isLoopbackHost(config.SMTP_HOST);

/**
 * The local SMTP fake's messages, for development and tests: never mounted in a real deployment, and only the
 * company's owner sees it (their own company's mail), because its sign-in and invitation links sign the reader in as
 * the person they were sent to.
 */
export function outboxRoutes(ctx: AppContext) {
  const router = Router();
  const directory = ctx.config.FAKE_SMTP_OUTBOX;
  if (!directory || !devOutboxEnabled(ctx.config)) return router;
  defineRoute(router, 'get', '/dev/outbox', { access: { permission: 'dev:outbox' }, schemas: { query: outboxQuery } }, async ({ query }, _req, res) => {
    const { companyId } = currentMember(res);
    const ours = new RegExp(`^${COMPANY_MAIL_HEADER}: ${companyId}\\r?$`, 'im');
    const mine = readStoredMail(directory)
      .filter((m) => ours.test(m.raw.split(/\r?\n\r?\n/, 1)[0] ?? ''))
      .slice(0, query.limit);
    return Promise.all(
      mine.map(async (m): Promise<OutboxMessageDto> => {
        const parsed = await simpleParser(m.raw);
        return {
          id: m.id,
          to: m.to,
          subject: parsed.subject ?? '',
          date: (parsed.date ?? new Date(m.receivedAt)).toISOString(),
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : null,
          attachments: parsed.attachments.map((a) => ({
            filename: a.filename ?? 'attachment',
            contentType: a.contentType,
            size: a.size,
            text: a.contentType === 'text/calendar' ? a.content.toString('utf8') : null,
          })),
        };
      }),
    );
  });
  return router;
}
