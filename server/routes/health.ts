/** GET /api/health: the app's and the database's status (for monitors; no session is created). */
import { Router, type RequestHandler } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Health } from '../../shared/api/types';

const started = Date.now();

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
    res.status(database.status === 'ok' ? 200 : 503).json(body);
  };
  return Router().get('/', health);
}
