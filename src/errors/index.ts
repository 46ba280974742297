export * as messages from './messages.js';
export {
  type DetailsOf,
  type ErrorCode,
  type ErrorDetails,
  formatPath,
  listNames,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
} from './quiescent-error.js';
