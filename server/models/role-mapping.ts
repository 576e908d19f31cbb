/** Office configuration: an SSO attribute value that grants a role. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';

/** role_mappings table. */
export class RoleMappingRow extends Model<InferAttributes<RoleMappingRow>, InferCreationAttributes<RoleMappingRow>> {
  declare id: CreationOptional<string>;
  declare officeId: string;
  declare attribute: string;
  declare value: string;
  declare role: Role;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    RoleMappingRow.init(
      { id: uuidPk, officeId: { type: DataTypes.UUID, allowNull: false }, attribute: { type: DataTypes.STRING(100), allowNull: false }, value: { type: DataTypes.STRING(200), allowNull: false }, role: { type: DataTypes.STRING(20), allowNull: false }, ...stampAttrs },
      { sequelize, tableName: 'role_mappings' },
    );
  }
}
