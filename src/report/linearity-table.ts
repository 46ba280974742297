/**
 * The linearity report as text: one row per junction, worst first, with every figure; optionally the
 * distortion estimate of an output with each junction's share, and its quasi-static check; then a
 * verdict in words.
 */
import type { DistortionEstimate, DistortionPoint } from '../analysis/distortion.js';
import type { JunctionLinearity, LinearityReport } from '../analysis/linearity.js';
import type { QuasiStaticHarmonics } from '../analysis/quasi-static.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import { invalidValue } from '../errors/messages.js';
import { cell, DEFAULT_REPORT_DIGITS, type ReportOptions, renderTable, type TextTable } from './table.js';

/** Options of {@link formatLinearity} and {@link linearityTables}. */
export interface LinearityReportOptions extends ReportOptions {
  /** A distortion estimate to show beside the junctions (its worst frequency, with each junction's share). */
  readonly distortion?: DistortionEstimate;
  /** A quasi-static check of the same output, shown against the estimate. */
  readonly check?: QuasiStaticHarmonics;
}

/** A dimensionless number with `digits` significant digits, without an SI prefix; `∞` for Infinity. */
function plain(value: number, digits: number): string {
  if (value === Number.POSITIVE_INFINITY) return '∞';
  if (value === 0) return '0';
  return String(Number(value.toPrecision(digits)));
}

/** A ratio as a percentage. */
function percent(value: number, digits: number): string {
  return value === Number.POSITIVE_INFINITY ? '∞' : `${plain(100 * value, digits)} %`;
}

/** The junctions, worst (largest error bound) first; stable for equal bounds. */
function worstFirst(report: LinearityReport): JunctionLinearity[] {
  return [...report.junctions].sort((a, b) => b.errorBound - a.errorBound);
}

/** The point of a distortion estimate with the largest 2nd-and-3rd-harmonic distortion. */
function worstPoint(estimate: DistortionEstimate): DistortionPoint | undefined {
  let worst: DistortionPoint | undefined;
  for (const p of estimate.points)
    if (worst === undefined || p.harmonicDistortion > worst.harmonicDistortion) worst = p;
  return worst;
}

/**
 * The tables of a linearity report as data: the junctions (worst first), and when given the
 * distortion estimate's worst frequency with each junction's share, and the quasi-static check.
 *
 * @param report - the linearity report
 * @param options - significant digits (default 4), an optional distortion estimate and check
 * @returns the tables, in the order {@link formatLinearity} prints them
 * @throws QuiescentError `invalid-value` for digits that are not a whole number from 1 to 101
 */
