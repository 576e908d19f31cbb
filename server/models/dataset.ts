/** An uploaded data file, stored in the database with its SHA-256. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ColumnProfile } from '../../shared/api/workflow';
import type { IdentifierFinding } from '../../shared/review/identifier-scan';
import { stampAttrs, uuidPk } from './common';

/** Column summary stored with a dataset. */
export interface DatasetColumn {
  name: string;
  type: 'number' | 'text' | 'date' | 'empty';
  missing: number;
}

/** datasets table. `bytes` is excluded from default queries; ask for it explicitly. */
export class Dataset extends Model<InferAttributes<Dataset>, InferCreationAttributes<Dataset>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare revisionNo: number;
  declare filename: string;
  declare mime: string;
  declare bytes: Buffer;
  declare sizeBytes: number;
  declare sha256: string;
  declare rowCount: number;
  declare columns: DatasetColumn[];
  declare uploadedById: string | null;
  /** Filing (migration 0003): detected format; null on rows written before it. */
  declare format: CreationOptional<'csv' | 'xlsx' | null>;
  /** Column profiles (numeric, categorical, identifier-like, empty) computed at upload. */
  declare profiles: CreationOptional<ColumnProfile[] | null>;
  /** First rows (at most 20) as cell strings, for the preview table. */
  declare previewRows: CreationOptional<string[][] | null>;
  /** Columns that look like direct identifiers. */
  declare identifierFindings: CreationOptional<IdentifierFinding[] | null>;
  /** Flagged columns the submitter confirmed as needed, with the reason. */
  declare identifierConfirmations: CreationOptional<{ column: string; reason: string }[] | null>;
  /** The dataset this one was reshaped from (wide → long). */
  declare derivedFromId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Dataset.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, revisionNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        filename: { type: DataTypes.STRING(255), allowNull: false }, mime: { type: DataTypes.STRING(120), allowNull: false },
        bytes: { type: DataTypes.BLOB('long'), allowNull: false }, sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false }, rowCount: { type: DataTypes.INTEGER, allowNull: false },
        columns: { type: DataTypes.JSON, allowNull: false }, uploadedById: { type: DataTypes.UUID, allowNull: true },
        format: { type: DataTypes.STRING(10), allowNull: true, defaultValue: null }, profiles: { type: DataTypes.JSON, allowNull: true, defaultValue: null },
        previewRows: { type: DataTypes.JSON, allowNull: true, defaultValue: null }, identifierFindings: { type: DataTypes.JSON, allowNull: true, defaultValue: null },
        identifierConfirmations: { type: DataTypes.JSON, allowNull: true, defaultValue: null }, derivedFromId: { type: DataTypes.UUID, allowNull: true, defaultValue: null },
        ...stampAttrs,
      },
      { sequelize, tableName: 'datasets', defaultScope: { attributes: { exclude: ['bytes'] } }, scopes: { withBytes: {} } },
    );
  }
}
