/** A comment on a request; internal notes are hidden from the submitter. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { stampAttrs, uuidPk } from './common';

/** comments table; bodyHtml is stored already sanitised. */
export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  declare authorId: string | null;
  declare bodyHtml: string;
  declare internal: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    Comment.init(
      { id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, authorId: { type: DataTypes.UUID, allowNull: true }, bodyHtml: { type: DataTypes.TEXT, allowNull: false }, internal: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false }, ...stampAttrs },
      { sequelize, tableName: 'comments' },
    );
  }
}
