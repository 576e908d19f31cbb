/**
 * From a raw table and a validated plan to PreparedData: find the plan's
 * columns, drop rows with missing values (counted, with a warning), read
 * numbers exactly and centre them, code the factors, then run the design
 * checks that decide whether the analysis can run at all.
 */
import { InputError } from '../contract';
import type { NumericColumn, PreparedData, ResolvedPlan } from '../prepared';
import { centreColumn, scanNumericColumn, type ScannedColumn } from './decimal-column';
import { checkDesign } from './design-checks';
import { codeFactor, scanFactorColumn } from './factor-coding';
import type { RawTable } from './raw-table';

/** Finds a plan column in the header; throws naming the plan field and listing the file's columns. */
function findColumn(table: RawTable, name: string, field: string): number {
  const at = table.header.indexOf(name);
  if (at < 0) {
    const caseless = table.header.find((h) => h.toLowerCase() === name.toLowerCase());
    const hint = caseless !== undefined ? ` (did you mean '${caseless}'? names are case-sensitive)` : '';
    throw new InputError(
      `plan.${field}`,
      `column '${name}' named in plan.${field} is not in the data${hint}; the file has columns: ${table.header.map((h) => `'${h}'`).join(', ')}`,
    );
  }
  if (table.header.indexOf(name, at + 1) >= 0) {
    throw new InputError(`plan.${field}`, `column '${name}' named in plan.${field} appears more than once in the header; rename one of them`);
  }
  return at;
}

/** Applies a validated plan to a table. Throws InputError for data the analysis cannot use. */
export function prepareData(plan: ResolvedPlan, table: RawTable): PreparedData {
  const rows = table.columns.length > 0 ? table.columns[0].length : 0;
  const numericSpecs: { name: string; field: string }[] = [
    { name: plan.outcome, field: 'outcome' },
    ...plan.predictors.map((name) => ({ name, field: 'predictors' })),
  ];
  const factorSpecs: { name: string; field: string }[] = [
    ...plan.between.map((name) => ({ name, field: 'between' })),
    ...plan.within.map((name) => ({ name, field: 'within' })),
    ...(plan.subject && (plan.within.length > 0 || plan.design === 'paired') ? [{ name: plan.subject, field: 'subject' }] : []),
  ];
  const numericCols = numericSpecs.map((s) => table.columns[findColumn(table, s.name, s.field)]);
  const factorCols = factorSpecs.map((s) => table.columns[findColumn(table, s.name, s.field)]);

  const warnings: string[] = [];
  const scanned: ScannedColumn[] = numericSpecs.map((s, k) => scanNumericColumn(s.name, numericCols[k]));
  scanned.forEach((c) => {
    if (c.separator === ',') warnings.push(`Column ${c.name} uses a comma as the decimal separator; values such as '3,5' were read as 3.5.`);
  });

  // Rows with any missing cell among the plan's columns are dropped (listwise).
  const drop = new Uint8Array(rows);
  const missingPer: { name: string; count: number }[] = [];
  scanned.forEach((c) => {
    let count = 0;
    for (let r = 0; r < rows; r++) if (c.missing[r]) {
      drop[r] = 1;
      count++;
    }
    missingPer.push({ name: c.name, count });
  });
  const scannedFactors = factorCols.map((cells) => scanFactorColumn(cells));
  factorSpecs.forEach((s, k) => {
    const codes = scannedFactors[k].codes;
    for (let r = 0; r < rows; r++) if (codes[r] < 0) drop[r] = 1;
    missingPer.push({ name: s.name, count: scannedFactors[k].missing });
  });
  let excluded = 0;
  for (let r = 0; r < rows; r++) excluded += drop[r];
  const used = new Int32Array(rows - excluded);
  for (let r = 0, j = 0; r < rows; r++) if (!drop[r]) used[j++] = r;
  if (excluded > 0) {
    const detail = missingPer.filter((m) => m.count > 0).map((m) => `${m.count} missing in ${m.name}`).join(', ');
    warnings.push(
      `${excluded} of ${rows} row${rows === 1 ? '' : 's'} had a missing value (empty cell or NA) in a column the plan uses and ${excluded === 1 ? 'was' : 'were'} excluded (${detail}).`,
    );
  }
  if (used.length === 0) {
    throw new InputError(
      'data',
      rows === 0 ? 'the data file has a header but no data rows' : `no rows are left to analyse: all ${rows} rows have a missing value (empty or NA) in a column the plan uses`,
    );
  }

  const numeric: NumericColumn[] = scanned.map((c) => {
    const centred = centreColumn(c, used);
    return { name: c.name, values: centred.values, offset: centred.offset };
  });
  const factors = factorSpecs.map((s, k) => codeFactor(s.name, scannedFactors[k], used));
  const nb = plan.between.length;
  const nw = plan.within.length;
  const rowNumbers = new Int32Array(used.length);
  // Spreadsheet numbering: the header is row 1, so data row j (0-based) is row j + 2.
  for (let j = 0; j < used.length; j++) rowNumbers[j] = used[j] + 2;

  const d: PreparedData = {
    plan,
    n: used.length,
    outcome: numeric[0],
    between: factors.slice(0, nb),
    within: factors.slice(nb, nb + nw),
    subject: factors.length > nb + nw ? factors[nb + nw] : undefined,
    predictors: numeric.slice(1),
    rowNumbers,
    excluded,
    warnings,
  };
  checkDesign(d);
  return d;
}
