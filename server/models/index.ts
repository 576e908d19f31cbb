/** Binds every model to a connection and declares the associations. */
import type { Sequelize } from 'sequelize';
import { AnalysisPlanRow } from './analysis-plan';
import { Assignment } from './assignment';
import { AuditLog } from './audit-log';
import { ChecklistEntry } from './checklist-entry';
import { Comment } from './comment';
import { Dataset } from './dataset';
import { DecisionRow } from './decision';
import { Department } from './department';
import { Letter } from './letter';
import { Notification } from './notification';
import { Office } from './office';
import { RequestVersion } from './request-version';
import { Rerun } from './rerun';
import { ReviewRequest } from './review-request';
import { RoleMappingRow } from './role-mapping';
import { SessionRow } from './session';
import { User } from './user';
import { UserRole } from './user-role';

/** Every model class, re-exported so callers import from one place. */
export {
  AnalysisPlanRow, Assignment, AuditLog, ChecklistEntry, Comment, Dataset, DecisionRow, Department, Letter,
  Notification, Office, RequestVersion, Rerun, ReviewRequest, RoleMappingRow, SessionRow, User, UserRole,
};

let boundTo: Sequelize | null = null;

/** Initialises all models on the connection (idempotent for the same connection). */
export function initModels(sequelize: Sequelize): void {
  if (boundTo === sequelize) return;
  boundTo = sequelize;
  for (const m of [Office, Department, User, UserRole, RoleMappingRow, ReviewRequest, RequestVersion, Dataset, AnalysisPlanRow, Rerun,
    ChecklistEntry, Comment, Assignment, DecisionRow, Letter, Notification, AuditLog, SessionRow]) m.initModel(sequelize);

  Department.belongsTo(Office, { foreignKey: 'officeId', as: 'office' });
  User.belongsTo(Department, { foreignKey: 'departmentId', as: 'department' });
  User.hasMany(UserRole, { foreignKey: 'userId', as: 'roles' });
  ReviewRequest.belongsTo(User, { foreignKey: 'submitterId', as: 'submitter' });
  ReviewRequest.belongsTo(Department, { foreignKey: 'departmentId', as: 'department' });
  ReviewRequest.hasMany(Assignment, { foreignKey: 'requestId', as: 'assignments' });
  ReviewRequest.hasMany(Dataset, { foreignKey: 'requestId', as: 'datasets' });
  ReviewRequest.hasMany(RequestVersion, { foreignKey: 'requestId', as: 'versions' });
  ReviewRequest.hasMany(Rerun, { foreignKey: 'requestId', as: 'reruns' });
  ReviewRequest.hasMany(ChecklistEntry, { foreignKey: 'requestId', as: 'checklist' });
  ReviewRequest.hasMany(Comment, { foreignKey: 'requestId', as: 'comments' });
  ReviewRequest.hasMany(DecisionRow, { foreignKey: 'requestId', as: 'decisions' });
  ReviewRequest.hasMany(Letter, { foreignKey: 'requestId', as: 'letters' });
  Assignment.belongsTo(User, { foreignKey: 'reviewerId', as: 'reviewer' });
  Assignment.belongsTo(ReviewRequest, { foreignKey: 'requestId', as: 'request' });
  Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  AuditLog.belongsTo(User, { foreignKey: 'actorId', as: 'actor', constraints: false });
  Notification.belongsTo(User, { foreignKey: 'userId', as: 'user' });
}
