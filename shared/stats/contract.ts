/**
 * The public JSON contract of the Assayer statistics engine.
 *
 * These types describe the analysis plan that goes into a rerun and the result
 * that comes out. Office scripts call `npm run rerun` and read this JSON, the
 * server stores it with every rerun, and the Angular app renders it. Field names
 * are stable: add new optional fields, never rename or remove existing ones.
 * The narrative version of this contract is docs/rerun-contract.md.
 */

/** Design kinds understood by the engine (the plan's `design` field). */
export const DESIGNS = ['one-sample', 'independent', 'paired', 'anova', 'regression'] as const;
/** One of {@link DESIGNS}. */
export type Design = (typeof DESIGNS)[number];

/** Pairwise comparison procedures (the plan's `comparisons[].method`). */
export const COMPARISON_METHODS = ['tukey', 'games-howell', 'bonferroni', 'holm', 'bh'] as const;
/** One of {@link COMPARISON_METHODS}. */
export type ComparisonMethod = (typeof COMPARISON_METHODS)[number];

/** A requested family of pairwise comparisons among the levels of one factor. */
export interface ComparisonRequest {
  factor: string;
  method: ComparisonMethod;
}

/** The analysis plan: what to compute and from which columns. */
export interface AnalysisPlan {
  design: Design;
  /** Outcome (dependent variable) column. */
  outcome: string;
  /** Between-subjects factor columns (anova, independent). */
  between?: string[];
  /** Within-subjects factor columns (anova, paired); needs `subject`. */
  within?: string[];
  /** Subject identifier column (paired, repeated measures, mixed). */
  subject?: string;
  /** Predictor columns (regression). */
  predictors?: string[];
  /** Hypothesised mean for one-sample tests (default 0). */
  mu?: number;
  /** Known population SD for a one-sample z test. */
  sigma?: number;
  /** Significance level (default 0.05). */
  alpha?: number;
  /** Sums-of-squares type for between-subjects terms (default 3). */
  ssType?: 2 | 3;
  /** Pairwise comparisons to compute. */
  comparisons?: ComparisonRequest[];
  /**
   * Reported results to reconcile, as the submitter typed them, e.g.
   * "F(2, 27) = 4.85, p = .016". Optional extension of the contract.
   */
  reported?: ReportedInput[];
}

/** One reported statistic to reconcile: a reporting string, optionally tied to a term. */
export interface ReportedInput {
  /** Term the statistic refers to (factor name, "a:b", "mean", "model"); guessed when absent. */
  term?: string;
  /** The statistic as typed, e.g. "t(28) = 2.10, p = .045". */
  text: string;
}

/** Descriptive statistics of one cell (one combination of factor levels). */
export interface CellDescriptives {
  /** Factor name → level, in plan order; empty for a single sample. */
  levels: Record<string, string>;
  n: number;
  mean: number;
  sd: number;
  se: number;
  ciLower: number;
  ciUpper: number;
}

/** Corrected degrees of freedom and p for one sphericity correction. */
export interface SphericityCorrection {
  epsilon: number;
  df1: number;
  df2: number;
  p: number;
}

/** One inferential test row. */
export interface TestRow {
  /** Factor name, interaction "a:b" (between first, then within), "mean" or "model". */
  term: string;
  statistic: 't' | 'z' | 'F';
  /** "student" / "welch" on the t tests of `independent`; "welch" on Welch's ANOVA; "paired" on paired t. */
  variant?: string;
  value: number;
  /** t and z tests. */
  df?: number;
  /** F tests. */
  df1?: number;
  df2?: number;
  p: number;
  ss?: number;
  ms?: number;
  /** Error term of an F test (extension): residual or subject-by-term error. */
  errorSs?: number;
  errorDf?: number;
  estimate?: number;
  ciLower?: number;
  ciUpper?: number;
  partialEtaSq?: number;
  generalizedEtaSq?: number;
  etaSq?: number;
  omegaSq?: number;
  cohensD?: number;
  /** Cohen's d interval (extension). */
  cohensDCi?: [number, number];
  hedgesG?: number;
  hedgesGCi?: [number, number];
  /** d_z for paired designs (extension). */
  dz?: number;
  sphericity?: { W: number; chiSq: number; df: number; p: number };
  corrections?: { gg: SphericityCorrection; hf: SphericityCorrection; lb: SphericityCorrection };
}

/** Residual row of a between-subjects ANOVA. */
export interface ResidualRow {
  ss: number;
  df: number;
  ms: number;
}

