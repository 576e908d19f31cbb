/**
 * Letter routes. Under /api/requests/:id: the signing step, the countersignature, amendments
 * and the list of letter versions (same access as the request). Under /api/letters: the PDF
 * download (same access as its request) and the public verification, by code or by upload,
 * which needs no sign-in and is rate-limited.
 */
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { amendBodySchema, signBodySchema } from '../../shared/api/letter-schemas';
import type { Config } from '../config';
import { MAX_VERIFY_BYTES, parseVerificationCode, verifyByCode, verifyLetterPdf } from '../letters/index';
import { currentUser, requireAuth } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import { jsonRateLimit } from '../middleware/rate-limit';
import { audit } from '../services/audit';
import { keysForOffice, amendLetter, countersignLetter, findStoredLetter, letterView, letterWithPdf, listLetters, signDecisionLetter, toVerificationView, type LetterEnv, type SignOutcome } from '../services/letters';
import { notifyEvent } from '../services/notify-event';
import { theOffice } from '../services/office';
import { findVisibleRequest } from '../services/requests';
import { load, loaded } from './requests';
import { body } from './validate';

/** Plain words for the person signing: what the confirmation was. */
function confirmationNote(o: SignOutcome): string {
  return o.confirmedBy === 'password'
    ? 'You confirmed with your password.'
    : 'You sign in through single sign-on, so typing the request reference was your confirmation (there is no password to re-enter).';
}

async function afterSigning(o: SignOutcome, requestId: string, actorId: string): Promise<void> {
  if (o.status === 'issued') await notifyEvent('letter.ready', requestId, { actorId, extra: { code: o.letter.verificationCode } });
  else await notifyEvent('letter.countersign-needed', requestId, { actorId, extra: { code: o.letter.verificationCode } });
}

/** The /api/requests/:id/letter… routes (mounted at /requests beside the requests router). */
export function requestLettersRouter(config: Config): Router {
  const env: LetterEnv = { publicUrl: config.publicUrl, runDir: config.runDir };
  const router = Router();

  const list: RequestHandler = async (_req, res) => {
    res.json(await listLetters(loaded(res).id, env));
  };

  const sign: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const r = loaded(res);
    const o = await signDecisionLetter(me, r, body(req, signBodySchema), env);
    await audit({
      actorId: me.id, action: o.status === 'issued' ? 'letter.issued' : 'letter.signed', entityType: 'letter', entityId: o.letter.id,
      details: { reference: r.reference, code: o.letter.verificationCode, letterNo: o.letter.letterNo, decision: o.letter.decision, status: o.status, confirmedBy: o.confirmedBy, pdfSha256: o.letter.pdfSha256, keyId: o.letter.keyId },
    }, req);
    await afterSigning(o, r.id, me.id);
    res.status(201).json({ letter: await letterView(o.letter, env), message: confirmationNote(o) });
  };

  const countersign: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const r = loaded(res);
    const o = await countersignLetter(me, r, body(req, signBodySchema), env);
    await audit({
      actorId: me.id, action: 'letter.countersigned', entityType: 'letter', entityId: o.letter.id,
      details: { reference: r.reference, code: o.letter.verificationCode, letterNo: o.letter.letterNo, confirmedBy: o.confirmedBy, pdfSha256: o.letter.pdfSha256, keyId: o.letter.keyId },
    }, req);
    await afterSigning(o, r.id, me.id);
    res.json({ letter: await letterView(o.letter, env), message: confirmationNote(o) });
  };

  const amend: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const r = loaded(res);
    const b = body(req, amendBodySchema);
    const o = await amendLetter(me, r, b, env);
    await audit({
      actorId: me.id, action: 'letter.amended', entityType: 'letter', entityId: o.letter.id,
      details: {
        reference: r.reference, reason: b.reason, decision: b.decision, decisionId: o.decision.id, code: o.letter.verificationCode, letterNo: o.letter.letterNo,
        replaces: o.previous.verificationCode, status: o.status, confirmedBy: o.confirmedBy,
      },
    }, req);
    await afterSigning(o, r.id, me.id);
    res.status(201).json({ letter: await letterView(o.letter, env), message: confirmationNote(o) });
  };

  router.get('/:id/letters', requireAuth, load, list);
  router.post('/:id/letter/sign', requireAuth, load, sign);
  router.post('/:id/letter/countersign', requireAuth, load, countersign);
  router.post('/:id/letter/amend', requireAuth, load, amend);
  return router;
}

