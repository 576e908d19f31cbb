/**
 * The office's signing material and key ring.
 *
 * Each key set has an RSA key with a self-signed X.509 certificate, packed as a
 * PKCS#12 (3DES) for the embedded PDF signature, and an Ed25519 key pair that signs
 * the letter's canonical record. A key set's id is derived from its public parts.
 * Rotation adds a new set and retires the old one without deleting it: the ring keeps
 * every certificate and record public key, so letters signed earlier stay verifiable.
 *
 * Development: keys are generated into a keys directory (default RUN_DIR/keys).
 * Production: set ASSAYER_SIGNING_P12, ASSAYER_SIGNING_P12_PASSPHRASE and
 * ASSAYER_RECORD_KEY (and ASSAYER_KEY_RING for retired public material).
 */
import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, randomBytes, X509Certificate } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import forge from 'node-forge';

/** A complete key set able to sign letters. */
export interface SigningKeys {
  keyId: string;
  createdAt: string;
  /** PEM of the self-signed certificate embedded in PDF signatures. */
  certPem: string;
  /** PKCS#12 holding the RSA key and certificate. */
  p12: Buffer;
  passphrase: string;
  /** Ed25519 private key (PKCS#8 PEM) that signs canonical records. */
  recordPrivateKeyPem: string;
  /** Ed25519 public key (SPKI PEM). */
  recordPublicKeyPem: string;
}

/** Public half of a key set, kept in the ring for as long as letters exist. */
export interface KeyRingEntry {
  keyId: string;
  createdAt: string;
  /** Set when a newer key set took over; the entry still verifies old letters. */
  retiredAt: string | null;
  /** Certificate subject, for messages. */
  subject: string;
  certPem: string;
  recordPublicKeyPem: string;
}

/** All public key material the office has ever signed with. */
export interface KeyRing {
  entries: KeyRingEntry[];
}

/** The key set in use plus the ring of everything still verifiable. */
export interface OfficeKeys {
  current: SigningKeys;
  ring: KeyRing;
}

/** Who the certificate names. */
export interface CertificateSubject {
  officeName: string;
  /** Institution (certificate organisation). */
  unit?: string;
  /** Country code for the certificate, optional. */
  country?: string;
}

/** SHA-256 of a certificate's DER encoding, hex. */
export function certificateFingerprint(certPemOrDer: string | Buffer): string {
  const der = typeof certPemOrDer === 'string' ? new X509Certificate(certPemOrDer).raw : certPemOrDer;
  return createHash('sha256').update(der).digest('hex');
}

/** Key id: first 16 hex digits of SHA-256 over the certificate and the record public key. */
export function keyIdFor(certPem: string, recordPublicKeyPem: string): string {
  const certDer = new X509Certificate(certPem).raw;
  const recordDer = createPublicKey(recordPublicKeyPem).export({ type: 'spki', format: 'der' });
  const hex = createHash('sha256').update(certDer).update(recordDer).digest('hex');
  return `key-${hex.slice(0, 16)}`;
}

/**
 * Generates a fresh key set. The RSA key comes from Node's crypto (fast, native);
 * node-forge only builds the certificate and the PKCS#12 container.
 */
export function generateSigningKeys(subject: CertificateSubject, opts: { now?: Date; validYears?: number; passphrase?: string } = {}): SigningKeys {
  const now = opts.now ?? new Date();
  const rsa = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const forgePrivate = forge.pki.privateKeyFromPem(rsa.privateKey.export({ type: 'pkcs1', format: 'pem' }) as string);
  const forgePublic = forge.pki.publicKeyFromPem(rsa.publicKey.export({ type: 'spki', format: 'pem' }) as string);

  const cert = forge.pki.createCertificate();
  cert.publicKey = forgePublic;
  // Leading 01 keeps the serial positive in DER.
  cert.serialNumber = '01' + randomBytes(12).toString('hex');
  cert.validity.notBefore = new Date(now.getTime() - 60_000);
  cert.validity.notAfter = new Date(now.getTime());
  cert.validity.notAfter.setUTCFullYear(now.getUTCFullYear() + (opts.validYears ?? 10));
  const attrs: forge.pki.CertificateField[] = [{ name: 'commonName', value: subject.officeName }];
  if (subject.unit) attrs.push({ name: 'organizationName', value: subject.unit });
  if (subject.country) attrs.push({ name: 'countryName', value: subject.country });
  cert.setSubject(attrs);
  cert.setIssuer(attrs);
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
    { name: 'subjectKeyIdentifier' },
  ]);
  cert.sign(forgePrivate, forge.md.sha256.create());
  const certPem = forge.pki.certificateToPem(cert);

  const passphrase = opts.passphrase ?? randomBytes(18).toString('base64url');
  const p12Asn1 = forge.pkcs12.toPkcs12Asn1(forgePrivate, [cert], passphrase, { algorithm: '3des', friendlyName: subject.officeName });
  const p12 = Buffer.from(forge.asn1.toDer(p12Asn1).getBytes(), 'binary');

  const ed = generateKeyPairSync('ed25519');
  const recordPrivateKeyPem = ed.privateKey.export({ type: 'pkcs8', format: 'pem' }) as string;
  const recordPublicKeyPem = ed.publicKey.export({ type: 'spki', format: 'pem' }) as string;
  return { keyId: keyIdFor(certPem, recordPublicKeyPem), createdAt: now.toISOString(), certPem, p12, passphrase, recordPrivateKeyPem, recordPublicKeyPem };
}

