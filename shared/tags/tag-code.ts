/**
 * Tag codes: the short text printed under a tag's QR. The alphabet leaves out characters people confuse
 * (0/O, 1/I/L, Z/2) and the last character is a Luhn mod N check character, so a mistyped code is caught.
 * Luhn mod N (the generalisation of ISO/IEC 7812-1's Luhn algorithm to any alphabet) detects every
 * single-character error and every transposition of adjacent characters except one pair per alphabet.
 */
// 30 characters: Luhn mod N needs an even N (its doubling step is a permutation only then), and Z goes since it reads as 2.
export const TAG_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXY';
const N = TAG_ALPHABET.length;
export const TAG_BODY_LENGTH = 7;

/** Luhn mod N check character of `body` over `alphabet` (with the digits 0–9 it is the familiar Luhn digit). */
export function luhnModNCheck(body: string, alphabet: string): string {
  const n = alphabet.length;
  let factor = 2;
  let sum = 0;
  for (let i = body.length - 1; i >= 0; i--) {
    const point = alphabet.indexOf(body[i]);
    if (point < 0) throw new Error(`'${body[i]}' is not in the alphabet`);
    let addend = factor * point;
    factor = factor === 2 ? 1 : 2;
    addend = Math.floor(addend / n) + (addend % n);
    sum += addend;
  }
  return alphabet[(n - (sum % n)) % n];
}

export const checkCharacter = (body: string) => luhnModNCheck(body, TAG_ALPHABET);

/** Upper-cases and drops spaces and dashes, so "wf3k-9x2 a" and "WF3K9X2A" are the same code. */
export function normalizeTagCode(input: string): string {
  return input.toUpperCase().replace(/[\s-]/g, '');
}

export type TagCodeCheck = { ok: true; code: string } | { ok: false; reason: string };

export function checkTagCode(input: string): TagCodeCheck {
  const code = normalizeTagCode(input);
  if (code.length !== TAG_BODY_LENGTH + 1) return { ok: false, reason: `A tag code has ${TAG_BODY_LENGTH + 1} characters.` };
  const bad = [...code].find((ch) => !TAG_ALPHABET.includes(ch));
  if (bad) {
    const hint = { '0': ' (did you mean 9 or D?)', O: ' (did you mean D or Q?)', '1': ' (did you mean 7?)', I: ' (did you mean J or T?)', L: '' }[bad] ?? '';
    return { ok: false, reason: `'${bad}' never appears in a tag code${hint}.` };
  }
  if (checkCharacter(code.slice(0, -1)) !== code.slice(-1)) return { ok: false, reason: 'This code does not check out: a character is mistyped.' };
  return { ok: true, code };
}

/** A new code from random bytes (crypto.getRandomValues in the browser and Node). */
export function generateTagCode(randomBytes: (n: number) => Uint8Array = (n) => crypto.getRandomValues(new Uint8Array(n))): string {
  let body = '';
  while (body.length < TAG_BODY_LENGTH) {
    for (const b of randomBytes(TAG_BODY_LENGTH * 2)) {
      // Rejection sampling keeps every character equally likely (256 is not a multiple of 30).
      if (b < 256 - (256 % N) && body.length < TAG_BODY_LENGTH) body += TAG_ALPHABET[b % N];
    }
  }
  return body + checkCharacter(body);
}

/** Printed as two groups of four for reading aloud, e.g. "WF3K-9X2A". */
export const formatTagCode = (code: string) => `${code.slice(0, 4)}-${code.slice(4)}`;