/** Verification requests allowed per address in 15 minutes (env VERIFY_RATE_LIMIT, default 60). */
export function verifyRateLimit(env: NodeJS.ProcessEnv = process.env): number {
  const n = Number(env['VERIFY_RATE_LIMIT'] ?? 60);
  return Number.isFinite(n) && n > 0 ? n : 60;
}

/** An error body that also carries the verification shape, so the public page can show either. */
function verificationError(status: number, code: string, message: string, extra: Record<string, unknown> = {}) {
  return { error: { status, code, message }, headline: message, details: [], ...extra };
}

/** The /api/letters routes: PDF download (signed in) and public verification. */
export function lettersRouter(config: Config): Router {
  const env: LetterEnv = { publicUrl: config.publicUrl, runDir: config.runDir };
  const router = Router();
  const limiter = jsonRateLimit({ windowMs: 15 * 60_000, limit: verifyRateLimit(), message: 'Too many verification requests from your address. Wait a few minutes and try again.' });
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_VERIFY_BYTES, files: 1, fields: 5 } }).single('file');
  const ring = async () => (await keysForOffice((await theOffice()).id, env)).ring;

  const receive: RequestHandler = (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      const e = err as { code?: string; field?: string };
      if (e.code === 'LIMIT_FILE_SIZE') {
        const mb = MAX_VERIFY_BYTES / (1024 * 1024);
        return res.status(413).json(verificationError(413, 'too-large', `The file is larger than ${mb} MB, so it cannot be one of the office's letters. Upload the letter PDF exactly as you received it.`));
      }
      if (e.code === 'LIMIT_UNEXPECTED_FILE') {
        return res.status(400).json(verificationError(400, 'validation', `Send one file, in the form field "file" (got a file in "${e.field ?? '?'}").`));
      }
      next(err);
    });
  };

  const verifyUpload: RequestHandler = async (req, res) => {
    const file = req.file;
    if (!file) {
      res.status(400).json(verificationError(400, 'validation', 'Attach the letter PDF in the form field "file".'));
      return;
    }
    const v = toVerificationView(await verifyLetterPdf(file.buffer, findStoredLetter, await ring()));
    // Every verdict on a PDF is an answer (200), an unknown code included; only a file that is not a PDF is refused.
    if (v.status === 'not-a-pdf') res.status(415).json({ ...v, error: { status: 415, code: 'not-a-pdf', message: v.headline } });
    else res.json(v);
  };

  const byCode: RequestHandler = async (req, res) => {
    const parsed = parseVerificationCode(String(req.params['code'] ?? ''));
    if (!parsed.ok) {
      res.status(400).json({ ...verificationError(400, 'malformed-code', parsed.message), status: 'unknown-code' });
      return;
    }
    const v = toVerificationView(await verifyByCode(parsed.code, findStoredLetter, await ring()));
    const status = v.status === 'unknown-code' ? 404 : 200;
    res.status(status).json(status === 200 ? v : { ...v, error: { status, code: v.status, message: v.headline } });
  };

  const pdf: RequestHandler = async (req, res) => {
    const me = currentUser(req);
    const parsed = parseVerificationCode(String(req.params['code'] ?? ''));
    const letter = parsed.ok ? await letterWithPdf(parsed.code) : null;
    const request = letter ? await findVisibleRequest(me, letter.requestId) : null;
    if (!letter || !request) throw notFound('Letter');
    const filename = `${request.reference}-letter-v${letter.letterNo}-${letter.verificationCode}.pdf`;
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="${filename}"`,
      'Cache-Control': 'private, no-store',
      'Content-Length': String(letter.pdf!.length),
    });
    res.end(letter.pdf);
  };

  router.post('/verify', limiter, receive, verifyUpload);
  router.get('/:code/pdf', requireAuth, pdf);
  router.get('/:code', limiter, byCode);
  return router;
}