/** Ring entry (public parts) of a key set. */
export function ringEntry(keys: SigningKeys, retiredAt: string | null = null): KeyRingEntry {
  return {
    keyId: keys.keyId,
    createdAt: keys.createdAt,
    retiredAt,
    subject: new X509Certificate(keys.certPem).subject.replace(/\n/g, ', '),
    certPem: keys.certPem,
    recordPublicKeyPem: keys.recordPublicKeyPem,
  };
}

/** Ring entry with this id, or null. */
export function findKey(ring: KeyRing, keyId: string): KeyRingEntry | null {
  return ring.entries.find((e) => e.keyId === keyId) ?? null;
}

/** Ring entry whose certificate has this DER encoding, or null. */
export function findCertificate(ring: KeyRing, certDer: Buffer): KeyRingEntry | null {
  const fp = certificateFingerprint(certDer);
  return ring.entries.find((e) => certificateFingerprint(e.certPem) === fp) ?? null;
}

/** Default keys directory: ASSAYER_KEYS_DIR, else RUN_DIR/keys, else .run/keys. */
export function defaultKeysDir(env: NodeJS.ProcessEnv = process.env): string {
  return resolve(env['ASSAYER_KEYS_DIR'] ?? join(env['RUN_DIR'] ?? '.run', 'keys'));
}

interface RingFile {
  current: string;
  entries: KeyRingEntry[];
}

function writePrivate(path: string, data: string | Buffer): void {
  writeFileSync(path, data);
  chmodSync(path, 0o600);
}

/** Writes a key set into dir/<keyId>/ and makes it current in dir/ring.json. */
export function saveKeys(dir: string, keys: SigningKeys, ring: KeyRing): void {
  const own = join(dir, keys.keyId);
  mkdirSync(own, { recursive: true, mode: 0o700 });
  writePrivate(join(own, 'office.p12'), keys.p12);
  writePrivate(join(own, 'passphrase'), keys.passphrase);
  writePrivate(join(own, 'record-private.pem'), keys.recordPrivateKeyPem);
  writeFileSync(join(own, 'office-cert.pem'), keys.certPem);
  writeFileSync(join(own, 'record-public.pem'), keys.recordPublicKeyPem);
  const file: RingFile = { current: keys.keyId, entries: ring.entries };
  writeFileSync(join(dir, 'ring.json'), JSON.stringify(file, null, 2) + '\n');
}

/** Reads the current key set and the ring from a keys directory, or null when there is none. */
export function loadKeysFromDir(dir: string): OfficeKeys | null {
  const ringPath = join(dir, 'ring.json');
  if (!existsSync(ringPath)) return null;
  const file = JSON.parse(readFileSync(ringPath, 'utf8')) as RingFile;
  const own = join(dir, file.current);
  const entry = file.entries.find((e) => e.keyId === file.current);
  if (!entry) throw new Error(`Key ring ${ringPath} names current key ${file.current} but has no entry for it.`);
  const current: SigningKeys = {
    keyId: file.current,
    createdAt: entry.createdAt,
    certPem: readFileSync(join(own, 'office-cert.pem'), 'utf8'),
    p12: readFileSync(join(own, 'office.p12')),
    passphrase: readFileSync(join(own, 'passphrase'), 'utf8'),
    recordPrivateKeyPem: readFileSync(join(own, 'record-private.pem'), 'utf8'),
    recordPublicKeyPem: readFileSync(join(own, 'record-public.pem'), 'utf8'),
  };
  return { current, ring: { entries: file.entries } };
}

