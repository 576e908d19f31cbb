/**
 * The office's signing keys as the running server sees them: production material from
 * configuration (ASSAYER_SIGNING_P12 …), otherwise development keys in RUN_DIR/keys
 * (or ASSAYER_KEYS_DIR), generated on first use. Loaded once per keys directory and
 * process: key generation is slow and the ring must not change under a running request.
 */
import { join, resolve } from 'node:path';
import { loadOfficeKeys, type CertificateSubject, type KeyRing, type OfficeKeys } from '../letters/index';

const cache = new Map<string, OfficeKeys>();

/** Where development keys live for a run directory (ASSAYER_KEYS_DIR wins). */
export function keysDirFor(runDir: string, env: NodeJS.ProcessEnv = process.env): string {
  return resolve(env['ASSAYER_KEYS_DIR'] ?? join(runDir, 'keys'));
}

/** The office keys for a run directory, loaded (or generated in development) on first call. */
export function officeKeys(runDir: string, subject: CertificateSubject, env: NodeJS.ProcessEnv = process.env): OfficeKeys {
  const dir = keysDirFor(runDir, env);
  let keys = cache.get(dir);
  if (!keys) {
    keys = loadOfficeKeys(subject, { dir, env });
    cache.set(dir, keys);
  }
  return keys;
}

/** The ring of every key the office has signed with (verification uses only public parts). */
export function officeRing(runDir: string, subject: CertificateSubject, env: NodeJS.ProcessEnv = process.env): KeyRing {
  return officeKeys(runDir, subject, env).ring;
}

/** Forgets loaded keys (after a rotation by the operator, or between tests). */
export function forgetOfficeKeys(): void {
  cache.clear();
}
