/**
 * Public verification of letters, by uploaded PDF or by code. Three independent checks:
 * the PDF's embedded signature (made by a certificate in the office key ring), the
 * SHA-256 of the upload against the stored record, and the record's own signature.
 * Messages are written for someone outside the office.
 */
import type { Decision } from '../../shared/api/types';
import { verifyRecord, type CanonicalRecord } from './canonical-record';
import { findCertificate, findKey, type KeyRing } from './keys';
import { DECISION_HEADLINES, longDate } from './labels';
import { CODE_INFO_KEY, CODE_KEYWORD_PREFIX } from './pdf';
import { checkEmbeddedSignature } from './pdf-signature';
import { sha256Hex } from './sign';
import { parseVerificationCode } from './verification-code';

/** A letter as the database keeps it. */
export interface StoredLetter {
  record: CanonicalRecord;
  recordSignature: string;
  keyId: string;
  pdfSha256: string;
  /** Code of the newer letter that replaces this one, if any. */
  supersededBy?: string | null;
}

/** Finds a stored letter by canonical code (e.g. "7KQ2-M9XD-4TBH"). */
export type LetterLookup = (code: string) => StoredLetter | null | Promise<StoredLetter | null>;

/** Verdict of a verification. */
export type VerificationStatus = 'valid-current' | 'valid-superseded' | 'altered' | 'unknown-code' | 'not-a-pdf';

/** What the public page may show about a letter. */
export interface LetterPublicSummary {
  code: string;
  version: number;
  office: string;
  requestReference: string;
  requestTitle: string;
  decision: Decision;
  decisionLabel: string;
  conditions: string[];
  reviewer: string;
  countersigner: string | null;
  decidedOn: string;
  signedAt: string;
  datasetFilename: string;
  datasetSha256: string;
  supersedes: string | null;
  supersededBy: string | null;
}

/** Result of a verification: a status, the code read, plain-language details and the letter's summary. */
export interface VerificationResult {
  status: VerificationStatus;
  code?: string;
  /** First entry is the headline sentence; the rest explain. */
  details: string[];
  letter?: LetterPublicSummary;
}

/** Largest upload the verifier reads; routes should reject bigger bodies before calling. */
export const MAX_VERIFY_BYTES = 10 * 1024 * 1024;

function summary(stored: StoredLetter): LetterPublicSummary {
  const r = stored.record;
  return {
    code: r.code,
    version: r.version,
    office: r.office,
    requestReference: r.request.reference,
    requestTitle: r.request.title,
    decision: r.decision,
    decisionLabel: DECISION_HEADLINES[r.decision],
    conditions: r.conditions,
    reviewer: r.reviewer.name,
    countersigner: r.countersigner?.name ?? null,
    decidedOn: r.dates.decided,
    signedAt: r.dates.signed,
    datasetFilename: r.dataset.filename,
    datasetSha256: r.dataset.sha256,
    supersedes: r.supersedes,
    supersededBy: stored.supersededBy ?? null,
  };
}

/** True when the bytes start like a PDF (the header may follow a little junk). */
export function looksLikePdf(bytes: Buffer): boolean {
  return bytes.subarray(0, 1024).includes('%PDF-') && bytes.subarray(Math.max(0, bytes.length - 2048)).includes('%%EOF');
}

/** Every verification code the PDF's metadata carries (Keywords and the custom info key). */
export function codesInPdf(pdf: Buffer): string[] {
  const text = pdf.toString('latin1');
  const found: string[] = [];
  const escaped = CODE_KEYWORD_PREFIX.replace(/[-/\\^$*+?.()|[\]{}]/g, '\\$&');
  for (const m of text.matchAll(new RegExp(`${escaped}([0-9A-Za-z-]{1,20})`, 'g'))) found.push(m[1]);
  const direct = text.match(new RegExp(`/${CODE_INFO_KEY}\\s*\\(([^)]{1,40})\\)`));
  if (direct) found.push(direct[1]);
  const ref = text.match(new RegExp(`/${CODE_INFO_KEY}\\s+(\\d+)\\s+0\\s+R`));
  if (ref) {
    const obj = text.match(new RegExp(`(?:^|\\s)${ref[1]}\\s+0\\s+obj\\s*\\(([^)]{1,40})\\)`));
    if (obj) found.push(obj[1]);
  }
  return found;
}

/** Checks a stored record's signature and consistency; returns problems, empty when sound. */
function recordProblems(stored: StoredLetter, ring: KeyRing, code: string): string[] {
  const problems: string[] = [];
  const key = findKey(ring, stored.keyId);
  if (!key) problems.push(`The office's record of this letter was signed with key ${stored.keyId}, which is not in the office key ring.`);
  else if (!verifyRecord(stored.record, stored.recordSignature, key.recordPublicKeyPem)) {
    problems.push("The office's stored record of this letter fails its own signature check. Contact the office.");
  }
  if (stored.record.code !== code || stored.record.keyId !== stored.keyId || stored.record.pdfSha256 !== stored.pdfSha256) {
    problems.push("The office's stored record of this letter is inconsistent. Contact the office.");
  }
  return problems;
}

