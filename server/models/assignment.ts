/** A reviewer assigned to a request; a declined or replaced assignment stays as history (active = false). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';
import type { User } from './user';

/** assignments table. */
export class Assignment extends Model<InferAttributes<Assignment>, InferCreationAttributes<Assignment>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare reviewerId: string;
  declare assignedById: string | null;
  /** ISO date the review is due. */
  declare dueAt: string | null;
  declare active: CreationOptional<boolean>;
  declare declined: CreationOptional<boolean>;
  declare declinedAt: Date | null;
  /** The reviewer's declared conflict of interest, when declining. */
  declare conflictNote: string | null;
  /** Why the reviewer declined ('conflict' | 'capacity' | 'other'); a conflict bars them from this request. */
  declare declineReason: CreationOptional<string | null>;
  /** When the due-soon reminder went out (it goes once per assignment). */
  declare dueReminderSentAt: CreationOptional<Date | null>;
  declare completedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare reviewer?: NonAttribute<User>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Assignment.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, reviewerId: { type: DataTypes.UUID, allowNull: false },
        assignedById: { type: DataTypes.UUID, allowNull: true }, dueAt: { type: DataTypes.DATEONLY, allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true }, declined: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        declinedAt: { type: DataTypes.DATE(3), allowNull: true }, conflictNote: { type: DataTypes.TEXT, allowNull: true },
        declineReason: { type: DataTypes.STRING(20), allowNull: true }, dueReminderSentAt: { type: DataTypes.DATE(3), allowNull: true },
        completedAt: { type: DataTypes.DATE(3), allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'assignments' },
    );
  }
}
