/** The ordered list of migrations (explicit imports so bundling and tsx both see them). */
import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';
import * as m0001 from './0001-initial';
import * as m0002 from './0002-audit-append-only';

/** Every migration, oldest first; names are stored in the SequelizeMeta table. */
export const MIGRATIONS: { name: string; up: MigrationFn<QueryInterface>; down: MigrationFn<QueryInterface> }[] = [
  { name: '0001-initial', ...m0001 },
  { name: '0002-audit-append-only', ...m0002 },
];
