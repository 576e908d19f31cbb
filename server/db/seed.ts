/**
 * Seeds the demo office (idempotent): the office and its departments, demo people with
 * local passwords, SSO role mappings, and review requests in several states with the demo
 * studies' data and plans attached. Existing rows are left as they are.
 * CLI: `DATABASE_URL=mariadb://… [DEMO_PASSWORD=…] npx tsx server/db/seed.ts`
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Sequelize } from 'sequelize';
import { DESIGN_KINDS } from '../../shared/api/types';
import { hashPassword } from '../auth/passwords';
import { loadConfig } from '../config';
import {
  AnalysisPlanRow, Assignment, AuditLog, Comment, Dataset, DecisionRow, Department, Notification, Office, RequestVersion, ReviewRequest,
  RoleMappingRow, User, UserRole, initModels,
} from '../models/index';
import type { DatasetColumn } from '../models/dataset';
import type { OfficeSettings } from '../models/office';
import { readTableBytes } from '../tabular/index';
import { DEMO_DEPARTMENTS, DEMO_PEOPLE, DEMO_ROLE_MAPPINGS } from './demo-people';
import { DEMO_REQUESTS, type DemoRequest } from './demo-requests';
import { createSequelize } from './sequelize';
import { seedReviews } from './seed-reviews';
import { keysDirFor } from '../services/office-keys';
import { letterheadFrom } from '../services/letter-compose';
import { loadOfficeKeys, type OfficeKeys } from '../letters/index';

/** Name of the demo office. */
export const DEMO_OFFICE_NAME = 'Harrow Vale Community College — Office of Institutional Effectiveness';

/** Settings of the demo office. */
export const DEMO_OFFICE_SETTINGS: OfficeSettings = {
  serviceLevelDays: 15,
  defaultAlpha: 0.05,
  referencePrefix: 'HV',
  countersignRequired: false,
  letterhead: {
    institution: 'Harrow Vale Community College',
    office: 'Office of Institutional Effectiveness',
    address: 'Founders Hall, Room 214\n1 Orchard Row, Harrow Vale',
    email: 'oie@demo.test',
    phone: '+44 1632 960 214',
  },
};

/** Options of {@link seedDemo}. */
export interface SeedOptions {
  /** Password of every demo account (default DEMO_PASSWORD or assayer-demo). */
  password?: string;
  /** bcrypt cost (default 10: demo accounts, quick to seed). */
  rounds?: number;
  /** Folder with <slug>.csv and <slug>.plan.json (default fixtures/demo). */
  fixturesDir?: string;
  /** "Today" for relative dates (default now). */
  now?: Date;
  /** Keys directory for signing the demo letter (default ASSAYER_KEYS_DIR, else RUN_DIR/keys: the server's own). */
  keysDir?: string;
  /** Public URL printed in the demo letter's verification link (default PUBLIC_URL). */
  publicUrl?: string;
}

/** What the seed created (zeros when everything already existed). */
export interface SeedReport { office: boolean; users: number; requests: number; datasets: number }

const day = (now: Date, offset: number) => new Date(now.getTime() + offset * 86_400_000);
const dateOnly = (d: Date) => d.toISOString().slice(0, 10);

/** Column summaries of a table: number when every non-empty cell parses as a finite number. */
export function summariseColumns(header: string[], columns: string[][]): DatasetColumn[] {
  return header.map((name, i) => {
    const cells = columns[i] ?? [];
    const filled = cells.filter((c) => c.trim() !== '');
    const type: DatasetColumn['type'] = !filled.length ? 'empty' : filled.every((c) => Number.isFinite(Number(c))) ? 'number' : 'text';
    return { name, type, missing: cells.length - filled.length };
  });
}

