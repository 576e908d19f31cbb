/**
 * Recommendation letters of the workflow: gathering a decided request's rows into a
 * LetterInput, the deliberate signing step, the head's countersignature, amendments that
 * issue a superseding version, the request page's list, and the lookup the public
 * verification uses. A letter row without a PDF is one awaiting countersignature: it is
 * rendered and signed only once every required signature is given, so nothing unsigned
 * ever carries a verification code that answers.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import type { Criterion, Decision, PersonRef, Verdict } from '../../shared/api/types';
import type { LetterStatus, LetterView, VerificationView } from '../../shared/api/workflow';
import type { RerunResult } from '../../shared/stats/contract';
import { verifyPassword } from '../auth/passwords';
import { newVerificationCode, signLetter, type CanonicalRecord, type LetterPerson, type OfficeKeys, type StoredLetter, type VerificationResult } from '../letters/index';
import { badRequest, forbidden, HttpError, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { ChecklistEntry, Dataset, DecisionRow, Letter, Office, Rerun, ReviewRequest, User } from '../models/index';
import { composeLetterInput, countersignRequired, letterheadFrom, verifyUrlFor } from './letter-compose';
import { officeKeys } from './office-keys';
import { activeAssignment } from './request-access';

/** What letter work needs from the configuration. */
export interface LetterEnv {
  publicUrl: string;
  runDir: string;
}

/** How a signer confirmed: by password (local account) or by typing the reference (single sign-on only). */
export type Confirmation = 'password' | 'reference';

/** One signature given on a letter (kept in letters.signatures). */
export interface SignatureEntry {
  role: 'reviewer' | 'countersigner' | 'amended-by';
  userId: string;
  name: string;
  email: string;
  at: string;
  confirmedBy: Confirmation;
}

const REVIEWER_ROLE = 'Methods reviewer';
const HEAD_ROLE = 'Head of office';

/** Status of a stored letter: superseded once replaced, awaiting countersignature while it has no PDF. */
export function letterStatus(l: Letter): LetterStatus {
  if (l.supersededById) return 'superseded';
  return l.pdfSha256 ? 'issued' : 'awaiting-countersign';
}

const sameReference = (a: string, b: string) => a.replace(/\s+/g, '').toUpperCase() === b.replace(/\s+/g, '').toUpperCase();

/**
 * The deliberate confirmation before a signature: the typed reference must match, and a
 * person with a local password must give it again. People who sign in only through single
 * sign-on have no password here, so the typed reference is their confirmation.
 */
export async function confirmSigner(me: CurrentUser, r: ReviewRequest, body: { confirmReference: string; password?: string }): Promise<Confirmation> {
  if (!sameReference(body.confirmReference, r.reference)) {
    const msg = `Type the request reference ${r.reference} exactly to confirm; "${body.confirmReference}" does not match. Nothing was signed.`;
    throw badRequest(msg, { confirmReference: msg });
  }
  const user = await User.findByPk(me.id, { attributes: ['id', 'passwordHash'] });
  if (!user?.passwordHash) return 'reference';
  if (!body.password) {
    const msg = 'Enter your password to confirm that you are signing (re-authentication). Nothing was signed.';
    throw badRequest(msg, { password: msg });
  }
  if (!(await verifyPassword(body.password, user.passwordHash))) {
    const msg = 'The password is not correct. Nothing was signed.';
    throw new HttpError(400, 'reauth-failed', msg, { password: msg });
  }
  return 'password';
}

/** The newest decision of a request, or null. */
export async function latestDecision(requestId: string, transaction?: Transaction): Promise<DecisionRow | null> {
  return DecisionRow.findOne({ where: { requestId }, order: [['decidedAt', 'DESC'], ['createdAt', 'DESC']], transaction });
}

/** decisions.rerunId (added by the review migration, not on the core model), or null. */
export async function decisionRerunId(decisionId: string, transaction?: Transaction): Promise<string | null> {
  try {
    const rows = await DecisionRow.sequelize!.query<{ rerunId: string | null }>('SELECT rerunId FROM decisions WHERE id = ?', { replacements: [decisionId], type: QueryTypes.SELECT, transaction });
    return rows[0]?.rerunId ?? null;
  } catch {
    // Before the review migration the column does not exist: fall back to the latest rerun.
    return null;
  }
}

