/** A person who signs in (locally, through SSO, or both). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';
import type { Department } from './department';
import type { UserRole } from './user-role';

/** users table. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare officeId: string;
  declare email: string;
  declare name: string;
  declare departmentId: string | null;
  /** bcrypt hash; null for SSO-only people. */
  declare passwordHash: string | null;
  /** NameID last asserted by the identity provider; null for local-only people. */
  declare samlNameId: string | null;
  /** Declared methods expertise (design kinds), used to suggest reviewers. */
  declare expertise: string[] | null;
  declare active: CreationOptional<boolean>;
  declare lastSignInAt: Date | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare roles?: NonAttribute<UserRole[]>;
  declare department?: NonAttribute<Department | null>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: uuidPk,
        officeId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true, set(v: string) { this.setDataValue('email', v.trim().toLowerCase()); } },
        name: { type: DataTypes.STRING(200), allowNull: false },
        departmentId: { type: DataTypes.UUID, allowNull: true },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        samlNameId: { type: DataTypes.STRING(254), allowNull: true },
        expertise: { type: DataTypes.JSON, allowNull: true },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        lastSignInAt: { type: DataTypes.DATE(3), allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...stampAttrs,
      },
      { sequelize, tableName: 'users', version: true },
    );
  }
}
