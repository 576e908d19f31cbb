/**
 * The canonical record of a letter: the facts that matter (decision, people, dates,
 * hashes, code, version) as stable JSON with sorted keys, signed with the office's
 * Ed25519 record key and stored beside the PDF.
 */
import { createPrivateKey, createPublicKey, sign, verify } from 'node:crypto';
import type { Decision } from '../../shared/api/types';
import type { LetterInput } from './letter-input';

/** Version tag of the record layout, so later layouts can be told apart. */
export const RECORD_SCHEMA = 'assayer-letter-record/1';

/** A person as the record keeps them. */
export interface RecordPerson {
  name: string;
  email: string;
}

/** Signed facts of one letter version. */
export interface CanonicalRecord {
  schema: typeof RECORD_SCHEMA;
  code: string;
  version: number;
  supersedes: string | null;
  office: string;
  request: { id: string; reference: string; title: string };
  submitter: RecordPerson;
  reviewer: RecordPerson;
  countersigner: RecordPerson | null;
  dates: { filed: string; decided: string; signed: string };
  dataset: { filename: string; sha256: string; rows: number };
  rerun: { id: string; engineVersion: string; dataHash: string };
  decision: Decision;
  conditions: string[];
  keyId: string;
  /** SHA-256 of the signed PDF, hex. */
  pdfSha256: string;
}

/** JSON with object keys sorted at every level and no whitespace; undefined members are dropped. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    if (typeof value === 'number' && !Number.isFinite(value)) throw new Error('Canonical JSON cannot hold NaN or infinity.');
    return JSON.stringify(value);
  }
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v === undefined ? null : v)).join(',')}]`;
  const obj = value as Record<string, unknown>;
  const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(obj[k])}`).join(',')}}`;
}

const person = (p: { name: string; email: string }): RecordPerson => ({ name: p.name, email: p.email });

/** The record of a letter once its PDF is signed. */
export function buildRecord(input: LetterInput, keyId: string, pdfSha256: string): CanonicalRecord {
  return {
    schema: RECORD_SCHEMA,
    code: input.verification.code,
    version: input.version,
    supersedes: input.supersedes ?? null,
    office: input.letterhead.officeName,
    request: { id: input.request.id, reference: input.request.reference, title: input.request.title },
    submitter: person(input.submitter),
    reviewer: person(input.reviewer),
    countersigner: input.countersigner ? person(input.countersigner) : null,
    dates: { ...input.dates },
    dataset: { ...input.dataset },
    rerun: { id: input.rerun.rerunId, engineVersion: input.rerun.engineVersion, dataHash: input.rerun.dataHash },
    decision: input.decision,
    conditions: [...input.conditions],
    keyId,
    pdfSha256,
  };
}

/** Ed25519 signature of the record's canonical JSON, base64. */
export function signRecord(record: CanonicalRecord, recordPrivateKeyPem: string): string {
  return sign(null, Buffer.from(canonicalJson(record), 'utf8'), createPrivateKey(recordPrivateKeyPem)).toString('base64');
}

/** True when the signature matches the record under the given public key. */
export function verifyRecord(record: CanonicalRecord, signatureBase64: string, recordPublicKeyPem: string): boolean {
  try {
    return verify(null, Buffer.from(canonicalJson(record), 'utf8'), createPublicKey(recordPublicKeyPem), Buffer.from(signatureBase64, 'base64'));
  } catch {
    return false;
  }
}
