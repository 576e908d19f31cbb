/**
 * The engine's internal view of a dataset after the plan has been applied:
 * columns resolved, missing values dropped, factors coded, the outcome centred
 * exactly. Every analysis family takes a PreparedData and returns its part of
 * the RerunResult. Not part of the public JSON contract.
 */
import type { AnalysisPlan } from './contract';

/** A categorical column coded as integers. */
export interface Factor {
  name: string;
  /** Level labels in order of first appearance (numeric labels sorted numerically). */
  levels: string[];
  /** For each used row, the index into `levels`. */
  codes: Int32Array;
}

/** A numeric column, centred exactly on a decimal offset. */
export interface NumericColumn {
  name: string;
  /**
   * value − offset for each used row. The subtraction is done on the decimal
   * digit strings before conversion to binary, so it is exact for the data as
   * written (up to the 15–17 significant digits a double holds of the remainder).
   */
  values: Float64Array;
  /** The common decimal offset (added back for means and intercepts). */
  offset: number;
}

/** A plan with defaults filled in. */
export type ResolvedPlan = AnalysisPlan & {
  alpha: number;
  ssType: 2 | 3;
  between: string[];
  within: string[];
  predictors: string[];
  comparisons: NonNullable<AnalysisPlan['comparisons']>;
};

/** Data ready for analysis. */
export interface PreparedData {
  plan: ResolvedPlan;
  /** Number of rows used. */
  n: number;
  outcome: NumericColumn;
  between: Factor[];
  within: Factor[];
  subject?: Factor;
  predictors: NumericColumn[];
  /** Row numbers of the rows used, counted as a spreadsheet does (header = row 1, first data row = 2). */
  rowNumbers: Int32Array;
  /** Rows dropped for missing values. */
  excluded: number;
  /** Plain-language warnings collected while preparing. */
  warnings: string[];
}
