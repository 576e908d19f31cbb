/** GET /api/departments: the office's departments, for any signed-in person (forms need them). */
import { Router, type RequestHandler } from 'express';
import type { DepartmentRef } from '../../shared/api/types';
import { currentUser, requireAuth } from '../middleware/auth';
import { Department } from '../models/index';

const list: RequestHandler = async (req, res) => {
  const rows = await Department.findAll({ where: { officeId: currentUser(req).officeId }, order: [['name', 'ASC']] });
  res.json(rows.map((d): DepartmentRef => ({ id: d.id, code: d.code, name: d.name })));
};

/** Creates the router. */
export function departmentsRouter(): Router {
  return Router().use(requireAuth).get('/', list);
}
