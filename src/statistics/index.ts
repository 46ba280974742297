export {
  type JobHooks,
  type MonteCarloJob,
  type MonteCarloJobOptions,
  monteCarloJob,
  runMonteCarloJob,
} from './job.js';
export type { AcMeasureForm, Measure } from './measures.js';
export { type MonteCarloOptions, monteCarlo } from './monte-carlo.js';
export {
  MonteCarlo,
  type MonteCarloFailure,
  type MonteCarloJson,
  mergeMonteCarlo,
  type SpecLimits,
} from './monte-carlo-result.js';
export {
  MonteCarloWorkers,
  type MonteCarloWorkersOptions,
  startMonteCarloWorkers,
} from './monte-carlo-workers.js';
export type { CancelSignal, ScriptLocation } from './signals.js';
export { type MeasureSummary, WILSON_Z, type YieldEstimate } from './summary.js';
export type { Distribution, Tolerance } from './tolerances.js';
export {
  DEFAULT_VERTEX_LIMIT,
  MAX_VERTEX_PARAMETERS,
  type WorstCase,
  type WorstCaseExtreme,
  type WorstCaseOptions,
  worstCase,
} from './worst-case.js';