/** The rerun a decision rests on: the one it names, else the latest completed rerun. */
async function decisionRerun(requestId: string, decision: DecisionRow, transaction?: Transaction): Promise<Rerun> {
  const named = await decisionRerunId(decision.id, transaction);
  if (named) {
    const rerun = await Rerun.findOne({ where: { id: named, requestId, status: 'done' }, transaction });
    if (rerun) return rerun;
  }
  const latest = await Rerun.findOne({ where: { requestId, status: 'done' }, order: [['finishedAt', 'DESC'], ['createdAt', 'DESC']], transaction });
  if (!latest?.result) throw wrongState('The letter quotes the rerun the decision rests on, and this request has no completed rerun. Run the analysis first.');
  return latest;
}

function person(u: User, role?: string): LetterPerson {
  return { name: u.name, email: u.email, ...(role ? { role } : {}) };
}

/** Everything a letter version needs besides its code and signatures. */
interface IssueArgs {
  request: ReviewRequest;
  decision: DecisionRow;
  signer: User;
  signerRole: string;
  countersigner: User | null;
  /** The letter this version replaces, if any. */
  previous: Letter | null;
  /** A row awaiting countersignature that this signing completes. */
  pending?: Letter | null;
  signatures: SignatureEntry[];
  keys: OfficeKeys;
  env: LetterEnv;
  now: Date;
  transaction?: Transaction;
}

/** Renders and signs one letter version and stores it; the previous version is marked superseded. */
export async function issueLetterVersion(a: IssueArgs): Promise<Letter> {
  const t = a.transaction;
  const r = a.request;
  const office = await Office.findByPk(r.officeId, { transaction: t, rejectOnEmpty: true });
  const submitter = await User.findByPk(r.submitterId, { transaction: t, rejectOnEmpty: true });
  const rerun = await decisionRerun(r.id, a.decision, t);
  const dataset = (rerun.datasetId ? await Dataset.findByPk(rerun.datasetId, { transaction: t }) : null)
    ?? (await Dataset.findOne({ where: { requestId: r.id }, order: [['createdAt', 'DESC']], transaction: t }));
  if (!dataset) throw wrongState('The letter names the data file, and this request has none.');
  const checklist = await ChecklistEntry.findAll({ where: { requestId: r.id }, transaction: t });
  const code = a.pending?.verificationCode ?? newVerificationCode();
  const letterNo = a.pending?.letterNo ?? ((await Letter.max<number, Letter>('letterNo', { where: { requestId: r.id }, transaction: t })) ?? 0) + 1;
  const input = composeLetterInput({
    office: { name: office.name, settings: office.settings },
    request: { id: r.id, reference: r.reference, title: r.title, purpose: r.purpose, designKind: r.designKind, plan: r.plan, filedAt: r.filedAt, createdAt: r.createdAt },
    submitter,
    signer: person(a.signer, a.signerRole),
    countersigner: a.countersigner ? person(a.countersigner, HEAD_ROLE) : null,
    dataset: { filename: dataset.filename, sha256: dataset.sha256, rows: dataset.rowCount },
    rerun: { id: rerun.id, engineVersion: rerun.engineVersion, dataSha256: rerun.dataSha256, planSnapshot: rerun.planSnapshot, result: rerun.result as unknown as RerunResult },
    checklist: checklist.map((c) => ({ criterion: c.criterion as Criterion, verdict: c.verdict as Verdict | null, note: c.note, autoFinding: c.autoFinding })),
    decision: { decision: a.decision.decision, conditions: a.decision.conditions ?? [], rationale: a.decision.rationale, decidedAt: a.decision.decidedAt },
    verification: { code, url: verifyUrlFor(a.env.publicUrl, code) },
    version: letterNo,
    supersedes: a.previous?.verificationCode ?? null,
    signedAt: a.now,
  });
  const signed = await signLetter(input, a.keys.current);
  const fields = {
    pdf: signed.pdf, pdfSha256: signed.pdfSha256, record: signed.record as unknown as Record<string, unknown>, recordSignature: signed.recordSignature,
    keyId: signed.keyId, signatures: a.signatures as unknown as Record<string, unknown>[], countersignedById: a.countersigner?.id ?? null,
  };
  let letter: Letter;
  if (a.pending) {
    letter = await a.pending.update(fields, { transaction: t });
  } else {
    letter = await Letter.create({
      requestId: r.id, decisionId: a.decision.id, letterNo, decision: a.decision.decision, conditions: a.decision.conditions ?? [], verificationCode: code,
      signedById: a.signer.id, signedAt: a.now, supersededById: null, ...fields,
    }, { transaction: t });
  }
  if (a.previous) await a.previous.update({ supersededById: letter.id }, { transaction: t });
  return letter;
}

