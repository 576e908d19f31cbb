/** Attribute helpers shared by the model definitions. */
import { DataTypes } from 'sequelize';
import { v4 as uuidv4 } from 'uuid';

/** UUID v4 primary key, generated in the application. */
export const uuidPk = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: () => uuidv4() };

/** Timestamps with millisecond precision (the migration uses DATETIME(3)). */
export const stampAttrs = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
