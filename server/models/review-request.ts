/** A review request: purpose, analysis plan and state; edited by several people, hence versioned. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { DesignKind, RequestState } from '../../shared/api/types';
import { stampAttrs, uuidPk } from './common';
import type { Assignment } from './assignment';
import type { Dataset } from './dataset';
import type { Department } from './department';
import type { User } from './user';

/** review_requests table. */
export class ReviewRequest extends Model<InferAttributes<ReviewRequest>, InferCreationAttributes<ReviewRequest>> {
  declare id: CreationOptional<string>;
  declare officeId: string;
  /** Human reference such as HV-2026-001. */
  declare reference: string;
  declare title: string;
  declare state: CreationOptional<RequestState>;
  declare designKind: DesignKind | null;
  declare departmentId: string | null;
  declare submitterId: string;
  declare purpose: string;
  declare decisionInformed: string;
  declare audience: string;
  declare samplingNotes: string;
  /** ISO date (YYYY-MM-DD) by which the submitter needs the review. */
  declare deadline: string | null;
  /** Current analysis plan (engine contract shape). */
  declare plan: Record<string, unknown> | null;
  /** Results the submitter intends to report. */
  declare reported: unknown[] | null;
  /** Revision round, 1 for the first filing. */
  declare revisionNo: CreationOptional<number>;
  declare filedAt: Date | null;
  declare decidedAt: Date | null;
  /** Optimistic-locking counter managed by Sequelize. */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare submitter?: NonAttribute<User>;
  declare department?: NonAttribute<Department | null>;
  declare assignments?: NonAttribute<Assignment[]>;
  declare datasets?: NonAttribute<Dataset[]>;

  /** Binds the model to a connection. */
  static initModel(sequelize: Sequelize): void {
    ReviewRequest.init(
      {
        id: uuidPk,
        officeId: { type: DataTypes.UUID, allowNull: false },
        reference: { type: DataTypes.STRING(30), allowNull: false, unique: true },
        title: { type: DataTypes.STRING(300), allowNull: false },
        state: { type: DataTypes.STRING(30), allowNull: false, defaultValue: 'draft' },
        designKind: { type: DataTypes.STRING(30), allowNull: true },
        departmentId: { type: DataTypes.UUID, allowNull: true },
        submitterId: { type: DataTypes.UUID, allowNull: false },
        purpose: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        decisionInformed: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        audience: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        samplingNotes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        deadline: { type: DataTypes.DATEONLY, allowNull: true },
        plan: { type: DataTypes.JSON, allowNull: true },
        reported: { type: DataTypes.JSON, allowNull: true },
        revisionNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        filedAt: { type: DataTypes.DATE(3), allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...stampAttrs,
      },
      { sequelize, tableName: 'review_requests', version: true },
    );
  }
}
