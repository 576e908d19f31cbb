/** The reviewer's verdict on one checklist criterion of a request, with the automatic finding. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Criterion, Verdict } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';

/** checklist_entries table (one row per request and criterion). */
export class ChecklistEntry extends Model<InferAttributes<ChecklistEntry>, InferCreationAttributes<ChecklistEntry>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare criterion: Criterion;
  declare verdict: Verdict | null;
  declare note: string;
  declare autoFinding: Record<string, unknown> | null;
  declare rerunId: string | null;
  declare reviewerId: string | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    ChecklistEntry.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, criterion: { type: DataTypes.STRING(40), allowNull: false },
        verdict: { type: DataTypes.STRING(20), allowNull: true }, note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        autoFinding: { type: DataTypes.JSON, allowNull: true }, rerunId: { type: DataTypes.UUID, allowNull: true },
        reviewerId: { type: DataTypes.UUID, allowNull: true }, version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, ...stampAttrs,
      },
      { sequelize, tableName: 'checklist_entries', version: true },
    );
  }
}
