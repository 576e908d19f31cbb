/** GET /api/health: the app's and the database's status (for monitors; no session is created). */
import { Router, type RequestHandler } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Health } from '../../shared/api/types';
import { Office, User } from '../models/index';

const started = Date.now();

/**
 * What the sign-in page shows before anyone signs in: the office's name, and whether the
 * seeded demo accounts exist (then the page lists them; a real office never has them).
 */
async function officeInfo(): Promise<Pick<Health, 'demo' | 'office'>> {
  const office = await Office.findOne({ order: [['createdAt', 'ASC']] });
  const demo = (await User.count({ where: { email: 'submitter@demo.test', active: true } })) > 0;
  if (!office) return { demo };
  const letterhead = (office.settings as { letterhead?: { institution?: string; unit?: string } } | null)?.letterhead;
  const [institution, unit] = office.name.includes(' — ') ? office.name.split(' — ', 2) : [letterhead?.institution, office.name];
  return { demo, office: { name: letterhead?.unit || unit || office.name, institution: letterhead?.institution || institution } };
}

/** Creates the health router. */
export function healthRouter(sequelize: Sequelize, version: string): Router {
  const health: RequestHandler = async (_req, res) => {
    const t0 = performance.now();
    let database: Health['database'];
    try {
      await sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
      database = { status: 'ok', latencyMs: Math.round((performance.now() - t0) * 10) / 10 };
    } catch (e) {
      // The error class only: messages can carry host names and credentials hints.
      database = { status: 'down', error: (e as Error).name };
    }
    const body: Health = { status: database.status === 'ok' ? 'ok' : 'degraded', version, database, uptimeSeconds: Math.round((Date.now() - started) / 1000) };
    if (database.status === 'ok') Object.assign(body, await officeInfo());
    res.status(database.status === 'ok' ? 200 : 503).json(body);
  };
  return Router().get('/', health);
}
