/**
 * Data files of a review request: storing an upload (sniffed, parsed, profiled and
 * scanned for identifiers; nothing is stored when any step fails), previews, the
 * submitter's identifier confirmations, wide → long reshaping, and which dataset the
 * plan uses (the newest of the revision being prepared, else the newest before it).
 */
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import type { IdentifierConfirmInput, ReshapeInput } from '../../shared/api/filing-schemas';
import type { DatasetPreview } from '../../shared/api/workflow';
import { scanForIdentifiers } from '../../shared/review/identifier-scan';
import { InputError } from '../../shared/stats/contract';
import type { RawTable } from '../../shared/stats/data/raw-table';
import { HttpError, forbidden, notFound, wrongState } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session-types';
import { Dataset, type ReviewRequest } from '../models/index';
import type { DatasetColumn } from '../models/dataset';
import { readTableBytes } from '../tabular/index';
import { checkTableShape, previewRows, profileTable, rowCount } from './dataset-profile';
import { checkReshape, wideToLongCsv } from './dataset-reshape';
import { sniffUpload, type UploadFormat } from './dataset-sniff';
import { iso } from './paging';
import { EDITABLE_STATES } from './request-access';

/** Default upload limit: 25 MB. */
export const DEFAULT_UPLOAD_MAX_BYTES = 25 * 1024 * 1024;

/** The revision an upload or a submit belongs to: the next one while a revision is being prepared. */
export function workingRevision(r: ReviewRequest): number {
  return r.state === 'revision-requested' ? r.revisionNo + 1 : r.revisionNo;
}

/** Throws unless the caller owns the request and it is still editable. */
export function assertOwnerEditable(me: CurrentUser, r: ReviewRequest, action = 'change the data of'): void {
  if (r.submitterId !== me.id) throw forbidden(`Only the submitter can ${action} a request.`);
  if (!EDITABLE_STATES.includes(r.state)) throw wrongState(`A request that is ${r.state.replace('-', ' ')} cannot be changed; its data stay as filed.`);
}

/** Name the table reader should see for a stored format (the original name may lie about the content). */
export const readerName = (format: UploadFormat | null, filename: string): string =>
  format === 'xlsx' ? 'data.xlsx' : format === 'csv' ? 'data.csv' : filename.replace(/\.xls$/i, '.csv');

/** Parses bytes of a known format; reading problems become 422 with the reader's row/column message. */
export async function readUpload(bytes: Uint8Array, format: UploadFormat): Promise<RawTable> {
  try {
    return await readTableBytes(bytes, readerName(format, ''));
  } catch (err) {
    if (err instanceof InputError) {
      const msg = err.message.charAt(0).toUpperCase() + err.message.slice(1);
      throw new HttpError(422, 'invalid-data', `${msg}.`.replace(/\.\.$/, '.'), { file: msg });
    }
    throw err;
  }
}

const legacyColumns = (d: { profiles: DatasetPreview['columns'] }): DatasetColumn[] =>
  d.profiles.map((p) => ({ name: p.name, type: p.kind === 'numeric' ? 'number' : p.kind === 'empty' ? 'empty' : 'text', missing: p.missing }));

/** Whether some identifier finding is neither gone nor confirmed. */
export function isBlocked(d: Dataset): boolean {
  const confirmed = new Set((d.identifierConfirmations ?? []).map((c) => c.column));
  return (d.identifierFindings ?? []).some((f) => !confirmed.has(f.column));
}

/**
 * Fills the filing columns of a dataset stored before they existed (e.g. the demo seed)
 * from its bytes, once, so every dataset has a profile and an identifier scan.
 */
export async function ensureProfiled(d: Dataset): Promise<Dataset> {
  if (d.profiles && d.identifierFindings && d.previewRows && d.format) return d;
  const full = await Dataset.scope('withBytes').findByPk(d.id, { rejectOnEmpty: true });
  let format: UploadFormat;
  let table: RawTable;
  try {
    format = sniffUpload(full.bytes);
    table = await readUpload(full.bytes, format);
  } catch {
    return d; // a file stored without checks that does not read: shown without a profile rather than hiding the list
  }
  d.format = format;
  d.profiles = profileTable(table);
  d.previewRows = previewRows(table);
  d.identifierFindings = scanForIdentifiers(table.header, table.columns);
  d.identifierConfirmations ??= [];
  await Dataset.update(
    { format: d.format, profiles: d.profiles, previewRows: d.previewRows, identifierFindings: d.identifierFindings, identifierConfirmations: d.identifierConfirmations },
    { where: { id: d.id }, silent: true },
  );
  return d;
}

/** API preview of a dataset; `withRows: false` leaves the preview rows out (lists). */
export function toPreview(d: Dataset, withRows = true): DatasetPreview {
  return {
    id: d.id, filename: d.filename, format: d.format ?? 'csv', sizeBytes: d.sizeBytes, sha256: d.sha256, rows: d.rowCount,
    columns: d.profiles ?? [], previewRows: withRows ? d.previewRows ?? [] : [],
    identifierFindings: d.identifierFindings ?? [], identifierConfirmations: d.identifierConfirmations ?? [], blocked: isBlocked(d),
    derivedFrom: d.derivedFromId ?? null, revisionNo: d.revisionNo, uploadedAt: iso(d.createdAt) ?? '',
  };
}

