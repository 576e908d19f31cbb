/** A frozen copy of a request as filed in one revision round, kept readable after revisions. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** request_versions table. */
export class RequestVersion extends Model<InferAttributes<RequestVersion>, InferCreationAttributes<RequestVersion>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare revisionNo: number;
  /** The request's fields (purpose, plan, reported, dataset id) at filing time. */
  declare snapshot: Record<string, unknown>;
  /** Why the revision was made (the reviewer's required changes). */
  declare reason: string | null;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    RequestVersion.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, revisionNo: { type: DataTypes.INTEGER, allowNull: false },
        snapshot: { type: DataTypes.JSON, allowNull: false }, reason: { type: DataTypes.TEXT, allowNull: true }, createdById: { type: DataTypes.UUID, allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'request_versions' },
    );
  }
}