/** The office keys for signing, with the certificate naming the office of the letterhead. */
export async function keysForOffice(officeId: string, env: LetterEnv): Promise<OfficeKeys> {
  const office = await Office.findByPk(officeId, { rejectOnEmpty: true });
  const lh = letterheadFrom(office.name, office.settings);
  return officeKeys(env.runDir, { officeName: lh.officeName, unit: lh.unit || undefined });
}

/** The current letter of a request (issued and not superseded), if any. */
async function currentLetter(requestId: string, transaction?: Transaction): Promise<Letter | null> {
  const rows = await Letter.findAll({ where: { requestId, supersededById: null }, order: [['letterNo', 'DESC']], transaction });
  return rows.find((l) => l.pdfSha256) ?? null;
}

/** The letter awaiting countersignature, if any. */
async function pendingLetter(requestId: string, transaction?: Transaction): Promise<Letter | null> {
  const rows = await Letter.findAll({ where: { requestId, supersededById: null, pdfSha256: null }, transaction });
  return rows[0] ?? null;
}

/** Runs `work` with the request row locked, so two signers cannot issue two letters for one decision. */
async function withRequestLock<T>(requestId: string, work: (r: ReviewRequest, t: Transaction) => Promise<T>): Promise<T> {
  const sequelize = ReviewRequest.sequelize!;
  return sequelize.transaction(async (t) => {
    const r = await ReviewRequest.findByPk(requestId, { transaction: t, lock: t.LOCK.UPDATE, rejectOnEmpty: true });
    return work(r, t);
  });
}

const isAssignedReviewer = (me: CurrentUser, r: ReviewRequest) => me.roles.includes('reviewer') && activeAssignment(r)?.reviewerId === me.id;
const isHead = (me: CurrentUser, r: ReviewRequest) => me.roles.includes('head') && r.officeId === me.officeId;

/** Outcome of a signing step, for the route's response, audit and notification. */
export interface SignOutcome {
  letter: Letter;
  status: LetterStatus;
  confirmedBy: Confirmation;
}

function entry(role: SignatureEntry['role'], me: CurrentUser, at: Date, confirmedBy: Confirmation): SignatureEntry {
  return { role, userId: me.id, name: me.name, email: me.email, at: at.toISOString(), confirmedBy };
}

/**
 * Issues (or prepares, when the head must countersign) the letter for the request's
 * decision. `loaded` is the request as the access check loaded it (with assignments).
 */
async function issueForDecision(me: CurrentUser, loaded: ReviewRequest, decision: DecisionRow, role: SignatureEntry['role'], confirmedBy: Confirmation, env: LetterEnv, t: Transaction, locked: ReviewRequest): Promise<SignOutcome> {
  const now = new Date();
  const office = await Office.findByPk(locked.officeId, { transaction: t, rejectOnEmpty: true });
  const signer = await User.findByPk(me.id, { transaction: t, rejectOnEmpty: true });
  const signerRole = isAssignedReviewer(me, loaded) ? REVIEWER_ROLE : HEAD_ROLE;
  const signatures = [entry(role, me, now, confirmedBy)];
  // A head's own signature satisfies the countersignature rule.
  if (countersignRequired(office.settings) && !me.roles.includes('head')) {
    const letterNo = ((await Letter.max<number, Letter>('letterNo', { where: { requestId: locked.id }, transaction: t })) ?? 0) + 1;
    const code = newVerificationCode();
    const letter = await Letter.create({
      requestId: locked.id, decisionId: decision.id, letterNo, decision: decision.decision, conditions: decision.conditions ?? [], verificationCode: code,
      pdf: null, pdfSha256: null, record: { pending: true, code, version: letterNo, signerRole }, recordSignature: null,
      signatures: signatures as unknown as Record<string, unknown>[], keyId: null, signedById: me.id, countersignedById: null, signedAt: now, supersededById: null,
    }, { transaction: t });
    return { letter, status: 'awaiting-countersign', confirmedBy };
  }
  const keys = await keysForOffice(locked.officeId, env);
  const letter = await issueLetterVersion({
    request: locked, decision, signer, signerRole, countersigner: null, previous: await currentLetter(locked.id, t), signatures, keys, env, now, transaction: t,
  });
  return { letter, status: 'issued', confirmedBy };
}

