/** The analysis plan as filed in one revision round (the request row holds the working copy). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** analysis_plans table. */
export class AnalysisPlanRow extends Model<InferAttributes<AnalysisPlanRow>, InferCreationAttributes<AnalysisPlanRow>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare revisionNo: number;
  declare plan: Record<string, unknown>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    AnalysisPlanRow.init(
      { id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, revisionNo: { type: DataTypes.INTEGER, allowNull: false }, plan: { type: DataTypes.JSON, allowNull: false }, createdById: { type: DataTypes.UUID, allowNull: true }, ...stampAttrs },
      { sequelize, tableName: 'analysis_plans' },
    );
  }
}
