/**
 * Reviewer workload for the head's board and for reviewer suggestions: open requests per
 * reviewer, what is due soon or overdue, and how long recent reviews took.
 */
import { Op } from 'sequelize';
import type { RequestState } from '../../shared/api/types';
import type { ReviewerLoad, Workload } from '../../shared/api/workflow';
import { Assignment, Department, Office, ReviewRequest, User, UserRole } from '../models/index';
import { toOfficeSettings } from './office-settings';

/** States in which an assignment is on the reviewer's plate. */
export const OPEN_STATES: readonly RequestState[] = ['assigned', 'in-review', 'revision-requested'];
/** States in which the next move is the reviewer's, so a due date can slip (revision-requested waits on the submitter). */
export const REVIEWER_MOVE_STATES: readonly RequestState[] = ['assigned', 'in-review'];
/** How far back the turnaround median looks. */
export const TURNAROUND_WINDOW_DAYS = 180;

const DAY_MS = 86_400_000;

/** The calendar date (UTC) of an instant, as YYYY-MM-DD. */
export const isoDay = (d: Date): string => d.toISOString().slice(0, 10);
/** YYYY-MM-DD plus n days. */
export const addDays = (day: string, n: number): string => isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + n * DAY_MS));

/** Median of a list (null when empty). */
export function median(xs: number[]): number | null {
  if (!xs.length) return null;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** Whether a due date is overdue, due soon (within `soonDays` from today, inclusive) or neither. */
export function dueStatus(dueAt: string | null, today: string, soonDays: number): 'overdue' | 'due-soon' | null {
  if (!dueAt) return null;
  if (dueAt < today) return 'overdue';
  return dueAt <= addDays(today, soonDays) ? 'due-soon' : null;
}

/** Active people holding the reviewer role in the office, with their department. */
export async function officeReviewers(officeId: string): Promise<User[]> {
  const grants = await UserRole.findAll({ attributes: ['userId'], where: { role: 'reviewer' } });
  if (!grants.length) return [];
  return User.findAll({
    where: { id: [...new Set(grants.map((g) => g.userId))], officeId, active: true },
    include: [{ model: Department, as: 'department' }],
    order: [['name', 'ASC']],
  });
}

/** Assignments in force whose request is still open, with the request. */
export async function openAssignments(officeId: string): Promise<Assignment[]> {
  return Assignment.findAll({
    where: { active: true, declined: false },
    include: [{ model: ReviewRequest, as: 'request', required: true, where: { officeId, state: [...OPEN_STATES] } }],
    order: [['dueAt', 'ASC']],
  });
}

/** Open-assignment counts per reviewer id. */
export async function openCounts(officeId: string): Promise<Map<string, number>> {
  const counts = new Map<string, number>();
  for (const a of await openAssignments(officeId)) counts.set(a.reviewerId, (counts.get(a.reviewerId) ?? 0) + 1);
  return counts;
}

const requestOf = (a: Assignment): ReviewRequest => (a as Assignment & { request: ReviewRequest }).request;

/** The workload board of an office as of `now`. */
export async function computeWorkload(officeId: string, now = new Date()): Promise<Workload> {
  const office = await Office.findByPk(officeId, { rejectOnEmpty: true });
  const settings = toOfficeSettings(office);
  const today = isoDay(now);
  const reviewers = await officeReviewers(officeId);
  const open = await openAssignments(officeId);
  const since = new Date(now.getTime() - TURNAROUND_WINDOW_DAYS * DAY_MS);
  const done = await Assignment.findAll({
    where: { active: true, declined: false, reviewerId: reviewers.map((r) => r.id) },
    include: [{ model: ReviewRequest, as: 'request', required: true, where: { officeId, state: 'decided', decidedAt: { [Op.gte]: since, [Op.lte]: now } } }],
  });
  const loads: ReviewerLoad[] = reviewers.map((u) => {
    const mine = open.filter((a) => a.reviewerId === u.id);
    const moving = mine.filter((a) => REVIEWER_MOVE_STATES.includes(requestOf(a).state));
    const completed = done
      .filter((a) => a.reviewerId === u.id)
      .map((a) => {
        const decidedAt = requestOf(a).decidedAt ?? a.completedAt ?? now;
        return { reference: requestOf(a).reference, decidedAt: decidedAt.toISOString(), days: Math.round(((decidedAt.getTime() - a.createdAt.getTime()) / DAY_MS) * 10) / 10 };
      })
      .sort((a, b) => a.decidedAt.localeCompare(b.decidedAt));
    return {
      reviewer: { id: u.id, name: u.name, email: u.email },
      department: u.department?.name ?? null,
      expertise: u.expertise ?? [],
      openCount: mine.length,
      dueSoon: moving.filter((a) => dueStatus(a.dueAt, today, settings.dueSoonDays) === 'due-soon').length,
      overdue: moving.filter((a) => dueStatus(a.dueAt, today, settings.dueSoonDays) === 'overdue').length,
      open: mine.map((a) => ({ id: requestOf(a).id, reference: requestOf(a).reference, title: requestOf(a).title, state: requestOf(a).state, dueAt: a.dueAt })),
      medianTurnaroundDays: median(completed.map((c) => c.days)),
      completed,
    };
  });
  const unassigned = await ReviewRequest.count({ where: { officeId, state: 'filed' } });
  return { serviceLevelDays: settings.serviceLevelDays, reviewers: loads, unassigned };
}
