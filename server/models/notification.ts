/** An in-app notification for one person. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** notifications table. */
export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  /** Event kind, e.g. "request.filed", "request.assigned". */
  declare kind: string;
  declare title: string;
  declare body: string;
  /** App-relative link, e.g. /requests/<id>. */
  declare link: string | null;
  declare requestId: string | null;
  declare readAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Notification.init(
      {
        id: uuidPk, userId: { type: DataTypes.UUID, allowNull: false }, kind: { type: DataTypes.STRING(40), allowNull: false },
        title: { type: DataTypes.STRING(300), allowNull: false }, body: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        link: { type: DataTypes.STRING(500), allowNull: true }, requestId: { type: DataTypes.UUID, allowNull: true },
        readAt: { type: DataTypes.DATE(3), allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'notifications' },
    );
  }
}