/** Loads development keys from dir, generating a first key set when the directory is empty. */
export function ensureDevKeys(dir: string, subject: CertificateSubject): OfficeKeys {
  const existing = loadKeysFromDir(dir);
  if (existing) return existing;
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const current = generateSigningKeys(subject);
  const ring = { entries: [ringEntry(current)] };
  saveKeys(dir, current, ring);
  return { current, ring };
}

/** Replaces the current key set with a new one; the old entry stays in the ring, marked retired. */
export function rotateKeys(dir: string, subject: CertificateSubject, now: Date = new Date()): OfficeKeys {
  const before = loadKeysFromDir(dir);
  const current = generateSigningKeys(subject, { now });
  const retired = (before?.ring.entries ?? []).map((e) => (e.retiredAt ? e : { ...e, retiredAt: now.toISOString() }));
  const ring = { entries: [...retired, ringEntry(current)] };
  saveKeys(dir, current, ring);
  return { current, ring };
}

/** Environment variables read by {@link loadKeysFromEnv}. */
export const KEY_ENV = {
  p12: 'ASSAYER_SIGNING_P12',
  passphrase: 'ASSAYER_SIGNING_P12_PASSPHRASE',
  recordKey: 'ASSAYER_RECORD_KEY',
  ring: 'ASSAYER_KEY_RING',
} as const;

/**
 * Production keys from configuration: a PKCS#12 file and its passphrase, an Ed25519
 * private key in PEM, and optionally a ring.json of retired public entries.
 * Returns null when ASSAYER_SIGNING_P12 is not set.
 */
export function loadKeysFromEnv(env: NodeJS.ProcessEnv = process.env): OfficeKeys | null {
  const p12Path = env[KEY_ENV.p12];
  if (!p12Path) return null;
  const recordPath = env[KEY_ENV.recordKey];
  if (!recordPath) throw new Error(`${KEY_ENV.p12} is set but ${KEY_ENV.recordKey} (the Ed25519 private key for letter records, PEM) is not.`);
  const passphrase = env[KEY_ENV.passphrase] ?? '';
  const p12 = readFileSync(p12Path);
  let certPem: string;
  try {
    const parsed = forge.pkcs12.pkcs12FromAsn1(forge.asn1.fromDer(p12.toString('binary')), false, passphrase);
    const bags = parsed.getBags({ bagType: forge.pki.oids['certBag']! })[forge.pki.oids['certBag']!] ?? [];
    const cert = bags[0]?.cert;
    if (!cert) throw new Error('it holds no certificate');
    certPem = forge.pki.certificateToPem(cert);
  } catch (e) {
    throw new Error(`Cannot read the signing PKCS#12 at ${p12Path} (${KEY_ENV.p12}): ${(e as Error).message}. Check the file and ${KEY_ENV.passphrase}.`);
  }
  const recordPrivate = createPrivateKey(readFileSync(recordPath, 'utf8'));
  if (recordPrivate.asymmetricKeyType !== 'ed25519') throw new Error(`${KEY_ENV.recordKey} must be an Ed25519 private key; found ${recordPrivate.asymmetricKeyType}.`);
  const recordPrivateKeyPem = recordPrivate.export({ type: 'pkcs8', format: 'pem' }) as string;
  const recordPublicKeyPem = createPublicKey(recordPrivate).export({ type: 'spki', format: 'pem' }) as string;
  const keyId = keyIdFor(certPem, recordPublicKeyPem);
  const createdAt = new X509Certificate(certPem).validFrom;
  const current: SigningKeys = { keyId, createdAt: new Date(createdAt).toISOString(), certPem, p12, passphrase, recordPrivateKeyPem, recordPublicKeyPem };
  const older = env[KEY_ENV.ring] ? (JSON.parse(readFileSync(env[KEY_ENV.ring]!, 'utf8')) as { entries: KeyRingEntry[] }).entries : [];
  return { current, ring: { entries: [...older.filter((e) => e.keyId !== keyId), ringEntry(current)] } };
}

/** Production keys when configured, otherwise development keys in the keys directory. */
export function loadOfficeKeys(subject: CertificateSubject, opts: { dir?: string; env?: NodeJS.ProcessEnv } = {}): OfficeKeys {
  const env = opts.env ?? process.env;
  const configured = loadKeysFromEnv(env);
  if (configured) return configured;
  if (env['NODE_ENV'] === 'production') {
    throw new Error(`No signing keys configured: set ${KEY_ENV.p12}, ${KEY_ENV.passphrase} and ${KEY_ENV.recordKey} in production.`);
  }
  return ensureDevKeys(opts.dir ?? defaultKeysDir(env), subject);
}
