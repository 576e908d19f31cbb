/**
 * End-to-end checks of the letter engine: real engine reruns on the demo data for two
 * designs (mixed and paired), signed letters, verification outcomes, supersession, key
 * rotation, outside tools (pdfsig, openssl cms, pdffonts, pdftoppm) on the result.
 */
import { createHash } from 'node:crypto';
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rerunFromText } from '../../shared/stats/rerun';
import { ensureDevKeys, generateSigningKeys, loadKeysFromDir, rotateKeys, type OfficeKeys } from './keys';
import type { LetterInput } from './letter-input';
import { locateSignature } from './pdf-signature';
import { tutoringLetter, writingLabLetter } from './sample-letters';
import { signLetter, type SignedLetter } from './sign';
import { newVerificationCode } from './verification-code';
import { codesInPdf, verifyByCode, verifyLetterPdf, type StoredLetter } from './verify';

const SUBJECT = { officeName: 'Office of Institutional Effectiveness', unit: 'Harrow Vale Community College' };
const VERIFY_URL = 'https://assayer.harrowvale.test/verify';
const has = (tool: string) => spawnSync('sh', ['-c', `command -v ${tool}`]).status === 0;

/** Letter input for a demo data set, with the rerun computed by the real engine. */
function demoLetter(name: 'peer-tutoring' | 'writing-lab'): LetterInput {
  const csv = readFileSync(join('fixtures/demo', `${name}.csv`));
  const plan = JSON.parse(readFileSync(join('fixtures/demo', `${name}.plan.json`), 'utf8'));
  const result = rerunFromText(plan, csv.toString('utf8'));
  const sha = createHash('sha256').update(csv).digest('hex');
  const code = newVerificationCode();
  const input = name === 'peer-tutoring' ? tutoringLetter(code, `${VERIFY_URL}/${code}`, result) : writingLabLetter(code, `${VERIFY_URL}/${code}`, result);
  input.dataset = { ...input.dataset, filename: `${name}.csv`, sha256: sha, rows: csv.toString('utf8').trim().split('\n').length - 1 };
  input.rerun = { ...input.rerun, engineVersion: result.engine, dataHash: sha };
  return input;
}

let dir: string;
let keys: OfficeKeys;
const store = new Map<string, StoredLetter>();
const lookup = (code: string) => store.get(code) ?? null;
const letters: Record<string, { input: LetterInput; signed: SignedLetter }> = {};