/** A test of equal variances. */
export interface VarianceTest {
  center: 'mean' | 'median';
  value: number;
  df1: number;
  df2: number;
  p: number;
}

/** Assumption checks that apply to the design. */
export interface Assumptions {
  levene?: VarianceTest;
  brownForsythe?: VarianceTest;
  normality?: { method: 'shapiro-wilk'; W: number; p: number; n?: number };
  /** Largest over smallest cell variance (extension). */
  varianceRatio?: number;
}

/** A rank-based alternative test. */
export interface NonparametricRow {
  term: string;
  method: 'mann-whitney' | 'wilcoxon' | 'kruskal-wallis' | 'friedman';
  value: number;
  df?: number;
  p: number;
}

/** One pairwise comparison between levels a and b of a factor. */
export interface ComparisonRow {
  factor: string;
  method: ComparisonMethod;
  a: string;
  b: string;
  /** Mean of a minus mean of b. */
  estimate: number;
  se: number;
  /** t, or q / sqrt(2) scale is NOT used: Tukey reports t = estimate / se as well. */
  statistic: number;
  df: number;
  /** Unadjusted p, where defined (null for Tukey and Games–Howell). */
  p: number | null;
  pAdjusted: number;
  ciLower: number;
  ciUpper: number;
}

/** One regression coefficient. */
export interface CoefficientRow {
  term: string;
  estimate: number;
  se: number;
  value: number;
  df: number;
  p: number;
  ciLower: number;
  ciUpper: number;
  vif?: number;
}

/** Simple effect of one factor at one level of another (two-factor designs, extension). */
export interface SimpleEffectRow {
  /** Factor whose effect is tested. */
  factor: string;
  /** The conditioning factor and its level. */
  at: { factor: string; level: string };
  df1: number;
  df2: number;
  ss: number;
  value: number;
  p: number;
}

/** Power and sensitivity of one test. */
export interface PowerRow {
  term: string;
  /** Effect size metric used: Cohen's d (t tests) or Cohen's f (F tests). */
  metric: 'd' | 'f';
  observed: number;
  /** Achieved power at the observed effect and the plan's alpha. */
  power: number;
  /** Smallest effect detectable with 80% power at the plan's alpha. */
  detectable80: number;
  alpha: number;
}

/** Reconciliation verdict for one reported statistic. */
export type ReconcileVerdict = 'consistent' | 'rounding' | 'inconsistent' | 'decision-changing' | 'unparsed';

/** One reported statistic compared with its recomputation. */
export interface ReconcileRow {
  text: string;
  term?: string;
  parsed?: { statistic: 't' | 'z' | 'F' | 'chi2'; df?: number; df1?: number; df2?: number; value: number; p?: { op: '=' | '<' | '>'; value: number } };
  /** p recomputed from the reported statistic and df. */
  pFromReported?: number;
  /** The engine's own value and p for the matched test. */
  rerunValue?: number;
  rerunP?: number;
  verdict: ReconcileVerdict;
  explanation: string;
}

/** The engine's result: one shape for every design. */
export interface RerunResult {
  /** Engine version (semver) that produced the result. */
  engine: string;
  design: Design;
  /** Rows used. */
  n: number;
  /** Rows (or subjects, for within designs) dropped; reasons in `warnings`. */
  excluded: number;
  /** Subjects used (within designs, extension). */
  subjects?: number;
  alpha: number;
  descriptives: CellDescriptives[];
  tests: TestRow[];
  residual?: ResidualRow;
  assumptions?: Assumptions;
  nonparametric?: NonparametricRow[];
  comparisons?: ComparisonRow[];
  coefficients?: CoefficientRow[];
  rSquared?: number;
  adjRSquared?: number;
  sigma?: number;
  simpleEffects?: SimpleEffectRow[];
  power?: PowerRow[];
  reconciliation?: ReconcileRow[];
  /** Standardized residuals beyond ±3 (extension): row number as a spreadsheet counts it (header = row 1) and value. */
  outliers?: { row: number; value: number }[];
  /** Residual quantiles for a Q-Q plot (extension): at most 200 points. */
  qq?: { theoretical: number; observed: number }[];
  warnings: string[];
  /** Milliseconds spent reading and computing (extension). */
  timings?: { parseMs: number; computeMs: number };
}

/** Error raised for invalid input; `field` names the plan field, column or row at fault. */
export class InputError extends Error {
  /** Machine-readable location: "plan.outcome", "column score", "row 17", ... */
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.field = field;
  }
}
