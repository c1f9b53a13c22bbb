import { describe, expect, it } from 'vitest';
import { groupTransferCode, normalizeTransferCode, TRANSFER_CODE_ALPHABET, transferCodeFromBytes } from '../../../shared/transfers/transfer-code';
import { provenanceWords } from '../../../shared/transfers/provenance-words';

describe('transfer codes', () => {
  it('uses Crockford base32: 32 symbols, without I, L, O and U', () => {
    // Source: Douglas Crockford, "Base 32" (https://www.crockford.com/base32.html), the encode symbol table.
    expect(TRANSFER_CODE_ALPHABET).toBe('0123456789ABCDEFGHJKMNPQRSTVWXYZ');
    expect(TRANSFER_CODE_ALPHABET).toHaveLength(32);
  });

  it('reads a typed code leniently: case, spaces, dashes, and O, I, L as 0, 1, 1', () => {
    // Source: Crockford, "Base 32": decoding accepts lower case, and o/O as 0, i/I/l/L as 1; hyphens are ignored.
    expect(normalizeTransferCode('7k2m-q9xd 4hpt-wb3c')).toBe('7K2MQ9XD4HPTWB3C');
    expect(normalizeTransferCode('OIL0-0000-0000-0000')).toBe('0110000000000000');
    expect(normalizeTransferCode('7K2M-Q9XD-4HPT-WB3')).toBeNull();
    expect(normalizeTransferCode('UUUU-UUUU-UUUU-UUUU')).toBeNull();
  });

  it('makes 16 symbols from 16 bytes, 5 bits each (80 bits), shown in groups of four', () => {
    const bytes = Uint8Array.from({ length: 16 }, (_, i) => i * 17);
    const code = transferCodeFromBytes(bytes);
    // i·17 mod 32 = 0, 17, 2, 19, 4, 21, …: every other symbol walks the table from 0, the rest from H.
    expect(code).toBe('0H2K4N6Q8SAVCXEZ');
    expect(groupTransferCode(code)).toBe('0H2K-4N6Q-8SAV-CXEZ');
    expect(normalizeTransferCode(groupTransferCode(code))).toBe(code);
  });

  it('says who recorded a copied record and the day it arrived, on the company’s clocks', () => {
    // 02:30 UTC on Feb 4 is still Feb 3 in New York (UTC−5 in February).
    expect(provenanceWords({ senderName: 'Marsh Row Heating', receivedAt: '2027-02-04T02:30:00.000Z' }, 'America/New_York')).toBe(
      'Recorded by another company (Marsh Row Heating); imported Feb 3, 2027',
    );
  });
});