async function attachStudy(r: ReviewRequest, d: DemoRequest, dir: string, uploaderId: string, at: Date): Promise<boolean> {
  if (!d.slug) return false;
  const csv = path.join(dir, `${d.slug}.csv`);
  const planFile = path.join(dir, `${d.slug}.plan.json`);
  let attached = false;
  if (fs.existsSync(planFile)) {
    const plan = JSON.parse(fs.readFileSync(planFile, 'utf8')) as Record<string, unknown>;
    // The fixture's own reported results (written to match its data) win over our placeholder text.
    if (!Array.isArray(plan['reported']) && d.reported.length) plan['reported'] = d.reported;
    r.plan = plan;
    r.reported = (plan['reported'] as unknown[] | undefined) ?? null;
    await r.save({ silent: true });
    await AnalysisPlanRow.create({ requestId: r.id, revisionNo: 1, plan, createdById: uploaderId, createdAt: at, updatedAt: at });
  }
  if (fs.existsSync(csv)) {
    const bytes = fs.readFileSync(csv);
    const table = await readTableBytes(bytes, path.basename(csv));
    await Dataset.create({
      requestId: r.id, revisionNo: 1, filename: path.basename(csv), mime: 'text/csv', bytes, sizeBytes: bytes.length,
      sha256: createHash('sha256').update(bytes).digest('hex'), rowCount: table.columns[0]?.length ?? 0,
      columns: summariseColumns(table.header, table.columns), uploadedById: uploaderId, createdAt: at, updatedAt: at,
    });
    attached = true;
  }
  return attached;
}