function remember(s: SignedLetter): void {
  store.set(s.record.code, { record: s.record, recordSignature: s.recordSignature, keyId: s.keyId, pdfSha256: s.pdfSha256, supersededBy: null });
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'assayer-letters-'));
  keys = ensureDevKeys(join(dir, 'keys'), SUBJECT);
  for (const name of ['peer-tutoring', 'writing-lab'] as const) {
    const input = demoLetter(name);
    const signed = await signLetter(input, keys.current);
    remember(signed);
    letters[name] = { input, signed };
  }
}, 120_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('signed letters from real reruns', () => {
  it('verifies both designs as valid and current, by PDF and by code', async () => {
    for (const { input, signed } of Object.values(letters)) {
      const byPdf = await verifyLetterPdf(signed.pdf, lookup, keys.ring);
      expect(byPdf.status, byPdf.details.join('\n')).toBe('valid-current');
      expect(byPdf.code).toBe(input.verification.code);
      expect(byPdf.letter).toMatchObject({ requestReference: input.request.reference, decision: input.decision, supersededBy: null });
      const byCode = await verifyByCode(input.verification.code.toLowerCase().replace(/-/g, ' '), lookup, keys.ring);
      expect(byCode.status).toBe('valid-current');
    }
  });

  it('records the decision, hashes and people in the canonical record', () => {
    const { input, signed } = letters['peer-tutoring'];
    expect(signed.record).toMatchObject({
      code: input.verification.code,
      decision: 'endorse-with-conditions',
      conditions: input.conditions,
      dataset: { sha256: input.dataset.sha256 },
      rerun: { dataHash: input.dataset.sha256 },
      countersigner: { name: 'Prof. Helen Achterberg' },
      keyId: keys.current.keyId,
    });
    expect(signed.pdfSha256).toBe(createHash('sha256').update(signed.pdf).digest('hex'));
  });

  it('carries the verification code in the PDF metadata twice', () => {
    const { input, signed } = letters['writing-lab'];
    expect(codesInPdf(signed.pdf)).toEqual([input.verification.code, input.verification.code]);
  });

  it('reports a flipped byte in the page content as altered', async () => {
    const { signed } = letters['peer-tutoring'];
    const { byteRange } = locateSignature(signed.pdf)!;
    const copy = Buffer.from(signed.pdf);
    const at = byteRange[2] + Math.floor(byteRange[3] / 2);
    copy[at] ^= 0x01;
    const res = await verifyLetterPdf(copy, lookup, keys.ring);
    expect(res.status).toBe('altered');
    expect(res.details.join(' ')).toMatch(/does not match its digital signature/);
    expect(res.details.join(' ')).toMatch(/SHA-256 fingerprint does not match/);
  });

  it('reports a change in the unsigned padding of the signature as altered (stored hash)', async () => {
    const { signed } = letters['writing-lab'];
    const { byteRange } = locateSignature(signed.pdf)!;
    const copy = Buffer.from(signed.pdf);
    copy[byteRange[2] - 3] = '1'.charCodeAt(0);
    const res = await verifyLetterPdf(copy, lookup, keys.ring);
    expect(res.status).toBe('altered');
    expect(res.details.join(' ')).toMatch(/SHA-256/);
  });

  it('reports an edited verification code in the metadata as altered', async () => {
    const { signed, input } = letters['writing-lab'];
    const text = signed.pdf.toString('latin1');
    const at = text.indexOf(input.verification.code);
    const copy = Buffer.from(signed.pdf);
    copy[at] = copy[at] === 0x41 ? 0x42 : 0x41;
    const res = await verifyLetterPdf(copy, lookup, keys.ring);
    expect(res.status).toBe('altered');
  });

  it('says plainly when a code or file is unknown, or not a PDF', async () => {
    const unknown = newVerificationCode();
    expect(await verifyByCode(unknown, lookup, keys.ring)).toMatchObject({ status: 'unknown-code', code: unknown });
    expect((await verifyByCode('7KQ2-M9XD-4TBX', lookup, keys.ring)).details[0]).toMatch(/typing error|exists/);
    const notPdf = await verifyLetterPdf(Buffer.from('name,score\nAda,3\n'), lookup, keys.ring);
    expect(notPdf).toMatchObject({ status: 'not-a-pdf' });
    expect(notPdf.details[0]).toMatch(/not a PDF/);
    const plain = Buffer.from('%PDF-1.4\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n');
    expect((await verifyLetterPdf(plain, lookup, keys.ring)).status).toBe('unknown-code');
  });

  it('rejects a copy signed with a key the office does not hold', async () => {
    const { input } = letters['writing-lab'];
    const foreign = generateSigningKeys({ officeName: SUBJECT.officeName, unit: SUBJECT.unit });
    const forged = await signLetter({ ...input, decision: 'endorse' }, foreign);
    const res = await verifyLetterPdf(forged.pdf, lookup, keys.ring);
    expect(res.status).toBe('altered');
    expect(res.details.join(' ')).toMatch(/not with a certificate this office has ever used/);
  }, 30_000);

  it('keeps a superseded letter verifiable as superseded, and the new one as current', async () => {
    const old = letters['peer-tutoring'];
    const code = newVerificationCode();
    const next: LetterInput = { ...old.input, version: 2, supersedes: old.input.verification.code, verification: { code, url: `${VERIFY_URL}/${code}` }, decision: 'endorse', conditions: [] };
    const signed = await signLetter(next, keys.current);
    remember(signed);
    store.get(old.input.verification.code)!.supersededBy = code;

    const oldRes = await verifyLetterPdf(old.signed.pdf, lookup, keys.ring);
    expect(oldRes.status).toBe('valid-superseded');
    expect(oldRes.details[0]).toContain(code);
    const newRes = await verifyLetterPdf(signed.pdf, lookup, keys.ring);
    expect(newRes.status).toBe('valid-current');
    expect(newRes.letter).toMatchObject({ version: 2, supersedes: old.input.verification.code });
    expect((await verifyByCode(old.input.verification.code, lookup, keys.ring)).status).toBe('valid-superseded');
  }, 30_000);

  it('keeps letters signed before a key rotation verifiable, and signs new ones with the new key', async () => {
    const before = keys;
    const rotated = rotateKeys(join(dir, 'keys'), SUBJECT);
    expect(rotated.current.keyId).not.toBe(before.current.keyId);
    expect(rotated.ring.entries.map((e) => e.keyId)).toEqual([before.current.keyId, rotated.current.keyId]);
    expect(rotated.ring.entries[0].retiredAt).not.toBeNull();
    expect(loadKeysFromDir(join(dir, 'keys'))!.current.keyId).toBe(rotated.current.keyId);

    const old = letters['writing-lab'];
    expect((await verifyLetterPdf(old.signed.pdf, lookup, rotated.ring)).status).toBe('valid-current');
    const fresh = demoLetter('writing-lab');
    const signed = await signLetter(fresh, rotated.current);
    remember(signed);
    expect(signed.keyId).toBe(rotated.current.keyId);
    expect((await verifyLetterPdf(signed.pdf, lookup, rotated.ring)).status).toBe('valid-current');
    // Without the retired entry the old letter can no longer be vouched for.
    const newOnly = { entries: rotated.ring.entries.slice(1) };
    expect((await verifyLetterPdf(old.signed.pdf, lookup, newOnly)).status).toBe('altered');
    keys = rotated;
  }, 30_000);
});

