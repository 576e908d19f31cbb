/** An institutional research office: the tenant everything else belongs to. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** Office rules the head sets (stored as JSON). */
export interface OfficeSettings {
  /** Working days from filing to decision the office promises. */
  serviceLevelDays: number;
  /** Alpha proposed to submitters when the plan omits one. */
  defaultAlpha: number;
  /** Prefix of request references, e.g. "HV" gives HV-2026-001. */
  referencePrefix: string;
  /** Whether the head must countersign letters. */
  countersignRequired: boolean;
  /** Letterhead lines printed on letters. */
  letterhead: { institution: string; office: string; address: string; email: string; phone?: string };
}

/** offices table. */
export class Office extends Model<InferAttributes<Office>, InferCreationAttributes<Office>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare settings: OfficeSettings;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Office.init(
      { id: uuidPk, name: { type: DataTypes.STRING(200), allowNull: false }, settings: { type: DataTypes.JSON, allowNull: false }, version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, ...stampAttrs },
      { sequelize, tableName: 'offices', version: true },
    );
  }
}
