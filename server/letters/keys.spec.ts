import { generateKeyPairSync, X509Certificate } from 'node:crypto';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureDevKeys, generateSigningKeys, KEY_ENV, keyIdFor, loadKeysFromEnv, loadOfficeKeys, type SigningKeys } from './keys';

const SUBJECT = { officeName: 'Office of Institutional Effectiveness', unit: 'Harrow Vale Community College' };
let dir: string;
let keys: SigningKeys;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'assayer-keys-'));
  keys = generateSigningKeys(SUBJECT, { passphrase: 'correct horse' });
}, 30_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('office keys', () => {
  it('makes a self-signed certificate naming the office and a key id from the public parts', () => {
    const cert = new X509Certificate(keys.certPem);
    expect(cert.subject).toContain('CN=Office of Institutional Effectiveness');
    expect(cert.subject).toContain('O=Harrow Vale Community College');
    expect(cert.issuer).toBe(cert.subject);
    expect(cert.verify(cert.publicKey)).toBe(true);
    expect(keys.keyId).toMatch(/^key-[0-9a-f]{16}$/);
    expect(keyIdFor(keys.certPem, keys.recordPublicKeyPem)).toBe(keys.keyId);
  });

  it('keeps development keys across restarts, with private files readable by the owner only', () => {
    const kdir = join(dir, 'dev');
    const first = ensureDevKeys(kdir, SUBJECT);
    const again = ensureDevKeys(kdir, SUBJECT);
    expect(again.current.keyId).toBe(first.current.keyId);
    expect(again.current.p12.equals(first.current.p12)).toBe(true);
    expect(statSync(join(kdir, first.current.keyId, 'office.p12')).mode & 0o777).toBe(0o600);
    expect(statSync(join(kdir, first.current.keyId, 'record-private.pem')).mode & 0o777).toBe(0o600);
  }, 30_000);

  it('loads production keys from configured files and explains configuration mistakes', () => {
    const p12 = join(dir, 'office.p12');
    const record = join(dir, 'record.pem');
    writeFileSync(p12, keys.p12);
    writeFileSync(record, keys.recordPrivateKeyPem);
    const env = { [KEY_ENV.p12]: p12, [KEY_ENV.passphrase]: 'correct horse', [KEY_ENV.recordKey]: record };
    const loaded = loadKeysFromEnv(env)!;
    expect(loaded.current.keyId).toBe(keys.keyId);
    expect(loaded.ring.entries.map((e) => e.keyId)).toEqual([keys.keyId]);

    expect(() => loadKeysFromEnv({ ...env, [KEY_ENV.passphrase]: 'wrong' })).toThrow(/Cannot read the signing PKCS#12.*ASSAYER_SIGNING_P12_PASSPHRASE/);
    expect(() => loadKeysFromEnv({ [KEY_ENV.p12]: p12 })).toThrow(/ASSAYER_RECORD_KEY/);
    const rsa = join(dir, 'rsa.pem');
    writeFileSync(rsa, generateKeyPairSync('rsa', { modulusLength: 1024 }).privateKey.export({ type: 'pkcs8', format: 'pem' }));
    expect(() => loadKeysFromEnv({ ...env, [KEY_ENV.recordKey]: rsa })).toThrow(/must be an Ed25519 private key; found rsa/);
    expect(loadKeysFromEnv({})).toBeNull();
    expect(() => loadOfficeKeys(SUBJECT, { env: { NODE_ENV: 'production' }, dir: join(dir, 'never') })).toThrow(/No signing keys configured/);
  });
});
