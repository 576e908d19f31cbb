/**
 * Runs pending migrations with umzug, recording them in SequelizeMeta.
 * CLI: `DATABASE_URL=mariadb://… npx tsx server/db/migrate.ts` (add `down` to revert the last one).
 */
import { pathToFileURL } from 'node:url';
import type { Sequelize, QueryInterface } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { MIGRATIONS } from './migrations/index';
import { createSequelize } from './sequelize';

function umzugFor(sequelize: Sequelize): Umzug<QueryInterface> {
  return new Umzug({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const done = await umzugFor(sequelize).up();
  return done.map((m) => m.name);
}

/** Reverts the most recent migration; returns the names reverted. */
export async function migrateDown(sequelize: Sequelize): Promise<string[]> {
  const done = await umzugFor(sequelize).down();
  return done.map((m) => m.name);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const sequelize = createSequelize(process.env['DATABASE_URL'] ?? '');
  const run = process.argv[2] === 'down' ? migrateDown : migrate;
  run(sequelize)
    .then((names) => { console.log(names.length ? `migrations: ${names.join(', ')}` : 'migrations: up to date'); })
    .catch((err: unknown) => { console.error(err); process.exitCode = 1; })
    .finally(() => sequelize.close());
}
