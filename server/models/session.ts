/** Session rows for connect-session-sequelize (the store is given this model). */
import { DataTypes, Model, type Sequelize } from 'sequelize';

/** sessions table; userId is filled from the session data so sign-outs everywhere are possible. */
export class SessionRow extends Model {
  /** Binds the model to a connection under the name the store looks up. */
  static initModel(sequelize: Sequelize): void {
    SessionRow.init(
      {
        sid: { type: DataTypes.STRING(64), primaryKey: true }, expires: { type: DataTypes.DATE, allowNull: true },
        data: { type: DataTypes.TEXT, allowNull: true }, userId: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'sessions', modelName: 'Session' },
    );
  }
}
