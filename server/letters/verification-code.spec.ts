import { describe, expect, it } from 'vitest';
import { CODE_LENGTH, newVerificationCode, parseVerificationCode } from './verification-code';

const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';

describe('verification codes', () => {
  it('draws codes in three dashed groups that parse back to themselves', () => {
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const code = newVerificationCode();
      expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}-[0-9A-HJKMNP-TV-Z]{4}-[0-9A-HJKMNP-TV-Z]{4}$/);
      expect(parseVerificationCode(code)).toEqual({ ok: true, code });
      seen.add(code);
    }
    expect(seen.size).toBe(200);
  });

  it('accepts lower case, spaces, missing dashes and the confusable letters O, I and L', () => {
    const code = newVerificationCode();
    const typed = ` ${code.replace(/-/g, ' ').toLowerCase()} `.replace(/0/g, 'o').replace(/1/g, 'l');
    expect(parseVerificationCode(typed)).toEqual({ ok: true, code });
  });

  it('catches every single-character substitution at every position', () => {
    const code = newVerificationCode().replace(/-/g, '');
    for (let pos = 0; pos < CODE_LENGTH; pos++) {
      for (const ch of ALPHABET) {
        if (ch === code[pos]) continue;
        const wrong = code.slice(0, pos) + ch + code.slice(pos + 1);
        const parsed = parseVerificationCode(wrong);
        expect(parsed.ok, `${wrong} (position ${pos}) should fail`).toBe(false);
      }
    }
  });

  it('explains what is wrong with malformed input', () => {
    expect(parseVerificationCode('')).toMatchObject({ ok: false, message: expect.stringContaining('Enter the verification code') });
    expect(parseVerificationCode('ABCD-EFGH')).toMatchObject({ ok: false, message: expect.stringContaining('has 12 characters; this one has 8') });
    expect(parseVerificationCode('ABCD-EFGH-123U')).toMatchObject({ ok: false, message: expect.stringContaining('cannot contain "U"') });
  });
});
