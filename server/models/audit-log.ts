/**
 * The append-only audit log. The model refuses updates and deletes in hooks; the
 * database refuses them too (migration 0002), so history cannot be rewritten.
 */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { uuidPk } from './common';
import type { User } from './user';

/** audit_log table. */
export class AuditLog extends Model<InferAttributes<AuditLog>, InferCreationAttributes<AuditLog>> {
  declare id: CreationOptional<string>;
  declare at: CreationOptional<Date>;
  declare actorId: string | null;
  declare action: string;
  declare entityType: string | null;
  declare entityId: string | null;
  declare details: Record<string, unknown>;
  declare ip: string | null;
  declare actor?: NonAttribute<User | null>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    const refuse = (): never => { throw new Error('audit_log is append-only'); };
    AuditLog.init(
      {
        id: uuidPk, at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: () => new Date() },
        actorId: { type: DataTypes.UUID, allowNull: true }, action: { type: DataTypes.STRING(80), allowNull: false },
        entityType: { type: DataTypes.STRING(40), allowNull: true }, entityId: { type: DataTypes.STRING(64), allowNull: true },
        details: { type: DataTypes.JSON, allowNull: false }, ip: { type: DataTypes.STRING(64), allowNull: true },
      },
      {
        sequelize, tableName: 'audit_log', timestamps: false,
        hooks: { beforeUpdate: refuse, beforeDestroy: refuse, beforeBulkUpdate: refuse, beforeBulkDestroy: refuse, beforeUpsert: refuse },
      },
    );
  }
}
