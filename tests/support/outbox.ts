import { faker } from '@faker-js/faker';
import { simpleParser, type ParsedMail } from 'mailparser';
import { inject } from 'vitest';
import { readStoredMail, type StoredMail } from '../../fakes/smtp';

/** Other test files share the SMTP fake, so each test picks its mail out by an address nobody else uses. */
export const uniqueEmail = () => `${faker.string.alphanumeric(14).toLowerCase()}@example.test`;

export function mailTo(address: string): StoredMail[] {
  return readStoredMail(inject('outboxDir')).filter((m) => m.to.includes(address));
}

export async function parsedMailTo(address: string): Promise<ParsedMail[]> {
  return Promise.all(mailTo(address).map((m) => simpleParser(m.raw)));
}

/** Bounded polling for work done in the background (a queue worker): gives up after `tries`, never asserts on time. */
export async function eventually<T>(probe: () => Promise<T | null | undefined | false>, { tries = 120, everyMs = 250 } = {}): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const value = await probe();
    if (value) return value;
    await new Promise((r) => setTimeout(r, everyMs));
  }
  throw new Error(`gave up waiting after ${tries} tries`);
}
