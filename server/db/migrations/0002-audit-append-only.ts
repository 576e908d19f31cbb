/**
 * Makes the audit log append-only in the database itself, so neither a bug nor a
 * hand-typed query through the application's account can rewrite history.
 */
import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

/** Adds triggers refusing UPDATE and DELETE on audit_log. */
export const up: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.sequelize.query(`CREATE TRIGGER audit_log_no_update BEFORE UPDATE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
  await q.sequelize.query(`CREATE TRIGGER audit_log_no_delete BEFORE DELETE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
};

/** Removes the triggers. */
export const down: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.sequelize.query('DROP TRIGGER IF EXISTS audit_log_no_update');
  await q.sequelize.query('DROP TRIGGER IF EXISTS audit_log_no_delete');
};
