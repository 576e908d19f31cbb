/** One execution of the engine on a stored plan and data, kept for reproduction. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** Lifecycle of a rerun. */
export type RerunStatus = 'queued' | 'running' | 'done' | 'failed';

/** reruns table. */
export class Rerun extends Model<InferAttributes<Rerun>, InferCreationAttributes<Rerun>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare datasetId: string | null;
  /** Reviewer's label for the variant, e.g. "as filed" or "Welch instead of pooled". */
  declare label: string;
  declare status: CreationOptional<RerunStatus>;
  declare engineVersion: string | null;
  declare planSnapshot: Record<string, unknown>;
  declare dataSha256: string | null;
  /** Milliseconds per phase (parse, prepare, analyse, total). */
  declare timings: Record<string, number> | null;
  declare result: Record<string, unknown> | null;
  declare error: string | null;
  declare startedById: string | null;
  declare startedAt: Date | null;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Rerun.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, datasetId: { type: DataTypes.UUID, allowNull: true },
        label: { type: DataTypes.STRING(200), allowNull: false }, status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'queued' },
        engineVersion: { type: DataTypes.STRING(40), allowNull: true }, planSnapshot: { type: DataTypes.JSON, allowNull: false },
        dataSha256: { type: DataTypes.CHAR(64), allowNull: true }, timings: { type: DataTypes.JSON, allowNull: true },
        result: { type: DataTypes.JSON, allowNull: true }, error: { type: DataTypes.TEXT, allowNull: true },
        startedById: { type: DataTypes.UUID, allowNull: true }, startedAt: { type: DataTypes.DATE(3), allowNull: true },
        finishedAt: { type: DataTypes.DATE(3), allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'reruns' },
    );
  }
}