describe('outside tools accept the letter', () => {
  it.skipIf(!has('pdfsig'))("poppler's pdfsig reports the embedded signature as valid", () => {
    const file = join(dir, 'pdfsig.pdf');
    writeFileSync(file, letters['peer-tutoring'].signed.pdf);
    const out = execFileSync('pdfsig', [file], { encoding: 'utf8' });
    expect(out).toMatch(/Signature Validation: Signature is Valid\./);
    expect(out).toMatch(/Total document signed/);
    expect(out).toMatch(/Office of Institutional Effectiveness/);
  });

  it.skipIf(!has('openssl'))('openssl cms -verify accepts the PKCS#7 over the signed byte ranges', () => {
    const pdf = letters['writing-lab'].signed.pdf;
    const { byteRange, pkcs7 } = locateSignature(pdf)!;
    const content = Buffer.concat([pdf.subarray(0, byteRange[1]), pdf.subarray(byteRange[2], byteRange[2] + byteRange[3])]);
    writeFileSync(join(dir, 'sig.der'), pkcs7);
    writeFileSync(join(dir, 'content.bin'), content);
    writeFileSync(join(dir, 'ca.pem'), keys.ring.entries[0].certPem);
    const run = spawnSync('openssl', ['cms', '-verify', '-binary', '-inform', 'DER', '-in', join(dir, 'sig.der'), '-content', join(dir, 'content.bin'), '-CAfile', join(dir, 'ca.pem'), '-purpose', 'any', '-out', '/dev/null'], { encoding: 'utf8' });
    expect(run.stderr).toMatch(/Verification successful/);
    content[100] ^= 1;
    writeFileSync(join(dir, 'content.bin'), content);
    const bad = spawnSync('openssl', ['cms', '-verify', '-binary', '-inform', 'DER', '-in', join(dir, 'sig.der'), '-content', join(dir, 'content.bin'), '-CAfile', join(dir, 'ca.pem'), '-purpose', 'any', '-out', '/dev/null'], { encoding: 'utf8' });
    expect(bad.status).not.toBe(0);
  });

  it.skipIf(!has('pdffonts'))('embeds every font it uses, all from the shipped TrueType files', () => {
    const file = join(dir, 'fonts.pdf');
    writeFileSync(file, letters['peer-tutoring'].signed.pdf);
    const rows = execFileSync('pdffonts', [file], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(rows.length).toBeGreaterThanOrEqual(4);
    for (const row of rows) {
      expect(row).toMatch(/DejaVu/);
      expect(row).toMatch(/\byes\s+yes\s+(yes|no)\s+\d+\s+\d+\s*$/);
    }
  });

  it.skipIf(!has('pdftoppm'))('renders every page with pdftoppm, none of them blank', () => {
    const out = join(dir, 'png');
    const file = join(dir, 'render.pdf');
    writeFileSync(file, letters['peer-tutoring'].signed.pdf);
    execFileSync('mkdir', ['-p', out]);
    execFileSync('pdftoppm', ['-r', '60', '-png', file, join(out, 'page')]);
    const pngs = readdirSync(out).filter((f) => f.endsWith('.png'));
    expect(pngs.length).toBeGreaterThanOrEqual(2);
    for (const f of pngs) expect(statSync(join(out, f)).size).toBeGreaterThan(5_000);
    // Greyscale PGM of the same pages: count ink pixels to prove each page has content.
    execFileSync('pdftoppm', ['-r', '60', '-gray', file, join(out, 'grey')]);
    const pgms = readdirSync(out).filter((f) => f.endsWith('.pgm')).sort();
    expect(pgms.length).toBe(pngs.length);
    for (const f of pgms) {
      const bytes = readFileSync(join(out, f));
      const header = bytes.toString('latin1', 0, 20).match(/^P5\s+(\d+)\s+(\d+)\s+255\s/)!;
      const pixels = bytes.subarray(header[0].length);
      expect(pixels.length).toBe(Number(header[1]) * Number(header[2]));
      const ink = pixels.reduce((n, v) => n + (v < 128 ? 1 : 0), 0) / pixels.length;
      expect(ink, `${f} ink share`).toBeGreaterThan(0.005);
    }
  });
});
