/**
 * The linearity report as text: the verdict at the output when one was named (its figures, and each
 * device's share), one row per junction, worst first, with every figure; optionally the distortion
 * estimate of an output with each junction's share, and its quasi-static check; then a verdict in
 * words that names the output and the device contributing most.
 */

import type { Probe } from '../analysis/ac-analysis.js';
import type { DistortionEstimate, DistortionPoint } from '../analysis/distortion.js';
import type { JunctionLinearity, LinearityReport, OutputLinearity } from '../analysis/linearity.js';
import type { QuasiStaticHarmonics } from '../analysis/quasi-static.js';
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

/** A signed ratio as a percentage. */
function signedPercent(value: number, digits: number): string {
  return value > 0 ? `+${percent(value, digits)}` : percent(value, digits);
}

/** The unit of a probe's quantity. */
function outputUnit(probe: Probe): 'V' | 'A' {
  return typeof probe === 'object' && 'element' in probe ? 'A' : 'V';
}

/** A junction's own verdict; with an output it only describes the junction, the output judges. */
function junctionVerdict(j: JunctionLinearity, withOutput: boolean): string {
  const own = j.withinBudget ? 'within budget' : withOutput ? 'curved' : 'OVER BUDGET';
  return own + (j.forwardBiased ? '' : ' (reverse-biased)');
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
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  if (!Number.isInteger(digits) || digits < 1 || digits > 101) {
    throw invalidValue(['digits'], digits, 'a whole number of significant digits from 1 to 101');
  }
  const tables: TextTable[] = [];
  const out = report.output;
  if (out !== undefined) {
    tables.push({
      title: `Linearity at ${out.outputName} (method of nonlinear currents; budget: error bound ≤ ${plain(report.budget, digits)})`,
      columns: [
        { header: 'worst at', align: 'right' },
        { header: 'fundamental', align: 'right' },
        { header: '2nd harm.', align: 'right' },
        { header: '3rd harm.', align: 'right' },
        { header: 'compression', align: 'right' },
        { header: 'mean shift', align: 'right' },
        { header: 'error bound', align: 'right' },
        { header: 'max scale', align: 'right' },
        { header: 'verdict' },
      ],
      rows: [
        [
          cell(out.frequency, 'Hz', digits),
          cell(out.fundamental, outputUnit(out.output), digits),
          percent(out.secondHarmonic, digits),
          percent(out.thirdHarmonic, digits),
          signedPercent(out.compression, digits),
          percent(out.meanShift, digits),
          plain(out.errorBound, digits),
          plain(report.maxInputScale, digits),
          out.withinBudget ? 'within budget' : 'OVER BUDGET',
        ],
      ],
    });
  }
  const shares = out !== undefined;
  tables.push({
    title: `Junction linearity (${shares ? 'each junction on its own; shares of the output harmonics at the right' : `budget: error bound ≤ ${plain(report.budget, digits)}`}), worst first`,
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
      ...(shares
        ? [
            { header: 'share 2nd', align: 'right' as const },
            { header: 'share 3rd', align: 'right' as const },
          ]
        : []),
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
      junctionVerdict(j, shares),
      ...(shares
        ? j.share === undefined
          ? ['', '']
          : [percent(j.share.second, digits), percent(j.share.third, digits)]
        : []),
    ]),
  });
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
 * The verdict in one sentence. With an output: whether its error bound is within budget, naming the
 * output, its figures, the device contributing most, and by how much the drive could change. Without
 * one: the screen of the forward-biased junctions and channels, naming the worst.
 *
 * @param report - the linearity report
 * @param digits - significant digits of the numbers (default 4)
 * @returns the sentence
 */
export function linearityVerdict(report: LinearityReport, digits: number = DEFAULT_REPORT_DIGITS): string {
  if (report.output !== undefined) return outputVerdict(report, report.output, digits);
  const worst = report.worst;
  const reverse = report.junctions.filter((j) => !j.forwardBiased);
  const aside =
    reverse.length === 0
      ? ''
      : ` ${reverse.length} reverse-biased junction${reverse.length === 1 ? ' is' : 's are'} listed and not counted: ${reverse.length === 1 ? 'its' : 'their'} current is too small to matter (name an output to see what reaches it).`;
  if (worst === null)
    return `No forward-biased junction or saturated channel to judge: nothing here departs from the small-signal answer.${aside}`;
  const name = `${worst.device} (${worst.junction})`;
  const at = `x = ${plain(worst.normalized, digits)}, error bound ${plain(worst.errorBound, digits)} at ${cell(worst.frequency, 'Hz', digits)}`;
  if (worst.normalized === 0)
    return `No forward-biased junction carries signal: the small-signal answer holds at any drive level.${aside}`;
  if (report.withinBudget) {
    return `Linear enough (junction screen, no output named): every forward-biased junction is within the budget of ${plain(report.budget, digits)}; the worst is ${name}, ${at}; the drive could grow ${plain(report.maxInputScale, digits)}× before a junction reaches the budget.${aside}`;
  }
  const counted = report.junctions.filter((j) => j.forwardBiased);
  const over = counted.filter((j) => !j.withinBudget);
  return `Not linear enough (junction screen, no output named): ${over.length} of ${counted.length} forward-biased junctions exceed the budget of ${plain(report.budget, digits)}; the worst is ${name}, ${at}; scale the drive by ${plain(report.maxInputScale, digits)} or less to bring them within it. A junction's own curvature may not reach the output: name one to judge there.${aside}`;
}

/** The sentence of a verdict taken at an output. */
function outputVerdict(report: LinearityReport, out: OutputLinearity, digits: number): string {
  const figures = `error bound ${plain(out.errorBound, digits)} at ${cell(out.frequency, 'Hz', digits)} (2nd harmonic ${percent(out.secondHarmonic, digits)}, 3rd ${percent(out.thirdHarmonic, digits)}, compression ${signedPercent(out.compression, digits)}, mean shift ${percent(out.meanShift, digits)})`;
  let top: JunctionLinearity | undefined;
  const size = (j: JunctionLinearity): number =>
    j.share === undefined ? -1 : j.share.second + j.share.third;
  for (const j of report.junctions)
    if (j.share !== undefined && (top === undefined || size(j) > size(top))) top = j;
  const most =
    top?.share === undefined
      ? ''
      : `; most of it from ${top.device} (2nd ${percent(top.share.second, digits)}, 3rd ${percent(top.share.third, digits)})`;
  if (out.withinBudget) {
    return `Linear enough at ${out.outputName}: ${figures} is within the budget of ${plain(report.budget, digits)}${most}; the drive could grow ${plain(report.maxInputScale, digits)}× before the output reaches the budget.`;
  }
  return `Not linear enough at ${out.outputName}: ${figures} exceeds the budget of ${plain(report.budget, digits)}${most}; scale the drive by ${plain(report.maxInputScale, digits)} or less to bring the output within it.`;
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
