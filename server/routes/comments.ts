/** The comment thread of a request: GET and POST /api/requests/:id/comments. */
import { Router, type RequestHandler } from 'express';
import { commentBodySchema } from '../../shared/api/review-schemas';
import { currentUser, requireAuth } from '../middleware/auth';
import { addComment, listComments } from '../services/comments';
import { load, loaded } from './requests';
import { body } from './validate';

const list: RequestHandler = async (req, res) => {
  res.json(await listComments(currentUser(req), loaded(res)));
};

const add: RequestHandler = async (req, res) => {
  const c = await addComment(currentUser(req), loaded(res), body(req, commentBodySchema), req);
  res.status(201).json(c);
};

/** Routes under /api/requests/:id/comments (mount at /requests). */
export function commentsRouter(): Router {
  const router = Router();
  router.use(requireAuth);
  router.get('/:id/comments', load, list);
  router.post('/:id/comments', load, add);
  return router;
}
