/** The reviewer's decision on a request (the signed letter is built from it). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Decision } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';

/** decisions table. */
export class DecisionRow extends Model<InferAttributes<DecisionRow>, InferCreationAttributes<DecisionRow>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare decision: Decision;
  /** Conditions attached to "endorse with conditions", or required changes. */
  declare conditions: string[];
  declare rationale: string;
  declare decidedById: string | null;
  declare decidedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    DecisionRow.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, decision: { type: DataTypes.STRING(40), allowNull: false },
        conditions: { type: DataTypes.JSON, allowNull: false }, rationale: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        decidedById: { type: DataTypes.UUID, allowNull: true }, decidedAt: { type: DataTypes.DATE(3), allowNull: false }, ...stampAttrs,
      },
      { sequelize, tableName: 'decisions' },
    );
  }
}
