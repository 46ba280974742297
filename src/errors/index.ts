export * as messages from './messages.js';
export {
  type DetailsOf,
  type ErrorCode,
  type ErrorDetails,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
  type ValueRange,
} from './quiescent-error.js';
export { describeError, formatPath, listNames } from './wording.js';
