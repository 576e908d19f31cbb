/**
 * The reviewer's required changes when a request is returned for revision (revision_requests,
 * migration 0005). Bound lazily to the connection the core models use, so models/index.ts
 * needs no change.
 */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { stampAttrs, uuidPk } from './common';
import { ReviewRequest } from './review-request';

/** revision_requests table. */
export class RevisionRequestRow extends Model<InferAttributes<RevisionRequestRow>, InferCreationAttributes<RevisionRequestRow>> {
  declare id: CreationOptional<string>;
  declare requestId: string;
  /** The revision round that was returned (the submitter's next revision is this + 1). */
  declare revisionNo: number;
  declare changes: string[];
  declare message: string;
  declare requestedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds {@link RevisionRequestRow} to the core models' connection (idempotent) and returns it. */
export function revisionRequests(): typeof RevisionRequestRow {
  const sequelize = ReviewRequest.sequelize;
  if (!sequelize) throw new Error('Models are not initialised (initModels first).');
  if (RevisionRequestRow.sequelize !== sequelize) {
    RevisionRequestRow.init(
      {
        id: uuidPk, requestId: { type: DataTypes.UUID, allowNull: false }, revisionNo: { type: DataTypes.INTEGER, allowNull: false },
        changes: { type: DataTypes.JSON, allowNull: false }, message: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        requestedById: { type: DataTypes.UUID, allowNull: true }, ...stampAttrs,
      },
      { sequelize, tableName: 'revision_requests' },
    );
  }
  return RevisionRequestRow;
}
