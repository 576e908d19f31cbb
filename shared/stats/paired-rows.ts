/**
 * Pairs the long-format rows of a paired design by subject: one value per
 * subject for each of the two levels of the within factor.
 */
import { InputError } from './contract';
import { checkSubjects } from './data/subject-checks';
import type { PreparedData } from './prepared';

/** Values of the two conditions, aligned by subject, and the subjects left out. */
export interface PairedValues {
  /** Centred outcome at the first level, one entry per complete subject. */
  first: Float64Array;
  /** Centred outcome at the second level, same subject order. */
  second: Float64Array;
  /** Labels of subjects that lacked one of the two levels. */
  droppedSubjects: string[];
}

/**
 * Aligns rows by subject. A subject missing a level is dropped (listed in the
 * result); a subject with two rows for the same level is an input error
 * (checkSubjects), because there is no principled way to choose between them.
 */
export function pairBySubject(d: PreparedData): PairedValues {
  const subject = d.subject;
  if (!subject) throw new InputError('plan.subject', 'A paired design needs plan.subject: the column that identifies each subject.');
  if (d.within.length !== 1) throw new InputError('plan.within', `A paired design needs exactly one within-subjects column in plan.within; got ${d.within.length}.`);
  const w = d.within[0];
  if (w.levels.length !== 2)
    throw new InputError(`column ${w.name}`, `The within-subjects column "${w.name}" must have exactly two conditions for a paired test; found ${w.levels.length} (${w.levels.join(', ')}).`);
  checkSubjects(d);
  const ns = subject.levels.length;
  const slot = new Int32Array(ns * 2).fill(-1);
  for (let i = 0; i < subject.codes.length; i++) {
    const key = subject.codes[i] * 2 + w.codes[i];
    if (slot[key] >= 0)
      throw new InputError(
        `row ${d.rowNumbers[i]}`,
        `Subject "${subject.levels[subject.codes[i]]}" has more than one row for "${w.name}" = "${w.levels[w.codes[i]]}" (rows ${d.rowNumbers[slot[key]]} and ${d.rowNumbers[i]}, counting the header as row 1).`,
      );
    slot[key] = i;
  }
  const first: number[] = [];
  const second: number[] = [];
  const droppedSubjects: string[] = [];
  const y = d.outcome.values;
  for (let s = 0; s < ns; s++) {
    const i0 = slot[2 * s];
    const i1 = slot[2 * s + 1];
    if (i0 < 0 || i1 < 0) {
      if (i0 >= 0 || i1 >= 0) droppedSubjects.push(subject.levels[s]);
      continue;
    }
    first.push(y[i0]);
    second.push(y[i1]);
  }
  return { first: Float64Array.from(first), second: Float64Array.from(second), droppedSubjects };
}
