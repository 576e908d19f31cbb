/**
 * Checks that decide whether a design can be analysed with the data given:
 * enough levels, enough observations per group, variation in the outcome.
 * Problems that make the analysis impossible or wrong are InputErrors; those
 * it survives become warnings.
 */
import { InputError } from '../contract';
import type { Factor, NumericColumn, PreparedData } from '../prepared';
import { levelCounts } from './factor-coding';
import { cellIndex, cellLabel, checkSubjects } from './subject-checks';

/** Throws when every used value of a numeric column is the same. */
function requireVariation(c: NumericColumn, role: string): void {
  const v = c.values;
  for (let j = 1; j < v.length; j++) if (v[j] !== v[0]) return;
  throw new InputError(
    `column ${c.name}`,
    `column ${c.name} (${role}) has the same value, ${c.offset + v[0]}, in every one of the ${v.length} rows used: there is no variation to analyse (zero variance)`,
  );
}

/** Throws when the outcome does not vary inside any group: the error variance would be zero. */
function requireWithinGroupVariation(d: PreparedData, factors: Factor[], cells = cellIndex(factors, d.n)): void {
  const { index, count } = cells;
  const first = new Float64Array(count);
  const seen = new Uint8Array(count);
  const v = d.outcome.values;
  for (let j = 0; j < d.n; j++) {
    const c = index[j];
    if (seen[c] === 0) {
      seen[c] = 1;
      first[c] = v[j];
    } else if (first[c] !== v[j]) return;
  }
  throw new InputError(
    `column ${d.outcome.name}`,
    `${d.outcome.name} is constant within every group of ${factors.map((f) => f.name).join(' × ')}, so the error variance is zero and no test statistic can be computed`,
  );
}

/** Throws when a factor has fewer than two levels among the rows used. */
function requireLevels(f: Factor, role: string): void {
  if (f.levels.length < 2) {
    throw new InputError(
      `column ${f.name}`,
      `${role} factor ${f.name} has only one level ('${f.levels[0]}') among the rows used; a factor needs at least two levels to compare`,
    );
  }
}

/** Counts observations per cell of the between factors. */
function cellCounts(d: PreparedData, cells: { index: Int32Array; count: number }): Int32Array {
  const counts = new Int32Array(cells.count);
  for (let j = 0; j < d.n; j++) counts[cells.index[j]]++;
  return counts;
}

function checkOneSample(d: PreparedData): void {
  if (d.n < 2) throw new InputError(`column ${d.outcome.name}`, `a one-sample test needs at least 2 observations of ${d.outcome.name}; the data have ${d.n}`);
  requireVariation(d.outcome, 'outcome');
}

function checkIndependent(d: PreparedData): void {
  const g = d.between[0];
  if (g.levels.length !== 2) {
    throw new InputError(
      `column ${g.name}`,
      `design "independent" compares exactly two groups, but ${g.name} has ${g.levels.length} level${g.levels.length === 1 ? '' : 's'} (${g.levels.slice(0, 8).join(', ')}${g.levels.length > 8 ? ', …' : ''}) among the rows used; use design "anova" for more than two groups`,
    );
  }
  const counts = levelCounts(g);
  g.levels.forEach((level, k) => {
    if (counts[k] < 2) {
      throw new InputError(
        `column ${g.name}`,
        `group '${level}' of ${g.name} has only ${counts[k]} observation; the two-group tests (Welch's t, Levene's test) need at least 2 in each group`,
      );
    }
  });
  requireVariation(d.outcome, 'outcome');
  requireWithinGroupVariation(d, d.between);
}

function checkPaired(d: PreparedData): void {
  const w = d.within[0];
  if (w.levels.length !== 2) {
    throw new InputError(
      `column ${w.name}`,
      `design "paired" needs exactly two conditions, but ${w.name} has ${w.levels.length} level${w.levels.length === 1 ? '' : 's'} (${w.levels.slice(0, 8).join(', ')}) among the rows used; use design "anova" with plan.within for more`,
    );
  }
  checkSubjects(d);
  requireVariation(d.outcome, 'outcome');
}

