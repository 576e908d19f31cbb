/** A signed recommendation letter; immutable once signed, superseded by a newer letter when changed. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Decision } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';

/** letters table. `pdf` is excluded from default queries; use the withPdf scope. */
export class Letter extends Model<InferAttributes<Letter>, InferCreationAttributes<Letter>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare decisionId: string | null;
  /** 1 for the first letter of a request, 2 for the one superseding it, … */
  declare letterNo: number;
  declare decision: Decision;
  declare conditions: string[];
  declare verificationCode: string;
  declare pdf: Buffer | null;
  declare pdfSha256: string | null;
  /** Canonical record (decision, hashes, people, dates) that is signed separately. */
  declare record: Record<string, unknown>;
  declare recordSignature: string | null;
  /** Who signed and countersigned, when and with which key. */
  declare signatures: Record<string, unknown>[];
  declare keyId: string | null;
  declare signedById: string | null;
  declare countersignedById: string | null;
  declare signedAt: Date | null;
  declare supersededById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Letter.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, decisionId: { type: DataTypes.UUID, allowNull: true },
        letterNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 }, decision: { type: DataTypes.STRING(40), allowNull: false },
        conditions: { type: DataTypes.JSON, allowNull: false }, verificationCode: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        pdf: { type: DataTypes.BLOB('long'), allowNull: true }, pdfSha256: { type: DataTypes.CHAR(64), allowNull: true },
        record: { type: DataTypes.JSON, allowNull: false }, recordSignature: { type: DataTypes.TEXT, allowNull: true },
        signatures: { type: DataTypes.JSON, allowNull: false }, keyId: { type: DataTypes.STRING(100), allowNull: true },
        signedById: { type: DataTypes.UUID, allowNull: true }, countersignedById: { type: DataTypes.UUID, allowNull: true },
        signedAt: { type: DataTypes.DATE(3), allowNull: true }, supersededById: { type: DataTypes.UUID, allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'letters', defaultScope: { attributes: { exclude: ['pdf'] } }, scopes: { withPdf: {} } },
    );
  }
}
