/**
 * /api/requests/:id/datasets: uploading data files (multipart field `file`, size-limited,
 * type sniffed from the bytes), previews, downloads, wide → long reshaping, identifier
 * confirmations and deletion. Reading follows the request's visibility (404 otherwise);
 * changing needs the submitter and an editable state (403 / 409).
 */
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { identifierConfirmSchema, reshapeSchema } from '../../shared/api/filing-schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { HttpError, badRequest } from '../middleware/errors';
import { audit } from '../services/audit';
import {
  DEFAULT_UPLOAD_MAX_BYTES, assertOwnerEditable, confirmIdentifiers, datasetBytes, deleteDataset, findDataset, listDatasets, reshapeDataset,
  storeDataset, toPreview,
} from '../services/datasets';
import { load, loaded } from './requests';
import { body } from './validate';

/** Options of the datasets router. */
export interface DatasetsRouterOptions {
  /** Largest upload in bytes (default: env UPLOAD_MAX_BYTES, else 25 MB). */
  uploadMaxBytes?: number;
}

const megabytes = (n: number) => (n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(n % (1024 * 1024) ? 1 : 0)} MB` : `${Math.ceil(n / 1024)} KB`);

/** Upload limit from the environment (positive whole number of bytes), else the default. */
export function uploadLimit(env: NodeJS.ProcessEnv = process.env): number {
  const n = Number(env['UPLOAD_MAX_BYTES']);
  return Number.isInteger(n) && n > 0 ? n : DEFAULT_UPLOAD_MAX_BYTES;
}

/** multer with our messages: 413 over the limit, 400 for a wrong field or several files. */
function receiveFile(maxBytes: number): RequestHandler {
  const single = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 6 } }).single('file');
  return (req, res, next) => {
    single(req, res, (err: unknown) => {
      if (!err) return next();
      const code = (err as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE') {
        return next(new HttpError(413, 'too-large', `The file is larger than the upload limit of ${megabytes(maxBytes)}. Remove columns or rows the analysis does not need, or save it as CSV, and try again.`, { file: `Larger than ${megabytes(maxBytes)}.` }));
      }
      if (code === 'LIMIT_UNEXPECTED_FILE' || code === 'LIMIT_FILE_COUNT' || code === 'LIMIT_PART_COUNT') {
        return next(badRequest('Send exactly one file, in the form field "file".', { file: 'Send exactly one file in the field "file".' }));
      }
      return next(badRequest(`The upload could not be read (${(err as Error).message}). Try again.`, { file: 'The upload could not be read.' }));
    });
  };
}

const mustOwnEditable: RequestHandler = (req, res, next) => {
  assertOwnerEditable(currentUser(req), loaded(res));
  next();
};

/** A file name safe to store: path parts and control characters removed; multer hands names over as latin1. */
function cleanName(raw: string): string {
  const utf8 = Buffer.from(raw, 'latin1').toString('utf8');
  const name = (utf8.includes('\uFFFD') ? raw : utf8).split(/[\\/]/).pop() ?? '';
  return name.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 255);
}

const upload: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  const file = req.file;
  if (!file) throw badRequest('Choose a file to upload (form field "file").', { file: 'Choose a file to upload.' });
  const d = await storeDataset(me, r, cleanName(file.originalname), file.buffer);
  await audit({ actorId: me.id, action: 'dataset.uploaded', entityType: 'request', entityId: r.id, details: { datasetId: d.id, filename: d.filename, sha256: d.sha256, rows: d.rowCount, revisionNo: d.revisionNo, identifierColumns: (d.identifierFindings ?? []).map((f) => f.column) } }, req);
  res.status(201).location(`/api/requests/${r.id}/datasets/${d.id}`).json(toPreview(d));
};

const list: RequestHandler = async (_req, res) => {
  res.json((await listDatasets(loaded(res))).map((d) => toPreview(d, false)));
};

const show: RequestHandler = async (req, res) => {
  res.json(toPreview(await findDataset(loaded(res), req.params['datasetId'] as string)));
};

const download: RequestHandler = async (req, res) => {
  const d = await findDataset(loaded(res), req.params['datasetId'] as string);
  const bytes = await datasetBytes(d);
  const ascii = d.filename.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  res.setHeader('Content-Type', d.mime);
  res.setHeader('Content-Disposition', `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(d.filename)}`);
  res.setHeader('X-Content-SHA256', d.sha256);
  res.send(bytes);
};

const reshape: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  const input = body(req, reshapeSchema);
  const source = await findDataset(r, req.params['datasetId'] as string);
  const d = await reshapeDataset(me, r, source, input);
  await audit({ actorId: me.id, action: 'dataset.reshaped', entityType: 'request', entityId: r.id, details: { from: source.id, datasetId: d.id, sha256: d.sha256, rows: d.rowCount, ...input } }, req);
  res.status(201).location(`/api/requests/${r.id}/datasets/${d.id}`).json(toPreview(d));
};

const confirm: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  const input = body(req, identifierConfirmSchema);
  const d = await confirmIdentifiers(await findDataset(r, req.params['datasetId'] as string), input);
  await audit({ actorId: me.id, action: 'dataset.identifiers-confirmed', entityType: 'request', entityId: r.id, details: { datasetId: d.id, confirmations: input.confirmations } }, req);
  res.json(toPreview(d));
};

const remove: RequestHandler = async (req, res) => {
  const me = currentUser(req);
  const r = loaded(res);
  const d = await findDataset(r, req.params['datasetId'] as string);
  await deleteDataset(r, d);
  await audit({ actorId: me.id, action: 'dataset.deleted', entityType: 'request', entityId: r.id, details: { datasetId: d.id, filename: d.filename, sha256: d.sha256 } }, req);
  res.status(204).end();
};

/** Creates the router; mount it at /requests beside the requests router. */
export function datasetsRouter(opts: DatasetsRouterOptions = {}): Router {
  const router = Router();
  const maxBytes = opts.uploadMaxBytes ?? uploadLimit();
  router.use('/:id/datasets', requireAuth);
  router.post('/:id/datasets', load, mustOwnEditable, receiveFile(maxBytes), upload);
  router.get('/:id/datasets', load, list);
  router.get('/:id/datasets/:datasetId', load, show);
  router.get('/:id/datasets/:datasetId/file', load, download);
  router.post('/:id/datasets/:datasetId/reshape', load, mustOwnEditable, reshape);
  router.post('/:id/datasets/:datasetId/identifiers', load, mustOwnEditable, confirm);
  router.delete('/:id/datasets/:datasetId', load, mustOwnEditable, remove);
  return router;
}
