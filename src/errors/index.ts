export * as messages from './messages.js';
export {
  type CircuitProblem,
  type DetailsOf,
  type ErrorCode,
  type ErrorDetails,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
  type ValueRange,
} from './quiescent-error.js';
export { describeError, describeGiven, formatPath, listNames } from './wording.js';