function checkBetweenAnova(d: PreparedData): void {
  d.between.forEach((f) => requireLevels(f, 'between-subjects'));
  const cells = cellIndex(d.between, d.n);
  const counts = cellCounts(d, cells);
  const count = cells.count;
  const empty: string[] = [];
  const single: string[] = [];
  for (let c = 0; c < count; c++) {
    if (counts[c] === 0) empty.push(cellLabel(d.between, c));
    else if (counts[c] === 1) single.push(cellLabel(d.between, c));
  }
  if (empty.length > 0) {
    throw new InputError(
      `column ${d.between.map((f) => f.name).join(', ')}`,
      `the group ${empty.slice(0, 5).join('; ')}${empty.length > 5 ? ` and ${empty.length - 5} more` : ''} has no observations; every combination of the between-subjects factors needs data for this design (drop a factor or merge levels)`,
    );
  }
  if (d.n - count < 1) {
    throw new InputError(
      `column ${d.outcome.name}`,
      `every group has a single observation, so there are no degrees of freedom left to estimate the error variance; more than one observation per group is needed`,
    );
  }
  if (single.length > 0) {
    d.warnings.push(
      `The group ${single.slice(0, 5).join('; ')}${single.length > 5 ? ` and ${single.length - 5} more` : ''} has only one observation. The F test still runs, but that group's variance cannot be estimated, so the checks of equal variances and any Welch or Games–Howell results lean on very little data.`,
    );
  }
  requireVariation(d.outcome, 'outcome');
  requireWithinGroupVariation(d, d.between, cells);
}

function checkRepeatedAnova(d: PreparedData): void {
  d.within.forEach((f) => requireLevels(f, 'within-subjects'));
  d.between.forEach((f) => requireLevels(f, 'between-subjects'));
  checkSubjects(d);
  const subjects = d.subject!.levels.length;
  if (subjects < 2) {
    throw new InputError(`column ${d.subject!.name}`, `repeated measures need at least 2 subjects; the rows used have ${subjects}`);
  }
  if (d.between.length > 0) {
    // Subjects per between group: one subject in a group is allowed but leaves little to estimate from.
    const { index, count } = cellIndex(d.between, d.n);
    const seen = new Uint8Array(subjects);
    const perGroup = new Int32Array(count);
    for (let j = 0; j < d.n; j++) {
      const s = d.subject!.codes[j];
      if (!seen[s]) {
        seen[s] = 1;
        perGroup[index[j]]++;
      }
    }
    for (let c = 0; c < count; c++) {
      if (perGroup[c] === 0) {
        throw new InputError(`column ${d.between.map((f) => f.name).join(', ')}`, `the group ${cellLabel(d.between, c)} has no subjects; every between-subjects group needs data`);
      }
      if (perGroup[c] === 1) d.warnings.push(`The group ${cellLabel(d.between, c)} has only one subject; its results rest on a single person.`);
    }
    if (subjects - count < 1) {
      throw new InputError(`column ${d.subject!.name}`, `each between-subjects group has a single subject, so no error degrees of freedom remain; more subjects are needed`);
    }
  }
  requireVariation(d.outcome, 'outcome');
}

function checkRegression(d: PreparedData): void {
  const p = d.predictors.length;
  if (d.n < p + 2) {
    throw new InputError(
      `column ${d.outcome.name}`,
      `a regression with ${p} predictor${p === 1 ? '' : 's'} needs at least ${p + 2} complete rows; the data have ${d.n}`,
    );
  }
  requireVariation(d.outcome, 'outcome');
  d.predictors.forEach((c) => requireVariation(c, 'predictor'));
}

/** Runs the checks for the plan's design; throws InputError or appends warnings to `d.warnings`. */
export function checkDesign(d: PreparedData): void {
  switch (d.plan.design) {
    case 'one-sample':
      return checkOneSample(d);
    case 'independent':
      return checkIndependent(d);
    case 'paired':
      return checkPaired(d);
    case 'anova':
      return d.within.length > 0 ? checkRepeatedAnova(d) : checkBetweenAnova(d);
    case 'regression':
      return checkRegression(d);
  }
}