/** POST …/letter/sign: the assigned reviewer signs the letter of the decided request. */
export async function signDecisionLetter(me: CurrentUser, loaded: ReviewRequest, body: { confirmReference: string; password?: string }, env: LetterEnv): Promise<SignOutcome> {
  if (!isAssignedReviewer(me, loaded)) throw forbidden('Only the reviewer assigned to this request signs its letter.');
  if (loaded.state !== 'decided') throw wrongState(`The letter is signed once the request is decided; this one is ${loaded.state.replace('-', ' ')}.`);
  const confirmedBy = await confirmSigner(me, loaded, body);
  return withRequestLock(loaded.id, async (locked, t) => {
    const decision = await latestDecision(locked.id, t);
    if (!decision) throw wrongState('This request has no recorded decision to put in a letter.');
    if (await Letter.count({ where: { decisionId: decision.id }, transaction: t })) {
      throw wrongState('A letter for this decision already exists. Letters cannot be signed twice; amend the letter to change it.');
    }
    return issueForDecision(me, loaded, decision, 'reviewer', confirmedBy, env, t, locked);
  });
}

/** POST …/letter/countersign: the office head countersigns the letter waiting for it; it is rendered, signed and issued. */
export async function countersignLetter(me: CurrentUser, loaded: ReviewRequest, body: { confirmReference: string; password?: string }, env: LetterEnv): Promise<SignOutcome> {
  if (!isHead(me, loaded)) throw forbidden('Only the head of the office countersigns letters.');
  const confirmedBy = await confirmSigner(me, loaded, body);
  return withRequestLock(loaded.id, async (locked, t) => {
    const pending = await pendingLetter(locked.id, t);
    if (!pending) throw wrongState('No letter of this request is waiting for a countersignature.');
    const decision = pending.decisionId ? await DecisionRow.findByPk(pending.decisionId, { transaction: t }) : null;
    if (!decision) throw wrongState('The decision this letter was prepared for no longer exists; sign a new letter instead.');
    const signer = await User.findByPk(pending.signedById ?? '', { transaction: t });
    if (!signer) throw wrongState('The person who signed this letter no longer exists; the letter must be signed again.');
    const now = new Date();
    const signatures = [...(pending.signatures as unknown as SignatureEntry[]), entry('countersigner', me, now, confirmedBy)];
    const signerRole = String((pending.record as { signerRole?: string }).signerRole ?? REVIEWER_ROLE);
    const head = await User.findByPk(me.id, { transaction: t, rejectOnEmpty: true });
    const letter = await issueLetterVersion({
      request: locked, decision, signer, signerRole, countersigner: head, previous: await currentLetter(locked.id, t), pending, signatures,
      keys: await keysForOffice(locked.officeId, env), env, now, transaction: t,
    });
    return { letter, status: 'issued', confirmedBy };
  });
}

/** Body of an amendment after validation. */
export interface AmendInput {
  decision: Decision;
  conditions: string[];
  rationale: string;
  reason: string;
  confirmReference: string;
  password?: string;
}

/** POST …/letter/amend: a new decision and a new letter version that supersedes the current one. */
export async function amendLetter(me: CurrentUser, loaded: ReviewRequest, body: AmendInput, env: LetterEnv): Promise<SignOutcome & { decision: DecisionRow; previous: Letter }> {
  if (!isAssignedReviewer(me, loaded) && !isHead(me, loaded)) throw forbidden('Only the assigned reviewer or the head of the office amends a letter.');
  if (loaded.state !== 'decided') throw wrongState('Only the letter of a decided request can be amended.');
  const confirmedBy = await confirmSigner(me, loaded, body);
  return withRequestLock(loaded.id, async (locked, t) => {
    if (await pendingLetter(locked.id, t)) throw wrongState('A letter of this request is still waiting for the countersignature; countersign it before amending.');
    const previous = await currentLetter(locked.id, t);
    if (!previous) throw wrongState('There is no issued letter to amend; sign the letter first.');
    const now = new Date();
    const decision = await DecisionRow.create({
      requestId: locked.id, decision: body.decision, conditions: body.conditions, rationale: body.rationale, decidedById: me.id, decidedAt: now,
    }, { transaction: t });
    const outcome = await issueForDecision(me, loaded, decision, 'amended-by', confirmedBy, env, t, locked);
    return { ...outcome, decision, previous };
  });
}

