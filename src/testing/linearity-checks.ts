/**
 * The check of a linearity report's verdict at its output: the output's error bound (mean shift, 2nd
 * and 3rd harmonics and the third-order change of the fundamental, by the method of nonlinear
 * currents) at most a budget.
 */
import type { LinearityReport } from '../analysis/linearity.js';
import { invalidValue } from '../errors/messages.js';
import { formatValue } from '../values/format.js';
import type { CheckResult } from './check.js';

/** The budget to judge the output against. */
export interface OutputBudgetOptions {
  /** The largest error bound accepted (default the report's own budget). */
  readonly budget?: number;
}

const plain = (value: number): string => String(Number(value.toPrecision(4)));
const percent = (value: number): string => `${plain(100 * value)} %`;

/**
 * Checks that the output named in a linearity report stays within a budget. A failure names the
 * output, the frequency, every figure and the device that contributes most.
 *
 * @param report - a report taken with an output, `linearity(ac, { output })`
 * @param options - a budget other than the report's
 * @returns the outcome
 * @throws QuiescentError `invalid-value` for a report without an output, or a budget that is not a
 *   finite number > 0
 */
export function checkOutputWithinBudget(
  report: LinearityReport,
  options: OutputBudgetOptions = {},
): CheckResult {
  const out = report.output;
  if (out === undefined) {
    throw invalidValue(['output'], undefined, 'a report taken at an output: linearity(ac, { output })');
  }
  const budget = options.budget ?? report.budget;
  if (typeof budget !== 'number' || !Number.isFinite(budget) || budget <= 0) {
    throw invalidValue(['budget'], budget, 'a finite positive error bound (such as 0.1)');
  }
  let top: { device: string; size: number } | undefined;
  for (const j of report.junctions) {
    if (j.share === undefined) continue;
    const size = j.share.second + j.share.third;
    if (top === undefined || size > top.size) top = { device: j.device, size };
  }
  const most = top === undefined ? '' : `; most from ${top.device}`;
  return {
    pass: out.errorBound <= budget,
    subject: `linearity at ${out.outputName}`,
    expected: `error bound ≤ ${plain(budget)}`,
    actual:
      `${plain(out.errorBound)} at ${formatValue(out.frequency, 'Hz')} (2nd harmonic ${percent(out.secondHarmonic)}, ` +
      `3rd ${percent(out.thirdHarmonic)}, compression ${percent(out.compression)}, mean shift ${percent(out.meanShift)}${most})`,
    expectedValue: budget,
    actualValue: out.errorBound,
  };
}
