/**
 * quiescent/testing: assertions for test authors. Plain `assert…` functions work in any runner; the
 * vitest matchers install with `expect.extend(quiescentMatchers)`.
 *
 * @packageDocumentation
 */

export { enforce, QuiescentAssertionError } from './assertion-error.js';
export {
  assertDeviceRegion,
  assertElementCurrent,
  assertGain,
  assertJunctionWithinBudget,
  assertNodeVoltage,
  assertOutputWithinBudget,
  assertPhase,
} from './assertions.js';
export {
  type CheckResult,
  checkDeviceRegion,
  checkElementCurrent,
  checkMessage,
  checkNodeVoltage,
  checkNumber,
  compare,
  type VoltageCheckOptions,
} from './check.js';
export { checkOutputWithinBudget, type OutputBudgetOptions } from './linearity-checks.js';
export {
  type MatcherContext,
  type MatcherOutcome,
  type QuiescentMatchers,
  quiescentMatchers,
} from './matchers.js';
export {
  checkGain,
  checkJunctionWithinBudget,
  checkPhase,
  type JunctionBudgetOptions,
  type ResponsePoint,
} from './response-checks.js';
export { type ResolvedTolerance, resolveTolerance, type Tolerance } from './tolerance.js';
