import { generateKeyPairSync } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { buildRecord, canonicalJson, signRecord, verifyRecord } from './canonical-record';
import { advisingLetter } from './sample-letters';

describe('canonical record', () => {
  it('serialises with sorted keys at every depth, without whitespace or undefined members', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: true, y: null }], c: 'x' }, u: undefined })).toBe('{"a":{"c":"x","d":[3,{"y":null,"z":true}]},"b":1}');
    expect(canonicalJson({ a: 1, b: 2 })).toBe(canonicalJson({ b: 2, a: 1 }));
    expect(() => canonicalJson({ x: Number.NaN })).toThrow(/NaN/);
  });

  it('signs with Ed25519 and rejects any change to the record or a different key', () => {
    const { privateKey, publicKey } = generateKeyPairSync('ed25519');
    const other = generateKeyPairSync('ed25519');
    const priv = privateKey.export({ type: 'pkcs8', format: 'pem' }) as string;
    const pub = publicKey.export({ type: 'spki', format: 'pem' }) as string;
    const record = buildRecord(advisingLetter('7KQ2-M9XD-4TBH', 'https://x.test/verify/7KQ2-M9XD-4TBH'), 'key-0123456789abcdef', 'ab'.repeat(32));
    const sig = signRecord(record, priv);
    expect(verifyRecord(record, sig, pub)).toBe(true);
    expect(verifyRecord({ ...record, decision: 'endorse' }, sig, pub)).toBe(false);
    expect(verifyRecord({ ...record, conditions: [...record.conditions, 'extra'] }, sig, pub)).toBe(false);
    expect(verifyRecord(record, sig, other.publicKey.export({ type: 'spki', format: 'pem' }) as string)).toBe(false);
    expect(verifyRecord(record, 'not base64 at all', pub)).toBe(false);
  });
});
