/**
 * Signs a letter: renders it with a signature placeholder, embeds the office's PDF
 * signature (PKCS#7 detached, readable by ordinary PDF readers), hashes the signed
 * file, then signs the canonical record that names that hash.
 */
import { createHash } from 'node:crypto';
import { pdfkitAddPlaceholder } from '@signpdf/placeholder-pdfkit';
import { P12Signer } from '@signpdf/signer-p12';
import { SignPdf } from '@signpdf/signpdf';
import { buildRecord, signRecord, type CanonicalRecord } from './canonical-record';
import type { SigningKeys } from './keys';
import type { LetterInput } from './letter-input';
import { buildLetterDocument, finishDocument } from './pdf';

/** Bytes reserved for the PKCS#7 blob; one 2048-bit certificate and signature fit with room to spare. */
export const SIGNATURE_LENGTH = 8192;

/** What the workflow stores after signing. */
export interface SignedLetter {
  pdf: Buffer;
  record: CanonicalRecord;
  /** Ed25519 signature of the canonical record, base64. */
  recordSignature: string;
  keyId: string;
  pdfSha256: string;
}

/** SHA-256 of bytes, hex. */
export function sha256Hex(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Renders, signs and records one letter version with the office's current keys. */
export async function signLetter(input: LetterInput, keys: SigningKeys): Promise<SignedLetter> {
  const signingTime = new Date(input.dates.signed);
  const doc = await buildLetterDocument(input);
  pdfkitAddPlaceholder({
    pdf: doc,
    pdfBuffer: Buffer.alloc(0),
    reason: `Recommendation on request ${input.request.reference}, verification code ${input.verification.code}`,
    contactInfo: input.reviewer.email,
    name: input.letterhead.officeName,
    location: input.letterhead.unit,
    signingTime,
    signatureLength: SIGNATURE_LENGTH,
    appName: 'Assayer',
  });
  const unsigned = await finishDocument(doc);
  const pdf = await new SignPdf().sign(unsigned, new P12Signer(keys.p12, { passphrase: keys.passphrase }), signingTime);
  const pdfSha256 = sha256Hex(pdf);
  const record = buildRecord(input, keys.keyId, pdfSha256);
  return { pdf, record, recordSignature: signRecord(record, keys.recordPrivateKeyPem), keyId: keys.keyId, pdfSha256 };
}
