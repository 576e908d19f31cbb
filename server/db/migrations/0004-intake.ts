/**
 * Intake: why a reviewer declined an assignment (conflict of interest bars them from the
 * request later), and when the due-soon reminder went out (so it goes once).
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

/** Adds assignments.declineReason and assignments.dueReminderSentAt. */
export const up: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.addColumn('assignments', 'declineReason', { type: DataTypes.STRING(20), allowNull: true });
  await q.addColumn('assignments', 'dueReminderSentAt', { type: DataTypes.DATE(3), allowNull: true });
};

/** Removes the two columns. */
export const down: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.removeColumn('assignments', 'dueReminderSentAt');
  await q.removeColumn('assignments', 'declineReason');
};
