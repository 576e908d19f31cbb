/** The ordered list of migrations (explicit imports so bundling and tsx both see them). */
import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';
import * as m0001 from './0001-initial';
import * as m0002 from './0002-audit-append-only';
import * as m0003 from './0003-filing';
import * as m0004 from './0004-intake';
import * as m0005 from './0005-review';

/** Every migration, oldest first; names are stored in the SequelizeMeta table. */
export const MIGRATIONS: { name: string; up: MigrationFn<QueryInterface>; down: MigrationFn<QueryInterface> }[] = [
  { name: '0001-initial', ...m0001 },
  { name: '0002-audit-append-only', ...m0002 },
  { name: '0003-filing', ...m0003 },
  { name: '0004-intake', ...m0004 },
  { name: '0005-review', ...m0005 },
];
