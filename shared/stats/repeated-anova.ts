/**
 * Repeated-measures and mixed ANOVA (plans with at least one within factor):
 * the split-plot F tests with sphericity assessment, partial and generalized
 * eta squared, cell descriptives, Friedman's test for a single within factor,
 * and requested pairwise comparisons.
 */
import type { NonparametricRow, RerunResult, TestRow } from './contract';
import { InputError } from './contract';
import { checkSubjects } from './data/subject-checks';
import { fisherF } from './dist/index';
import { friedmanTest } from './friedman';
import type { PreparedData } from './prepared';
import { repeatedComparisons } from './repeated-comparisons';
import { cellDescriptives, splitPlotResiduals } from './repeated-descriptives';
import { buildSubjectTable } from './repeated-table';
import { shapiroWilk } from './shapiro-wilk';
import { assessSphericity, correctedTests } from './sphericity';
import { splitPlot } from './split-plot';

/** How many dropped subject ids a warning lists before summarising the rest. */
const LISTED_IDS = 10;

/** Analyse an anova plan with at least one within factor. */
export function analyseRepeated(d: PreparedData): Partial<RerunResult> {
  if (d.within.length === 0) throw new InputError('plan.within', 'A repeated-measures analysis needs at least one within-subjects factor.');
  for (const f of [...d.between, ...d.within])
    if (f.levels.length < 2) throw new InputError(`column ${f.name}`, `Factor "${f.name}" has only one level (${f.levels[0] ?? 'none'}); a factor needs at least two.`);
  const alpha = d.plan.alpha;
  const warnings: string[] = [];
  checkSubjects(d);
  const t = buildSubjectTable(d);
  if (t.dropped.length > 0) {
    const shown = t.dropped.slice(0, LISTED_IDS).join(', ');
    const more = t.dropped.length > LISTED_IDS ? ` and ${t.dropped.length - LISTED_IDS} more` : '';
    warnings.push(
      `${t.dropped.length} subject(s) lacked a value in at least one within-subjects cell and were left out of the analysis (listwise): ${shown}${more}.`,
    );
  }

  // Constant outcome: nothing to decompose.
  let grand = 0;
  for (let i = 0; i < t.y.length; i++) grand += t.y[i];
  grand /= t.y.length;
  let totalSs = 0;
  for (let i = 0; i < t.y.length; i++) totalSs += (t.y[i] - grand) ** 2;
  if (!(totalSs > 0))
    throw new InputError(`column ${d.outcome.name}`, `The outcome "${d.outcome.name}" has the same value for every complete subject and cell; there is no variation to analyse.`);

  const split = splitPlot(t, d.plan.ssType);
  const names = (bset: number[], wset: number[]) => [...bset.map((j) => d.between[j].name), ...wset.map((j) => d.within[j].name)].join(':');
  const sphericity = split.strata.map((s) => (s.p > 1 ? assessSphericity(s.error, s.modelErrorDf) : null));
  split.strata.forEach((s, i) => {
    if (sphericity[i] && !sphericity[i]!.mauchly)
      warnings.push(
        `Mauchly's test for "${s.withinSet.map((j) => d.within[j].name).join(':')}" could not be computed: its error matrix is singular ` +
          `(${s.modelErrorDf} error df for ${s.p} contrasts); the epsilon corrections are still reported.`,
      );
  });

  const tests: TestRow[] = split.terms.map((term) => {
    const name = names(term.betweenSet, term.withinSet);
    if (!(term.errorSs > 1e-13 * totalSs))
      throw new InputError(
        `column ${d.outcome.name}`,
        `The error term for "${name}" is zero: every subject shows exactly the same pattern, so its F ratio is undefined.`,
      );
    const ms = term.ss / term.df1;
    const value = ms / (term.errorSs / term.errorDf);
    const row: TestRow = {
      term: name,
      statistic: 'F',
      value,
      df1: term.df1,
      df2: term.errorDf,
      p: fisherF(term.df1, term.errorDf).sf(value),
      ss: term.ss,
      ms,
      errorSs: term.errorSs,
      errorDf: term.errorDf,
      partialEtaSq: term.ss / (term.ss + term.errorSs),
      generalizedEtaSq: term.ss / (term.ss + split.totalErrorSs),
    };
    const sph = sphericity[term.stratum];
    if (sph) {
      if (sph.mauchly) row.sphericity = sph.mauchly;
      row.corrections = correctedTests(value, term.df1, term.errorDf, sph.epsilons);
    }
    return row;
  });

  const result: Partial<RerunResult> = {
    n: t.n * t.m,
    excluded: t.dropped.length,
    subjects: t.n,
    descriptives: cellDescriptives(d, t, alpha),
    tests,
    warnings,
  };

  // Shapiro–Wilk's approximation holds for 3 to 5000 values; larger tables are not tested.
  if (t.n * t.m >= 3 && t.n * t.m <= 5000) {
    const { W, p } = shapiroWilk(splitPlotResiduals(t));
    result.assumptions = { normality: { method: 'shapiro-wilk', W, p, n: t.n * t.m } };
  }

  if (d.within.length === 1 && d.between.length === 0) {
    const fr = friedmanTest(t.y, t.n, t.m);
    const row: NonparametricRow = { term: d.within[0].name, method: 'friedman', value: fr.value, df: fr.df, p: fr.p };
    result.nonparametric = [row];
  }

  const { rows: comparisons, notes } = repeatedComparisons(d, t, split.strata[0], alpha);
  warnings.push(...notes);
  if (d.plan.comparisons.length > 0) result.comparisons = comparisons;
  return result;
}
