/**
 * Filing: what an upload learns about its data (format, column profiles, preview rows,
 * identifier findings and the submitter's confirmations) and reshaped copies' origin.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const json = { type: DataTypes.JSON, allowNull: true };

/** Adds the filing columns to datasets. */
export const up: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.addColumn('datasets', 'format', { type: DataTypes.STRING(10), allowNull: true });
  await q.addColumn('datasets', 'profiles', json);
  await q.addColumn('datasets', 'previewRows', json);
  await q.addColumn('datasets', 'identifierFindings', json);
  await q.addColumn('datasets', 'identifierConfirmations', json);
  await q.addColumn('datasets', 'derivedFromId', { type: DataTypes.UUID, allowNull: true });
  await q.addConstraint('datasets', {
    type: 'foreign key', name: 'datasets_derived_from_fk', fields: ['derivedFromId'],
    references: { table: 'datasets', field: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE',
  });
  await q.addIndex('datasets', ['requestId', 'revisionNo', 'createdAt'], { name: 'datasets_request_revision' });
};

/** Removes them again. */
export const down: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.removeConstraint('datasets', 'datasets_derived_from_fk');
  await q.removeIndex('datasets', 'datasets_request_revision');
  for (const c of ['derivedFromId', 'identifierConfirmations', 'identifierFindings', 'previewRows', 'profiles', 'format']) await q.removeColumn('datasets', c);
};
