import { Router } from 'express';
import { simpleParser } from 'mailparser';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { outboxQuery, type OutboxMessageDto } from '../../../shared/schemas/reminders';
import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import { readStoredMail } from '../../../fakes/smtp-outbox';

/**
 * The local SMTP fake's messages, for development and tests. Mounted only when FAKE_SMTP_OUTBOX is set (never in a
 * real deployment), and a company sees only the mail it sent.
 */
export function outboxRoutes(ctx: AppContext) {
  const router = Router();
  const directory = ctx.config.FAKE_SMTP_OUTBOX;
  if (!directory) return router;
  defineRoute(router, 'get', '/dev/outbox', { access: { permission: 'reminders:send' }, schemas: { query: outboxQuery } }, async ({ query }, _req, res) => {
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
        };
      }),
    );
  });
  return router;
}