/** Options of {@link storeDataset}. */
export interface StoreOptions {
  derivedFromId?: string | null;
  confirmations?: { column: string; reason: string }[];
}

/**
 * Checks and stores an upload for the request's working revision. Throws 415/422 with a
 * specific message before anything is written.
 */
export async function storeDataset(me: CurrentUser, r: ReviewRequest, filename: string, bytes: Buffer, opts: StoreOptions = {}): Promise<Dataset> {
  const format = sniffUpload(bytes);
  const table = await readUpload(bytes, format);
  checkTableShape(table);
  const profiles = profileTable(table);
  const findings = scanForIdentifiers(table.header, table.columns);
  const names = new Set(findings.map((f) => f.column));
  const confirmations = (opts.confirmations ?? []).filter((c) => names.has(c.column));
  return Dataset.create({
    requestId: r.id, revisionNo: workingRevision(r), filename: filename.slice(0, 255) || (format === 'xlsx' ? 'data.xlsx' : 'data.csv'),
    mime: format === 'xlsx' ? 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' : 'text/csv',
    bytes, sizeBytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex'), rowCount: rowCount(table),
    columns: legacyColumns({ profiles }), uploadedById: me.id, format, profiles, previewRows: previewRows(table),
    identifierFindings: findings, identifierConfirmations: confirmations, derivedFromId: opts.derivedFromId ?? null,
  });
}

/** Datasets of a request, oldest first. */
export async function listDatasets(r: ReviewRequest): Promise<Dataset[]> {
  const rows = await Dataset.findAll({ where: { requestId: r.id }, order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  for (const d of rows) await ensureProfiled(d);
  return rows;
}

/** One dataset of the request, or 404. */
export async function findDataset(r: ReviewRequest, datasetId: string | undefined): Promise<Dataset> {
  const d = datasetId && /^[0-9a-f-]{36}$/i.test(datasetId) ? await Dataset.findOne({ where: { id: datasetId, requestId: r.id } }) : null;
  if (!d) throw notFound('Dataset');
  return ensureProfiled(d);
}

/** The stored bytes of a dataset. */
export async function datasetBytes(d: Dataset): Promise<Buffer> {
  return (await Dataset.scope('withBytes').findByPk(d.id, { attributes: ['bytes'], rejectOnEmpty: true })).bytes;
}

/** The dataset the plan uses: the newest of the working revision, else the newest of an earlier one. */
export async function currentDataset(r: ReviewRequest): Promise<Dataset | null> {
  const d = await Dataset.findOne({
    where: { requestId: r.id, revisionNo: { [Op.lte]: workingRevision(r) } },
    order: [['revisionNo', 'DESC'], ['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return d ? ensureProfiled(d) : null;
}

/** Records the submitter's reasons for keeping flagged identifier columns. */
export async function confirmIdentifiers(d: Dataset, body: IdentifierConfirmInput): Promise<Dataset> {
  const flagged = new Set((d.identifierFindings ?? []).map((f) => f.column));
  const fields: Record<string, string> = {};
  body.confirmations.forEach((c, i) => {
    if (!flagged.has(c.column)) fields[`confirmations.${i}.column`] = `Column "${c.column}" was not flagged as an identifier${flagged.size ? ` (flagged: ${[...flagged].join(', ')})` : ' (nothing was flagged)'}.`;
  });
  if (Object.keys(fields).length) throw new HttpError(422, 'validation', Object.values(fields).join(' '), fields);
  const merged = new Map((d.identifierConfirmations ?? []).map((c) => [c.column, c]));
  for (const c of body.confirmations) merged.set(c.column, { column: c.column, reason: c.reason });
  d.identifierConfirmations = [...merged.values()];
  await d.save();
  return d;
}

/** Stores the long version of a wide dataset as a new dataset derived from it. */
export async function reshapeDataset(me: CurrentUser, r: ReviewRequest, d: Dataset, body: ReshapeInput): Promise<Dataset> {
  const table = await readUpload(await datasetBytes(d), (d.format ?? 'csv') as UploadFormat);
  checkReshape(table, d.profiles ?? profileTable(table), body);
  const csv = Buffer.from(wideToLongCsv(table, body), 'utf8');
  const base = d.filename.replace(/\.(csv|tsv|txt|xlsx)$/i, '');
  return storeDataset(me, r, `${base}-long.csv`, csv, { derivedFromId: d.id, confirmations: d.identifierConfirmations ?? [] });
}

/** Deletes a dataset of the working revision (earlier revisions' data stay readable). */
export async function deleteDataset(r: ReviewRequest, d: Dataset): Promise<void> {
  if (d.revisionNo !== workingRevision(r)) throw wrongState(`This file belongs to revision ${d.revisionNo}, which was filed; it stays on record. Upload a new file instead.`);
  await Dataset.update({ derivedFromId: null }, { where: { derivedFromId: d.id } });
  await d.destroy();
}
