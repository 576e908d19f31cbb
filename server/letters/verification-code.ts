/**
 * Verification codes printed on letters: 11 random Crockford base-32 symbols plus one
 * check symbol (Luhn mod 32), shown as three groups of four, e.g. "7KQ2-M9XD-4TBH".
 * The alphabet leaves out I, L, O and U so codes survive being read aloud or retyped.
 */
import { randomInt } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
const PAYLOAD_LENGTH = 11;
/** Total symbols in a code, check symbol included. */
export const CODE_LENGTH = PAYLOAD_LENGTH + 1;

/** Luhn mod N check symbol: catches every single-symbol error and most swaps of neighbours. */
function checkSymbol(payload: string): string {
  const n = ALPHABET.length;
  let factor = 2;
  let sum = 0;
  for (let i = payload.length - 1; i >= 0; i--) {
    let addend = factor * ALPHABET.indexOf(payload[i]);
    factor = factor === 2 ? 1 : 2;
    addend = Math.floor(addend / n) + (addend % n);
    sum += addend;
  }
  return ALPHABET[(n - (sum % n)) % n];
}

/** Puts dashes between groups of four symbols. */
function group(raw: string): string {
  return raw.match(/.{1,4}/g)!.join('-');
}

/** Draws a fresh code from the operating system's random source. */
export function newVerificationCode(): string {
  let payload = '';
  for (let i = 0; i < PAYLOAD_LENGTH; i++) payload += ALPHABET[randomInt(ALPHABET.length)];
  return group(payload + checkSymbol(payload));
}

/** Result of reading a code someone typed or scanned. */
export type ParsedCode = { ok: true; code: string } | { ok: false; message: string };

/**
 * Normalises a typed code: ignores case, spaces and dashes, reads O as 0 and I or L as 1,
 * and checks the check symbol. Returns the canonical dashed form or a plain-language reason.
 */
export function parseVerificationCode(input: string): ParsedCode {
  const cleaned = String(input ?? '')
    .toUpperCase()
    .replace(/[\s\-_.]/g, '')
    .replace(/O/g, '0')
    .replace(/[IL]/g, '1');
  if (cleaned.length === 0) return { ok: false, message: 'Enter the verification code printed at the foot of the letter.' };
  const bad = [...cleaned].find((ch) => !ALPHABET.includes(ch));
  if (bad) return { ok: false, message: `The verification code cannot contain "${bad}". Codes use digits and the letters A–Z except I, L, O and U.` };
  if (cleaned.length !== CODE_LENGTH) {
    return { ok: false, message: `A verification code has ${CODE_LENGTH} characters; this one has ${cleaned.length}.` };
  }
  const payload = cleaned.slice(0, PAYLOAD_LENGTH);
  if (checkSymbol(payload) !== cleaned[PAYLOAD_LENGTH]) {
    return { ok: false, message: 'This verification code contains a typing error: please check each character against the letter.' };
  }
  return { ok: true, code: group(cleaned) };
}
