/**
 * The fake identity provider's signing key and self-signed certificate, generated at
 * first start into RUN_DIR/keys and reused afterwards (so the SP keeps trusting it).
 */
import { generateKeyPairSync } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import forge from 'node-forge';

/** PEM key pair of the fake IdP. */
export interface IdpKeys { privateKeyPem: string; certPem: string }

/** Loads the key and certificate from RUN_DIR/keys, creating them when missing. */
export function ensureFakeIdpKeys(runDir: string): IdpKeys {
  const dir = path.join(runDir, 'keys');
  const keyFile = path.join(dir, 'fake-idp-key.pem');
  const certFile = path.join(dir, 'fake-idp-cert.pem');
  if (fs.existsSync(keyFile) && fs.existsSync(certFile)) {
    return { privateKeyPem: fs.readFileSync(keyFile, 'utf8'), certPem: fs.readFileSync(certFile, 'utf8') };
  }
  const { privateKey, publicKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const privateKeyPem = privateKey.export({ type: 'pkcs8', format: 'pem' }).toString();
  const cert = forge.pki.createCertificate();
  cert.publicKey = forge.pki.publicKeyFromPem(publicKey.export({ type: 'spki', format: 'pem' }).toString());
  cert.serialNumber = `01${forge.util.bytesToHex(forge.random.getBytesSync(8))}`;
  cert.validity.notBefore = new Date(Date.now() - 86_400_000);
  cert.validity.notAfter = new Date(Date.now() + 5 * 365 * 86_400_000);
  const subject = [{ name: 'commonName', value: 'Assayer development identity provider' }, { name: 'organizationName', value: 'Harrow Vale Community College (demo)' }];
  cert.setSubject(subject);
  cert.setIssuer(subject);
  cert.sign(forge.pki.privateKeyFromPem(privateKeyPem) as forge.pki.rsa.PrivateKey, forge.md.sha256.create());
  const certPem = forge.pki.certificateToPem(cert);
  fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
  fs.writeFileSync(keyFile, privateKeyPem, { mode: 0o600 });
  fs.writeFileSync(certFile, certPem);
  return { privateKeyPem, certPem };
}
