/**
 * Public API of the letter engine: what routes and services call. Everything else in
 * this folder is internal to rendering, signing and verification.
 */
export type { LetterInput, Letterhead, LetterPerson, LetterFactor, LetterPlanSummary, LetterChecklistEntry } from './letter-input';
export { renderLetterPdf, SCOPE_CAUTION } from './pdf';
export { signLetter, sha256Hex, type SignedLetter } from './sign';
export { canonicalJson, verifyRecord, type CanonicalRecord } from './canonical-record';
export { verifyLetterPdf, verifyByCode, MAX_VERIFY_BYTES, type StoredLetter, type LetterLookup, type VerificationResult, type VerificationStatus, type LetterPublicSummary } from './verify';
export { newVerificationCode, parseVerificationCode, type ParsedCode } from './verification-code';
export {
  loadOfficeKeys,
  ensureDevKeys,
  rotateKeys,
  loadKeysFromDir,
  loadKeysFromEnv,
  generateSigningKeys,
  defaultKeysDir,
  findKey,
  KEY_ENV,
  type OfficeKeys,
  type SigningKeys,
  type KeyRing,
  type KeyRingEntry,
  type CertificateSubject,
} from './keys';
