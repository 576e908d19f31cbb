/**
 * Review: the revision round each rerun belongs to, the rerun a decision rests on, and
 * the reviewer's required changes when a request is returned for revision.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

/** Adds reruns.revisionNo, decisions.rerunId and the revision_requests table. */
export const up: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.addColumn('reruns', 'revisionNo', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
  await q.addIndex('reruns', ['requestId', 'revisionNo']);
  await q.addColumn('decisions', 'rerunId', {
    type: DataTypes.UUID, allowNull: true, references: { model: 'reruns', key: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE',
  });
  await q.createTable('revision_requests', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    requestId: { type: DataTypes.UUID, allowNull: false, references: { model: 'review_requests', key: 'id' }, onDelete: 'CASCADE', onUpdate: 'CASCADE' },
    revisionNo: { type: DataTypes.INTEGER, allowNull: false },
    changes: { type: DataTypes.JSON, allowNull: false },
    message: { type: DataTypes.TEXT, allowNull: false },
    requestedById: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE' },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
    updatedAt: { type: DataTypes.DATE(3), allowNull: false },
  }, { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' });
  await q.addIndex('revision_requests', ['requestId', 'createdAt']);
};

/** Removes what {@link up} added. */
export const down: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.dropTable('revision_requests');
  await q.removeColumn('decisions', 'rerunId');
  await q.removeIndex('reruns', ['requestId', 'revisionNo']);
  await q.removeColumn('reruns', 'revisionNo');
};
