import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

export { readStoredMail, type StoredMail } from './smtp-outbox';

/**
 * A local SMTP server on loopback that keeps every message as a .eml file, for development and tests only.
 * Its built-in certificate has expired, so STARTTLS is disabled and clients must not require TLS.
 */
export async function startFakeSmtp(options: { port: number; directory: string }) {
  fs.mkdirSync(options.directory, { recursive: true });
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const id = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
        const meta = {
          id,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          receivedAt: new Date().toISOString(),
        };
        fs.writeFileSync(path.join(options.directory, `${id}.eml`), Buffer.concat(chunks));
        fs.writeFileSync(path.join(options.directory, `${id}.json`), JSON.stringify(meta));
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : options.port;
  return {
    port,
    directory: options.directory,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
