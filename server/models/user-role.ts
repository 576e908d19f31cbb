/** One role held by a person; `source` says whether an admin granted it or SSO attributes did. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';

/** Where a role grant came from: SSO-derived grants are recomputed at each SSO sign-in. */
export type RoleSource = 'manual' | 'sso';

/** user_roles table. */
export class UserRole extends Model<InferAttributes<UserRole>, InferCreationAttributes<UserRole>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare role: Role;
  declare source: RoleSource;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    UserRole.init(
      { id: uuidPk, userId: { type: DataTypes.UUID, allowNull: false }, role: { type: DataTypes.STRING(20), allowNull: false }, source: { type: DataTypes.STRING(10), allowNull: false }, ...stampAttrs },
      { sequelize, tableName: 'user_roles' },
    );
  }
}
