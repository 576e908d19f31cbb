/**
 * Public surface of the Assayer statistics engine: the JSON contract, plan
 * validation, data reading and the rerun entry points. Everything else in
 * shared/stats is internal to the engine.
 */
export * from './contract';
export { ENGINE_VERSION } from './version';
export { runPlan, rerunFromText, type RunOptions } from './rerun';
export { analysisPlanSchema, analysisPlanFieldsSchema, comparisonRequestSchema, reportedInputSchema, planProblem, resolvePlan } from './plan-schema';
export { parseDelimited, detectDelimiter, type RawTable } from './data/raw-table';
export type { PreparedData, ResolvedPlan, Factor, NumericColumn } from './prepared';
