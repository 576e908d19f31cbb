/**
 * Reruns: start one on a request (POST /api/requests/:id/reruns), list them, read one
 * (GET /api/reruns/:id), follow its progress as server-sent events, and reproduce it.
 * The engine always runs in a worker thread; these handlers only store and report.
 */
import { Router, type RequestHandler, type Response } from 'express';
import { rerunBodySchema } from '../../shared/api/review-schemas';
import type { RerunEvent } from '../../shared/api/workflow';
import { currentUser, requireAuth } from '../middleware/auth';
import { notFound } from '../middleware/errors';
import type { Rerun, ReviewRequest } from '../models/index';
import { subscribe } from '../services/rerun-live';
import { currentEvent, findRerun, listReruns, reproduceRerun, seesCompletedOnly, startRerun, toDetail, toSummaries } from '../services/reruns';
import { findVisibleRequest } from '../services/requests';
import { load, loaded } from './requests';
import { body, isUuid } from './validate';

/** Milliseconds between SSE comment lines that keep proxies from closing an idle stream (SSE_HEARTBEAT_MS). */
const heartbeatMs = () => Math.max(10, Number(process.env['SSE_HEARTBEAT_MS'] ?? 15_000) || 15_000);

const start: RequestHandler = async (req, res) => {
  const row = await startRerun(currentUser(req), loaded(res), body(req, rerunBodySchema), req);
  const [summary] = await toSummaries([row]);
  res.status(202).location(`/api/reruns/${row.id}`).json(summary);
};

const list: RequestHandler = async (req, res) => {
  res.json(await listReruns(currentUser(req), loaded(res)));
};

/** Resolves :id to a rerun of a request the caller may see; the submitter sees completed reruns only. */
const loadRerun: RequestHandler = async (req, res, next) => {
  const id = req.params['id'];
  const me = currentUser(req);
  const row = isUuid(id) ? await findRerun(id) : null;
  const r = row ? await findVisibleRequest(me, row.requestId) : null;
  if (!row || !r || (seesCompletedOnly(me, r) && row.status !== 'done')) throw notFound('Rerun');
  res.locals['rerun'] = row;
  res.locals['request'] = r;
  next();
};
const rerunOf = (res: Response): Rerun => res.locals['rerun'] as Rerun;
const requestOf = (res: Response): ReviewRequest => res.locals['request'] as ReviewRequest;

const show: RequestHandler = async (_req, res) => {
  res.json(await toDetail(rerunOf(res)));
};

const reproduce: RequestHandler = async (req, res) => {
  const out = await reproduceRerun(currentUser(req), requestOf(res), rerunOf(res), req);
  res.status(201).location(`/api/reruns/${out.rerun.id}`).json(out);
};

/** Server-sent events: the current state at once, then every change; ends on done or failed. */
const events: RequestHandler = async (req, res) => {
  const row = rerunOf(res);
  res.status(200).set({
    'Content-Type': 'text/event-stream; charset=utf-8',
    'Cache-Control': 'no-cache, no-transform',
    Connection: 'keep-alive',
    'X-Accel-Buffering': 'no',
  });
  res.flushHeaders();
  res.write('retry: 3000\n\n');
  let closed = false;
  let unsubscribe: (() => void) | null = null;
  const heartbeat = setInterval(() => { if (!closed) res.write(': heartbeat\n\n'); }, heartbeatMs());
  const finish = () => {
    if (closed) return;
    closed = true;
    clearInterval(heartbeat);
    unsubscribe?.();
    res.end();
  };
  const send = (e: RerunEvent) => {
    if (closed) return;
    const name = e.status === 'done' ? 'done' : e.status === 'failed' ? 'failed' : 'progress';
    res.write(`event: ${name}\ndata: ${JSON.stringify(e)}\n\n`);
    if (name !== 'progress') finish();
  };
  req.on('close', finish);
  // Subscribe before reading the state so no change between the two is lost.
  unsubscribe = subscribe(row.id, send);
  send(await currentEvent(row));
  if (!unsubscribe && !closed) {
    // Not running in this process and not final: nothing more will come.
    finish();
  }
};

/** Routes under /api/requests/:id (mount at /requests). */
export function requestRerunsRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.post('/:id/reruns', load, start);
  router.get('/:id/reruns', load, list);
  return router;
}

/** Routes under /api/reruns (mount at /reruns). */
export function rerunsRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/:id', loadRerun, show);
  router.get('/:id/events', loadRerun, events);
  router.post('/:id/reproduce', loadRerun, reproduce);
  return router;
}