function describe(stored: StoredLetter): string[] {
  const r = stored.record;
  const lines = [
    `Letter version ${r.version} on request ${r.request.reference} ("${r.request.title}"), issued by the ${r.office}.`,
    `Decision: ${DECISION_HEADLINES[r.decision]}, decided on ${longDate(r.dates.decided)}, signed by ${r.reviewer.name}${r.countersigner ? ` and countersigned by ${r.countersigner.name}` : ''}.`,
  ];
  if (r.supersedes) lines.push(`It replaces the letter with code ${r.supersedes}.`);
  return lines;
}

function validResult(stored: StoredLetter, code: string, checks: string[]): VerificationResult {
  const newer = stored.supersededBy ?? null;
  if (newer) {
    return {
      status: 'valid-superseded',
      code,
      details: [
        `This letter is authentic, but it has been replaced: the office issued a newer version with code ${newer}. Ask for the current letter before relying on this one.`,
        ...describe(stored),
        ...checks,
      ],
      letter: summary(stored),
    };
  }
  return {
    status: 'valid-current',
    code,
    details: ['This letter is authentic and current: it is exactly the letter the office signed, and no newer version replaces it.', ...describe(stored), ...checks],
    letter: summary(stored),
  };
}

/** Verifies a code typed or scanned from a letter, against the office's records. */
export async function verifyByCode(input: string, lookup: LetterLookup, ring: KeyRing): Promise<VerificationResult> {
  const parsed = parseVerificationCode(input);
  if (!parsed.ok) return { status: 'unknown-code', details: [parsed.message] };
  const stored = await lookup(parsed.code);
  if (!stored) {
    return { status: 'unknown-code', code: parsed.code, details: [`No letter with the code ${parsed.code} exists in the office's records. Check the code, or ask the office that issued the letter.`] };
  }
  const problems = recordProblems(stored, ring, parsed.code);
  if (problems.length) return { status: 'altered', code: parsed.code, details: problems, letter: summary(stored) };
  return validResult(stored, parsed.code, ["The office's record of this letter carries a valid signature. To check a copy you hold, upload the PDF as well."]);
}

/** Verifies an uploaded PDF: its embedded signature, its hash against the record, and the record's signature. */
export async function verifyLetterPdf(pdf: Buffer, lookup: LetterLookup, ring: KeyRing): Promise<VerificationResult> {
  if (!looksLikePdf(pdf)) {
    return { status: 'not-a-pdf', details: ['The uploaded file is not a PDF. Upload the letter exactly as you received it (a .pdf file).'] };
  }
  const candidates = codesInPdf(pdf);
  const valid = [...new Set(candidates.map(parseVerificationCode).filter((c) => c.ok).map((c) => c.code))];
  if (valid.length === 0) {
    if (candidates.length > 0) {
      return { status: 'altered', details: ['The verification code stored inside this PDF has been changed, so the file is not the letter the office signed.'] };
    }
    return { status: 'unknown-code', details: ['This PDF carries no verification code of this office, so it is not one of its letters. If you hold a code, enter it instead.'] };
  }
  if (valid.length > 1) {
    return { status: 'altered', details: [`This PDF carries conflicting verification codes (${valid.join(', ')}): it has been changed after signing.`] };
  }
  const code = valid[0];
  const stored = await lookup(code);
  if (!stored) {
    return { status: 'unknown-code', code, details: [`No letter with the code ${code} exists in the office's records. The file may be a forgery or may come from another office.`] };
  }

  const problems: string[] = [];
  const embedded = checkEmbeddedSignature(pdf);
  if (!embedded.ok) problems.push(embedded.reason);
  else if (!findCertificate(ring, embedded.certDer)) problems.push('The PDF is signed, but not with a certificate this office has ever used.');
  const hash = sha256Hex(pdf);
  if (hash !== stored.pdfSha256) problems.push('The file differs from the one the office signed (its SHA-256 fingerprint does not match the stored record).');
  problems.push(...recordProblems(stored, ring, code));

  if (problems.length) {
    return {
      status: 'altered',
      code,
      details: [`This file is not the letter the office signed under code ${code}: it has been changed, or it is damaged.`, ...problems, 'What the office actually signed under this code:', ...describe(stored)],
      letter: summary(stored),
    };
  }
  return validResult(stored, code, [
    "The PDF's digital signature is intact and was made with the office's certificate.",
    'The file is byte-for-byte the one the office signed (SHA-256 matches the stored record).',
    "The office's record of the letter carries a valid signature.",
  ]);
}
