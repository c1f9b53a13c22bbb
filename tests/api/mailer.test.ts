import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readStoredMail, startFakeSmtp } from '../../fakes/smtp';
import { createMailer } from '../../server/lib/mailer';
import { freePort } from '../support/global-setup';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-mail-'));
let smtp: Awaited<ReturnType<typeof startFakeSmtp>>;

beforeAll(async () => {
  smtp = await startFakeSmtp({ port: await freePort(), directory: dir });
});
afterAll(async () => {
  await smtp.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('mail through SMTP to the local fake', () => {
  it('delivers a message with a text and an HTML part to the right recipient', async () => {
    const mailer = createMailer({ SMTP_HOST: '127.0.0.1', SMTP_PORT: smtp.port, SMTP_SECURE: false, MAIL_FROM: 'Lifeplate <no-reply@lifeplate.test>' });
    const sent = await mailer.send({ to: 'agnes@example.test', subject: 'Annual service due', text: 'Plain words.', html: '<p>Plain <b>words</b>.</p>' });
    mailer.close();
    expect(sent.accepted).toEqual(['agnes@example.test']);
    const [mail] = readStoredMail(dir);
    expect(mail.to).toEqual(['agnes@example.test']);
    expect(mail.from).toBe('no-reply@lifeplate.test');
    expect(mail.raw).toMatch(/^Subject: Annual service due/m);
    expect(mail.raw).toMatch(/Content-Type: text\/plain/);
    expect(mail.raw).toMatch(/Content-Type: text\/html/);
  });
});
