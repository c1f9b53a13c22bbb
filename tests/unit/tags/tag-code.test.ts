import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkCharacter, checkTagCode, formatTagCode, generateTagCode, luhnModNCheck, normalizeTagCode, TAG_ALPHABET } from '../../../shared/tags/tag-code';

const body = fc.array(fc.constantFrom(...TAG_ALPHABET), { minLength: 7, maxLength: 7 }).map((cs) => cs.join(''));

describe('tag codes', () => {
  it('uses no easily confused characters', () => {
    for (const ch of '01OILZ') expect(TAG_ALPHABET).not.toContain(ch);
    expect(new Set(TAG_ALPHABET).size).toBe(TAG_ALPHABET.length);
  });

  it('reproduces the published Luhn example when the alphabet is the digits', () => {
    // Source: ISO/IEC 7812-1 Luhn algorithm; the widely published example account number 7992739871 has check digit 3.
    expect(luhnModNCheck('7992739871', '0123456789')).toBe('3');
    expect(luhnModNCheck('7992739871', '0123456789')).not.toBe('4');
  });

  it('accepts generated codes, in any case and with a dash or spaces', () => {
    const code = generateTagCode();
    expect(code).toHaveLength(8);
    expect(checkTagCode(code)).toEqual({ ok: true, code });
    expect(checkTagCode(formatTagCode(code).toLowerCase())).toEqual({ ok: true, code });
    expect(normalizeTagCode(' ab-cd ')).toBe('ABCD');
  });

  it('catches every single mistyped character', () => {
    fc.assert(
      fc.property(body, fc.nat(7), fc.nat(TAG_ALPHABET.length - 2), (b, pos, shift) => {
        const code = b + checkCharacter(b);
        const i = pos % code.length;
        const wrong = TAG_ALPHABET[(TAG_ALPHABET.indexOf(code[i]) + 1 + shift) % TAG_ALPHABET.length];
        const typo = code.slice(0, i) + wrong + code.slice(i + 1);
        expect(checkTagCode(typo).ok).toBe(false);
      }),
    );
  });

  it('catches swapped neighbours except the one pair Luhn mod N cannot see', () => {
    let missed = 0;
    fc.assert(
      fc.property(body, fc.nat(6), (b, pos) => {
        const code = b + checkCharacter(b);
        const swapped = code.slice(0, pos) + code[pos + 1] + code[pos] + code.slice(pos + 2);
        if (swapped !== code && checkTagCode(swapped).ok) missed++;
      }),
      { numRuns: 3000 },
    );
    // Two neighbours are invisible only when they are the alphabet's first and last characters.
    expect(missed).toBeLessThan(20);
  });

  it('says which character can never appear', () => {
    expect(checkTagCode('WF3K9X2O')).toEqual({ ok: false, reason: "'O' never appears in a tag code (did you mean D or Q?)." });
    expect(checkTagCode('ABC')).toEqual({ ok: false, reason: 'A tag code has 8 characters.' });
  });
});