function ref(u: User | null | undefined): PersonRef | null {
  return u ? { id: u.id, name: u.name, email: u.email } : null;
}

/** The API view of letters (codes of superseding letters and people resolved). */
export async function toLetterViews(letters: Letter[], env: LetterEnv): Promise<LetterView[]> {
  const ids = [...new Set(letters.flatMap((l) => [l.signedById, l.countersignedById]).filter((x): x is string => Boolean(x)))];
  const people = new Map((await User.findAll({ where: { id: ids }, attributes: ['id', 'name', 'email'] })).map((u) => [u.id, u]));
  const newerIds = letters.map((l) => l.supersededById).filter((x): x is string => Boolean(x));
  const newer = new Map((await Letter.findAll({ where: { id: newerIds }, attributes: ['id', 'verificationCode'] })).map((l) => [l.id, l.verificationCode]));
  return letters.map((l) => ({
    code: l.verificationCode,
    letterNo: l.letterNo,
    status: letterStatus(l),
    decision: l.decision,
    signedBy: ref(people.get(l.signedById ?? '')),
    signedAt: l.signedAt ? l.signedAt.toISOString() : null,
    countersignedBy: ref(people.get(l.countersignedById ?? '')),
    supersededBy: l.supersededById ? newer.get(l.supersededById) ?? null : null,
    pdfSha256: l.pdfSha256,
    downloadUrl: `/api/letters/${l.verificationCode}/pdf`,
    verifyUrl: verifyUrlFor(env.publicUrl, l.verificationCode),
  }));
}

/** GET /api/requests/:id/letters: every version, newest first. */
export async function listLetters(requestId: string, env: LetterEnv): Promise<LetterView[]> {
  return toLetterViews(await Letter.findAll({ where: { requestId }, order: [['letterNo', 'DESC']] }), env);
}

/** One letter's view. */
export async function letterView(l: Letter, env: LetterEnv): Promise<LetterView> {
  return (await toLetterViews([l], env))[0];
}

/** Lookup for public verification: signed letters only (one awaiting countersignature is not yet a letter). */
export async function findStoredLetter(code: string): Promise<StoredLetter | null> {
  const l = await Letter.findOne({ where: { verificationCode: code } });
  if (!l?.pdfSha256 || !l.recordSignature || !l.keyId) return null;
  const newer = l.supersededById ? await Letter.findByPk(l.supersededById, { attributes: ['verificationCode', 'pdfSha256'] }) : null;
  return {
    record: l.record as unknown as CanonicalRecord,
    recordSignature: l.recordSignature,
    keyId: l.keyId,
    pdfSha256: l.pdfSha256,
    supersededBy: newer?.pdfSha256 ? newer.verificationCode : null,
  };
}

/** The signed PDF of a letter with its request, or null when there is none. */
export async function letterWithPdf(code: string): Promise<Letter | null> {
  const l = await Letter.scope('withPdf').findOne({ where: { verificationCode: code } });
  return l?.pdf ? l : null;
}

/** The public view of a verification result: the first sentence is the headline. */
export function toVerificationView(v: VerificationResult): VerificationView {
  const [headline = '', ...details] = v.details;
  const l = v.letter;
  return {
    status: v.status,
    headline,
    details,
    ...(v.code ? { code: v.code } : {}),
    ...(l
      ? {
        letter: {
          reference: l.requestReference, title: l.requestTitle, office: l.office, decision: l.decision, signedAt: l.signedAt,
          signedBy: l.countersigner ? `${l.reviewer}; countersigned by ${l.countersigner}` : l.reviewer, letterNo: l.version, supersededBy: l.supersededBy,
        },
      }
      : {}),
  };
}