/** Seeds the demo office; safe to run again (only missing rows are added). */
export async function seedDemo(sequelize: Sequelize, opts: SeedOptions = {}): Promise<SeedReport> {
  initModels(sequelize);
  const password = opts.password ?? process.env['DEMO_PASSWORD'] ?? 'assayer-demo';
  const rounds = opts.rounds ?? 10;
  const dir = path.resolve(opts.fixturesDir ?? 'fixtures/demo');
  const now = opts.now ?? new Date();
  const report: SeedReport = { office: false, users: 0, requests: 0, datasets: 0 };

  let office = await Office.findOne({ where: { name: DEMO_OFFICE_NAME } });
  if (!office) {
    office = await Office.create({ name: DEMO_OFFICE_NAME, settings: DEMO_OFFICE_SETTINGS });
    report.office = true;
  }
  const departments = new Map<string, Department>();
  for (const d of DEMO_DEPARTMENTS) {
    const [row] = await Department.findOrCreate({ where: { officeId: office.id, code: d.code }, defaults: { officeId: office.id, code: d.code, name: d.name } });
    departments.set(d.code, row);
  }

  const people = new Map<string, User>();
  for (const p of DEMO_PEOPLE) {
    let u = await User.findOne({ where: { email: p.email } });
    if (!u) {
      u = await User.create({
        officeId: office.id, email: p.email, name: p.name, departmentId: departments.get(p.department)?.id ?? null,
        passwordHash: await hashPassword(password, rounds), samlNameId: null,
        expertise: p.expertise?.filter((k) => (DESIGN_KINDS as readonly string[]).includes(k)) ?? null, lastSignInAt: null,
      });
      for (const role of p.roles) await UserRole.create({ userId: u.id, role, source: 'manual' });
      report.users++;
    }
    people.set(p.key, u);
  }

  if (!(await RoleMappingRow.count({ where: { officeId: office.id } }))) {
    for (const m of DEMO_ROLE_MAPPINGS) await RoleMappingRow.create({ officeId: office.id, ...m });
  }

  const head = people.get('head')!;
  for (const d of DEMO_REQUESTS) {
    if (await ReviewRequest.findOne({ where: { reference: d.reference } })) continue;
    const submitter = people.get(d.submitter)!;
    const created = day(now, d.createdDay);
    const filed = d.filedDay === null ? null : day(now, d.filedDay);
    const r = await ReviewRequest.create({
      officeId: office.id, reference: d.reference, title: d.title, state: d.state, designKind: d.designKind,
      departmentId: departments.get(d.department)?.id ?? null, submitterId: submitter.id, purpose: d.purpose,
      decisionInformed: d.decisionInformed, audience: d.audience, samplingNotes: d.samplingNotes,
      deadline: d.deadlineDay === null ? null : dateOnly(day(now, d.deadlineDay)), plan: null, reported: d.reported.length ? d.reported : null,
      filedAt: filed, decidedAt: d.decision ? day(now, d.decision.day) : null, createdAt: created, updatedAt: filed ?? created,
    });
    report.requests++;
    if (await attachStudy(r, d, dir, submitter.id, created)) report.datasets++;
    if (filed) {
      await RequestVersion.create({
        requestId: r.id, revisionNo: 1, reason: null, createdById: submitter.id, createdAt: filed, updatedAt: filed,
        snapshot: { title: r.title, purpose: r.purpose, decisionInformed: r.decisionInformed, audience: r.audience, samplingNotes: r.samplingNotes, plan: r.plan, reported: r.reported },
      });
      await Notification.create({ userId: head.id, kind: 'request.filed', title: `${d.reference} was filed`, body: d.title, link: `/requests/${r.id}`, requestId: r.id, readAt: d.state === 'filed' ? null : filed, createdAt: filed, updatedAt: filed });
    }
    if (d.reviewer && filed) {
      const reviewer = people.get(d.reviewer)!;
      const assignedAt = day(filed, 1);
      await Assignment.create({
        requestId: r.id, reviewerId: reviewer.id, assignedById: head.id, dueAt: d.dueDay === null ? null : dateOnly(day(now, d.dueDay)),
        declinedAt: null, conflictNote: null, completedAt: d.decision ? day(now, d.decision.day) : null, createdAt: assignedAt, updatedAt: assignedAt,
      });
      await Notification.create({ userId: reviewer.id, kind: 'request.assigned', title: `${d.reference} was assigned to you`, body: d.title, link: `/requests/${r.id}`, requestId: r.id, readAt: null, createdAt: assignedAt, updatedAt: assignedAt });
    }
    if (d.decision && d.reviewer) {
      const at = day(now, d.decision.day);
      await DecisionRow.create({ requestId: r.id, decision: d.decision.decision, conditions: d.decision.conditions, rationale: d.decision.rationale, decidedById: people.get(d.reviewer)!.id, decidedAt: at, createdAt: at, updatedAt: at });
      await Notification.create({ userId: submitter.id, kind: 'request.decided', title: `${d.reference}: a decision was made`, body: d.title, link: `/requests/${r.id}`, requestId: r.id, readAt: null, createdAt: at, updatedAt: at });
    }
    if (d.revisionReason && d.reviewer) {
      const at = day(now, -2);
      await Comment.create({ requestId: r.id, authorId: people.get(d.reviewer)!.id, bodyHtml: `<p><strong>Changes required:</strong> ${d.revisionReason}</p>`, internal: false, createdAt: at, updatedAt: at });
      await Notification.create({ userId: submitter.id, kind: 'request.revision-requested', title: `${d.reference}: revision requested`, body: d.revisionReason, link: `/requests/${r.id}`, requestId: r.id, readAt: null, createdAt: at, updatedAt: at });
    }
  }
  const config = loadConfig();
  let keys: OfficeKeys | null = null;
  const lh = letterheadFrom(office.name, office.settings);
  const reviews = await seedReviews({
    people, now, publicUrl: opts.publicUrl ?? config.publicUrl,
    keys: () => (keys ??= loadOfficeKeys({ officeName: lh.officeName, unit: lh.unit || undefined }, { dir: opts.keysDir ?? keysDirFor(config.runDir) })),
  });
  if (report.office || report.users || report.requests || reviews.reruns || reviews.letters) {
    await AuditLog.create({ actorId: null, action: 'seed.demo', entityType: 'office', entityId: office.id, details: { ...report, ...reviews }, ip: null });
  }
  return report;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const sequelize = createSequelize(loadConfig().databaseUrl);
  seedDemo(sequelize)
    .then((r) => { console.log(`demo seed: office ${r.office ? 'created' : 'present'}, ${r.users} people, ${r.requests} requests, ${r.datasets} data files added`); })
    .catch((err: unknown) => { console.error(err); process.exitCode = 1; })
    .finally(() => sequelize.close());
}
