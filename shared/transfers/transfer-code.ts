/**
 * A record-transfer code: 16 symbols of Crockford's base32 (no I, L, O or U), shown in four groups of four, 80 random
 * bits. Typed back, case, spaces and dashes do not matter, and the look-alikes O, I and L read as 0, 1 and 1
 * (Crockford, "Base 32", https://www.crockford.com/base32.html).
 */
export const TRANSFER_CODE_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
export const TRANSFER_CODE_LENGTH = 16;

/** What a typed code means, or null when it cannot be one of ours. */
export function normalizeTransferCode(typed: string): string | null {
  const plain = typed
    .toUpperCase()
    .replace(/[\s-]/g, '')
    .replace(/O/g, '0')
    .replace(/[IL]/g, '1');
  if (plain.length !== TRANSFER_CODE_LENGTH) return null;
  for (const ch of plain) if (!TRANSFER_CODE_ALPHABET.includes(ch)) return null;
  return plain;
}

/** "7K2MQ9XD..." → "7K2M-Q9XD-...": how the code is shown and read aloud. */
export const groupTransferCode = (plain: string) => plain.match(/.{1,4}/g)!.join('-');

/** Turns random bytes (one per symbol) into a code; 256 is a multiple of 32, so every symbol is equally likely. */
export function transferCodeFromBytes(bytes: Uint8Array): string {
  if (bytes.length < TRANSFER_CODE_LENGTH) throw new Error(`need ${TRANSFER_CODE_LENGTH} random bytes`);
  let out = '';
  for (let i = 0; i < TRANSFER_CODE_LENGTH; i++) out += TRANSFER_CODE_ALPHABET[bytes[i]! % 32];
  return out;
}
