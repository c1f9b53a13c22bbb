import fs from 'node:fs';
import path from 'node:path';

export type StoredMail = { id: string; from: string; to: string[]; receivedAt: string; raw: string };

/** The messages the local SMTP fake (fakes/smtp.ts) kept in its folder, newest first. Node built-ins only. */
export function readStoredMail(directory: string): StoredMail[] {
  if (!fs.existsSync(directory)) return [];
  return fs
    .readdirSync(directory)
    .filter((f) => f.endsWith('.json'))
    .map((f) => {
      const meta = JSON.parse(fs.readFileSync(path.join(directory, f), 'utf8'));
      return { ...meta, raw: fs.readFileSync(path.join(directory, f.replace(/\.json$/, '.eml')), 'utf8') } as StoredMail;
    })
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}