export function linearityTables(report: LinearityReport, options: LinearityReportOptions = {}): TextTable[] {
  requireShape(report, 'report', 'a LinearityReport (the result of linearity(ac))', [
    'junctions',
    'worst',
    'budget',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  if (!Number.isInteger(digits) || digits < 1 || digits > 101) {
    throw invalidValue(['digits'], digits, 'a whole number of significant digits from 1 to 101');
  }
  const tables: TextTable[] = [
    {
      title: `Junction linearity (budget: error bound ≤ ${plain(report.budget, digits)}), worst first`,
      columns: [
        { header: 'device' },
        { header: 'junction' },
        { header: 'bias', align: 'right' },
        { header: 'worst at', align: 'right' },
        { header: 'amplitude', align: 'right' },
        { header: 'scale', align: 'right' },
        { header: 'x', align: 'right' },
        { header: 'error bound', align: 'right' },
        { header: '2nd harm.', align: 'right' },
        { header: '3rd harm.', align: 'right' },
        { header: 'mean shift', align: 'right' },
        { header: 'max scale', align: 'right' },
        { header: 'verdict' },
      ],
      rows: worstFirst(report).map((j) => [
        j.device,
        j.junction,
        cell(j.bias, 'V', digits),
        cell(j.frequency, 'Hz', digits),
        cell(j.amplitude, 'V', digits),
        cell(j.scale, 'V', digits),
        plain(j.normalized, digits),
        plain(j.errorBound, digits),
        percent(j.secondHarmonic, digits),
        percent(j.thirdHarmonic, digits),
        percent(j.meanShift, digits),
        plain(j.maxInputScale, digits),
        (j.withinBudget ? 'within budget' : 'OVER BUDGET') + (j.forwardBiased ? '' : ' (reverse-biased)'),
      ]),
    },
  ];
  const estimate = options.distortion;
  const point = estimate === undefined ? undefined : worstPoint(estimate);
  if (estimate !== undefined && point !== undefined) {
    tables.push({
      title: `Distortion of ${estimate.outputName} at ${cell(point.frequency, 'Hz', digits)} (method of nonlinear currents), largest share first`,
      columns: [
        { header: 'device' },
        { header: 'junction' },
        { header: '2nd harm.', align: 'right' },
        { header: '3rd harm.', align: 'right' },
      ],
      rows: [
        ...[...point.contributions]
          .sort((a, b) => Math.hypot(b.secondRatio, b.thirdRatio) - Math.hypot(a.secondRatio, a.thirdRatio))
          .map((c) => [c.device, c.junction, percent(c.secondRatio, digits), percent(c.thirdRatio, digits)]),
        ['total', '', percent(point.secondRatio, digits), percent(point.thirdRatio, digits)],
      ],
    });
  }
  const check = options.check;
  if (check !== undefined) {
    const rows = [
      ['quasi-static check', percent(check.secondRatio, digits), percent(check.thirdRatio, digits)],
    ];
    if (point !== undefined) {
      rows.unshift(['estimate', percent(point.secondRatio, digits), percent(point.thirdRatio, digits)]);
    }
    tables.push({
      title: `Harmonics of ${check.outputName} relative to the fundamental (${check.phases} phases, scale ${plain(check.scale, digits)})`,
      columns: [
        { header: 'method' },
        { header: '2nd harm.', align: 'right' },
        { header: '3rd harm.', align: 'right' },
      ],
      rows,
    });
  }
  return tables;
}

/**
 * The verdict in one sentence: whether every junction is within budget, which is worst, and by how
 * much the drive could change.
 *
 * @param report - the linearity report
 * @param digits - significant digits of the numbers (default 4)
 * @returns the sentence
 */
export function linearityVerdict(report: LinearityReport, digits: number = DEFAULT_REPORT_DIGITS): string {
  requireShape(report, 'report', 'a LinearityReport (the result of linearity(ac))', [
    'junctions',
    'worst',
    'budget',
  ]);
  const worst = report.worst;
  if (worst === null)
    return 'No junction or saturated channel to judge: nothing here departs from the small-signal answer.';
  const name = `${worst.device} (${worst.junction})`;
  const at = `x = ${plain(worst.normalized, digits)}, error bound ${plain(worst.errorBound, digits)} at ${cell(worst.frequency, 'Hz', digits)}`;
  if (worst.normalized === 0)
    return `No junction carries signal: the small-signal answer holds at any drive level.`;
  if (report.withinBudget) {
    return `Linear enough: every junction is within the budget of ${plain(report.budget, digits)}; the worst is ${name}, ${at}; the drive could grow ${plain(report.maxInputScale, digits)}× before a junction reaches the budget.`;
  }
  const over = report.junctions.filter((j) => !j.withinBudget);
  const verdict = `Not linear enough: ${over.length} of ${report.junctions.length} junctions exceed the budget of ${plain(report.budget, digits)}; the worst is ${name}, ${at}; scale the drive by ${plain(report.maxInputScale, digits)} or less to bring every junction within it.`;
  if (over.some((j) => j.forwardBiased)) return verdict;
  return `${verdict} Every junction over budget is reverse-biased, though, and carries almost no current; the forward-biased ones stay within budget up to a scale of ${plain(report.maxInputScaleForwardBiased, digits)} (the distortion estimate's shares tell whether the reverse-biased ones matter).`;
}

/**
 * The linearity report as text: the junction table (worst first), the distortion and check tables
 * when given, and the verdict.
 *
 * @param report - the linearity report
 * @param options - significant digits (default 4), an optional distortion estimate and check
 * @returns the text, tables separated by blank lines, without a final newline
 * @throws QuiescentError `invalid-value` for bad digits
 *
 * @example
 * ```ts
 * console.log(formatLinearity(linearity(ac), { distortion: distortion(ac, { output: 'out' }) }));
 * ```
 */
export function formatLinearity(report: LinearityReport, options: LinearityReportOptions = {}): string {
  const tables = linearityTables(report, options).map(renderTable);
  return [...tables, linearityVerdict(report, options.digits ?? DEFAULT_REPORT_DIGITS)].join('\n\n');
}
