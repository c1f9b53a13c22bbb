import { validationFailed } from '../../lib/http-error';

export type CustomerSort = 'name' | 'town' | 'created';

/** Opaque to the client: the sort it belongs to and the sort key of the last row of the page, as text. */
export function encodeCustomerCursor(sort: CustomerSort, keys: string[]): string {
  return Buffer.from(JSON.stringify({ s: sort, k: keys })).toString('base64url');
}

export function decodeCustomerCursor(sort: CustomerSort, cursor: string, keyCount: number): string[] {
  try {
    const parsed: unknown = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
    if (parsed && typeof parsed === 'object' && 's' in parsed && 'k' in parsed) {
      const { s, k } = parsed as { s: unknown; k: unknown };
      if (s === sort && Array.isArray(k) && k.length === keyCount && k.every((v) => typeof v === 'string')) return k as string[];
    }
  } catch {
    // fall through to the field error
  }
  throw validationFailed({ after: ['This page link is out of date; start again from the first page.'] });
}
