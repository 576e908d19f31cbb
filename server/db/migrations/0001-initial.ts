/**
 * The first schema: people and roles, the office, review requests with their versions,
 * data, plans, reruns, checklist, comments, assignments, decisions and letters,
 * notifications, the audit log and the session store.
 */
import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
const ref = (table: string, allowNull = false, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT' = 'RESTRICT') => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const stamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const lock = { version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 } };
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

/** Creates every table of the first release. */
export const up: MigrationFn<QueryInterface> = async ({ context: q }) => {
  await q.createTable('offices', { id, name: { type: DataTypes.STRING(200), allowNull: false }, settings: { type: DataTypes.JSON, allowNull: false }, ...lock, ...stamps }, opts);
  await q.createTable('departments', {
    id, officeId: ref('offices', false, 'CASCADE'),
    name: { type: DataTypes.STRING(200), allowNull: false }, code: { type: DataTypes.STRING(20), allowNull: false }, ...stamps,
  }, opts);
  await q.addIndex('departments', ['officeId', 'code'], { unique: true });
  await q.createTable('users', {
    id, officeId: ref('offices', false),
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    departmentId: ref('departments', true, 'SET NULL'),
    passwordHash: { type: DataTypes.STRING(100), allowNull: true },
    samlNameId: { type: DataTypes.STRING(254), allowNull: true, unique: true },
    expertise: { type: DataTypes.JSON, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    lastSignInAt: { type: DataTypes.DATE(3), allowNull: true },
    ...lock, ...stamps,
  }, opts);
  await q.createTable('user_roles', {
    id, userId: ref('users', false, 'CASCADE'),
    role: { type: DataTypes.STRING(20), allowNull: false },
    source: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'manual' }, ...stamps,
  }, opts);
  await q.addIndex('user_roles', ['userId', 'role'], { unique: true });
  await q.createTable('role_mappings', {
    id, officeId: ref('offices', false, 'CASCADE'),
    attribute: { type: DataTypes.STRING(100), allowNull: false }, value: { type: DataTypes.STRING(200), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false }, ...stamps,
  }, opts);
  await q.addIndex('role_mappings', ['officeId', 'attribute', 'value', 'role'], { unique: true, name: 'role_mappings_unique' });
  await q.createTable('review_requests', {
    id, officeId: ref('offices', false),
    reference: { type: DataTypes.STRING(30), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(300), allowNull: false },
    state: { type: DataTypes.STRING(30), allowNull: false, defaultValue: 'draft' },
    designKind: { type: DataTypes.STRING(30), allowNull: true },
    departmentId: ref('departments', true, 'SET NULL'),
    submitterId: ref('users', false),
    purpose: { type: DataTypes.TEXT, allowNull: false },
    decisionInformed: { type: DataTypes.TEXT, allowNull: false },
    audience: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    samplingNotes: { type: DataTypes.TEXT, allowNull: false },
    deadline: { type: DataTypes.DATEONLY, allowNull: true },
    plan: { type: DataTypes.JSON, allowNull: true },
    reported: { type: DataTypes.JSON, allowNull: true },
    revisionNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    filedAt: { type: DataTypes.DATE(3), allowNull: true },
    decidedAt: { type: DataTypes.DATE(3), allowNull: true },
    ...lock, ...stamps,
  }, opts);
  await q.addIndex('review_requests', ['officeId', 'state']);
  await q.addIndex('review_requests', ['submitterId']);
  await q.createTable('request_versions', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    revisionNo: { type: DataTypes.INTEGER, allowNull: false },
    snapshot: { type: DataTypes.JSON, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: true },
    createdById: ref('users', true, 'SET NULL'), ...stamps,
  }, opts);
  await q.addIndex('request_versions', ['requestId', 'revisionNo'], { unique: true });
  await q.createTable('datasets', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    revisionNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    mime: { type: DataTypes.STRING(120), allowNull: false },
    bytes: { type: DataTypes.BLOB('long'), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    rowCount: { type: DataTypes.INTEGER, allowNull: false },
    columns: { type: DataTypes.JSON, allowNull: false },
    uploadedById: ref('users', true, 'SET NULL'), ...stamps,
  }, opts);
  await q.createTable('analysis_plans', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    revisionNo: { type: DataTypes.INTEGER, allowNull: false },
    plan: { type: DataTypes.JSON, allowNull: false },
    createdById: ref('users', true, 'SET NULL'), ...stamps,
  }, opts);
  await q.createTable('reruns', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    datasetId: ref('datasets', true, 'SET NULL'),
    label: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'queued' },
    engineVersion: { type: DataTypes.STRING(40), allowNull: true },
    planSnapshot: { type: DataTypes.JSON, allowNull: false },
    dataSha256: { type: DataTypes.CHAR(64), allowNull: true },
    timings: { type: DataTypes.JSON, allowNull: true },
    result: { type: DataTypes.JSON, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    startedById: ref('users', true, 'SET NULL'),
    startedAt: { type: DataTypes.DATE(3), allowNull: true },
    finishedAt: { type: DataTypes.DATE(3), allowNull: true }, ...stamps,
  }, opts);
  await q.createTable('checklist_entries', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    criterion: { type: DataTypes.STRING(40), allowNull: false },
    verdict: { type: DataTypes.STRING(20), allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false },
    autoFinding: { type: DataTypes.JSON, allowNull: true },
    rerunId: ref('reruns', true, 'SET NULL'),
    reviewerId: ref('users', true, 'SET NULL'),
    ...lock, ...stamps,
  }, opts);
  await q.addIndex('checklist_entries', ['requestId', 'criterion'], { unique: true });
  await q.createTable('comments', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    authorId: ref('users', true, 'SET NULL'),
    bodyHtml: { type: DataTypes.TEXT, allowNull: false },
    internal: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false }, ...stamps,
  }, opts);
  await q.createTable('assignments', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    reviewerId: ref('users', false),
    assignedById: ref('users', true, 'SET NULL'),
    dueAt: { type: DataTypes.DATEONLY, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    declined: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    declinedAt: { type: DataTypes.DATE(3), allowNull: true },
    conflictNote: { type: DataTypes.TEXT, allowNull: true },
    completedAt: { type: DataTypes.DATE(3), allowNull: true }, ...stamps,
  }, opts);
  await q.addIndex('assignments', ['reviewerId', 'active']);
  await q.createTable('decisions', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    decision: { type: DataTypes.STRING(40), allowNull: false },
    conditions: { type: DataTypes.JSON, allowNull: false },
    rationale: { type: DataTypes.TEXT, allowNull: false },
    decidedById: ref('users', true, 'SET NULL'),
    decidedAt: { type: DataTypes.DATE(3), allowNull: false }, ...stamps,
  }, opts);
  await q.createTable('letters', {
    id, requestId: ref('review_requests', false, 'CASCADE'),
    decisionId: ref('decisions', true, 'SET NULL'),
    letterNo: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    decision: { type: DataTypes.STRING(40), allowNull: false },
    conditions: { type: DataTypes.JSON, allowNull: false },
    verificationCode: { type: DataTypes.STRING(40), allowNull: false, unique: true },
    pdf: { type: DataTypes.BLOB('long'), allowNull: true },
    pdfSha256: { type: DataTypes.CHAR(64), allowNull: true },
    record: { type: DataTypes.JSON, allowNull: false },
    recordSignature: { type: DataTypes.TEXT, allowNull: true },
    signatures: { type: DataTypes.JSON, allowNull: false },
    keyId: { type: DataTypes.STRING(100), allowNull: true },
    signedById: ref('users', true, 'SET NULL'),
    countersignedById: ref('users', true, 'SET NULL'),
    signedAt: { type: DataTypes.DATE(3), allowNull: true },
    supersededById: ref('letters', true, 'SET NULL'), ...stamps,
  }, opts);
  await q.createTable('notifications', {
    id, userId: ref('users', false, 'CASCADE'),
    kind: { type: DataTypes.STRING(40), allowNull: false },
    title: { type: DataTypes.STRING(300), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    link: { type: DataTypes.STRING(500), allowNull: true },
    requestId: ref('review_requests', true, 'CASCADE'),
    readAt: { type: DataTypes.DATE(3), allowNull: true }, ...stamps,
  }, opts);
  await q.addIndex('notifications', ['userId', 'createdAt']);
  await q.createTable('audit_log', {
    id,
    at: { type: DataTypes.DATE(3), allowNull: false },
    actorId: { type: DataTypes.UUID, allowNull: true },
    action: { type: DataTypes.STRING(80), allowNull: false },
    entityType: { type: DataTypes.STRING(40), allowNull: true },
    entityId: { type: DataTypes.STRING(64), allowNull: true },
    details: { type: DataTypes.JSON, allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: true },
  }, opts);
  await q.addIndex('audit_log', ['at']);
  await q.addIndex('audit_log', ['actorId']);
  await q.addIndex('audit_log', ['entityType', 'entityId']);
  await q.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    userId: { type: DataTypes.UUID, allowNull: true },
    ...stamps,
  }, opts);
};

/** Drops every table of the first release. */
export const down: MigrationFn<QueryInterface> = async ({ context: q }) => {
  for (const t of ['sessions', 'audit_log', 'notifications', 'letters', 'decisions', 'assignments', 'comments', 'checklist_entries', 'reruns',
    'analysis_plans', 'datasets', 'request_versions', 'review_requests', 'role_mappings', 'user_roles', 'users', 'departments', 'offices']) {
    await q.dropTable(t);
  }
};
