/** A department of the institution that files requests (also used for conflict-of-interest rules). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** departments table. */
export class Department extends Model<InferAttributes<Department>, InferCreationAttributes<Department>> {
  declare id: CreationOptional<string>;
  declare officeId: string;
  declare name: string;
  declare code: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Department.init(
      { id: uuidPk, officeId: { type: DataTypes.UUID, allowNull: false }, name: { type: DataTypes.STRING(200), allowNull: false }, code: { type: DataTypes.STRING(20), allowNull: false }, ...stampAttrs },
      { sequelize, tableName: 'departments' },
    );
  }
}
