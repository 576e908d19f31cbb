/**
 * Automatic independence flags from the data: a subject id that appears in two levels of
 * a between-subjects factor, and repeated subject ids in a design that treats every row as
 * an independent observation. The reviewer judges; these only point at where to look.
 */
import type { RawTable } from '../../shared/stats/data/raw-table';
import type { AnalysisPlan } from '../../shared/stats/contract';

/** How many ids each flag names before summarising the rest. */
const MAX_NAMED = 5;

/** Column names that usually identify a person when the plan names no subject column. */
const SUBJECT_LIKE = /^(subject|participant|person|student|respondent|case)[ _-]?(id|no|number|code)?$|^id$/i;

/** The column to treat as the subject id: the plan's, the draft's, or an obvious id column. */
export function subjectColumn(table: RawTable, plan: AnalysisPlan, draftSubject: string | null | undefined): string | null {
  for (const c of [plan.subject, draftSubject]) if (c && table.header.includes(c)) return c;
  return table.header.find((h) => SUBJECT_LIKE.test(h.trim())) ?? null;
}

function listed(ids: string[]): string {
  const named = ids.slice(0, MAX_NAMED).join(', ');
  return ids.length > MAX_NAMED ? `${named} and ${ids.length - MAX_NAMED} more` : named;
}

/** Flags found in the data, in plain words (empty when none). */
export function independenceFlags(table: RawTable, plan: AnalysisPlan, draftSubject?: string | null): string[] {
  const subject = subjectColumn(table, plan, draftSubject);
  if (!subject) return [];
  const ids = table.columns[table.header.indexOf(subject)] ?? [];
  const present = (v: string | undefined) => v !== undefined && v.trim() !== '' && v.trim().toUpperCase() !== 'NA';
  const flags: string[] = [];

  for (const factor of plan.between ?? []) {
    const col = table.columns[table.header.indexOf(factor)];
    if (!col) continue;
    const levels = new Map<string, Set<string>>();
    ids.forEach((id, i) => {
      const level = col[i];
      if (!present(id) || !present(level)) return;
      const key = id.trim();
      if (!levels.has(key)) levels.set(key, new Set());
      levels.get(key)!.add(level!.trim());
    });
    const crossing = [...levels].filter(([, s]) => s.size > 1);
    if (crossing.length) {
      const example = crossing[0]!;
      flags.push(`${crossing.length} subject id(s) in column '${subject}' appear in more than one level of the between-subjects factor '${factor}' (${listed(crossing.map(([id]) => id))}; e.g. ${example[0]} in ${[...example[1]].join(' and ')}).`);
    }
  }

  if ((plan.within ?? []).length === 0 && plan.design !== 'paired') {
    const counts = new Map<string, number>();
    for (const id of ids) if (present(id)) counts.set(id.trim(), (counts.get(id.trim()) ?? 0) + 1);
    const repeated = [...counts].filter(([, n]) => n > 1);
    if (repeated.length) {
      flags.push(`${repeated.length} subject id(s) in column '${subject}' occur on more than one row (${listed(repeated.map(([id, n]) => `${id} ×${n}`))}), but the design treats every row as an independent observation.`);
    }
  }
  return flags;
}
