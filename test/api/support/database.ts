/**
 * The database an API test file runs against: DATABASE_URL when the test orchestrator
 * provides one, otherwise a private MariaDB started in a temporary directory so a single
 * file can run on its own (`npx vitest run --project api test/api/auth.test.ts`).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { migrate } from '../../../server/db/migrate';

/** A database URL and how to let go of it. */
export interface TestDatabase { url: string; stop(): Promise<void> }

/** Uses DATABASE_URL, or starts a throwaway MariaDB (stopped and deleted by stop()). */
export async function acquireDatabase(): Promise<TestDatabase> {
  const given = process.env['DATABASE_URL'];
  if (given) return { url: given, stop: async () => {} };
  const { startMariaDb } = await import('../../../server/ops/mariadb');
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-api-db-'));
  const db = await startMariaDb({ dir });
  const url = await db.createDatabase('assayer_api');
  return {
    url,
    stop: async () => {
      await db.stop();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Drops every table (and with them the audit triggers), then migrates from scratch. */
export async function resetSchema(sequelize: Sequelize): Promise<void> {
  // One transaction pins one pooled connection, so FOREIGN_KEY_CHECKS=0 applies to every DROP.
  await sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<{ name: string }>('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()', { transaction, type: QueryTypes.SELECT });
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
    for (const { name } of rows) await sequelize.query(`DROP TABLE IF EXISTS \`${name}\``, { transaction });
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
  });
  await migrate(sequelize);
}
