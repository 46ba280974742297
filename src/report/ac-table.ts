/**
 * The small-signal response as text: one row per analysed frequency, with the magnitude and phase of
 * each output (or of each output over an input, in dB), in engineering notation.
 */
import type { AcAnalysis, Probe } from '../analysis/ac-analysis.js';
import { probeLabel, ratioLabel } from '../analysis/probe-label.js';
import { GROUND } from '../circuit/elements.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import type { Unit } from '../values/units.js';
import {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';

/** Options of {@link formatAcAnalysis} and {@link acTable}. */
export interface AcReportOptions extends ReportOptions {
  /** What to tabulate: node names, `{ node, reference }` or `{ element }` (default every node but ground). */
  readonly outputs?: readonly Probe[];
  /** When given, each output is shown relative to it: a gain in dB and a phase difference. */
  readonly input?: Probe;
}

function probeUnit(probe: Probe): Unit {
  return typeof probe === 'object' && 'element' in probe ? 'A' : 'V';
}

/** Degrees with one decimal, as phases are read. */
function degrees(value: number): string {
  return `${value.toFixed(1)}°`;
}

/** Decibels with two decimals. */
function decibels(value: number): string {
  return value === Number.NEGATIVE_INFINITY ? '−∞ dB' : `${value.toFixed(2)} dB`;
}

/**
 * The small-signal response as a table: frequency, then for each output its peak magnitude and
 * phase, or, with an `input`, the gain output/input in dB and its phase (unwrapped along the sweep).
 *
 * @param ac - the AC analysis
 * @param options - outputs, input and digits (default 4)
 * @returns the table as data
 * @throws QuiescentError `unknown-node`, `unknown-element`, or `invalid-value` for a zero input
 */
export function acTable(ac: AcAnalysis, options: AcReportOptions = {}): TextTable {
  requireShape(ac, 'ac', 'an AcAnalysis (the result of acAnalysis(op, options))', [
    'operatingPoint',
    'frequencies',
    're',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const outputs = options.outputs ?? ac.operatingPoint.nodes.filter((n) => n !== GROUND);
  const input = options.input;
  const columns: TableColumn[] = [{ header: 'frequency', align: 'right' }];
  const cellsOf: ((k: number) => string)[] = [];
  for (const output of outputs) {
    const label = probeLabel(output);
    const phase = ac.phaseDegrees(output, input);
    if (input === undefined) {
      const response = ac.response(output);
      const unit = probeUnit(output);
      columns.push({ header: `|${label}|`, align: 'right' }, { header: `∠${label}`, align: 'right' });
      cellsOf.push(
        (k) => cell(response[k]!.abs(), unit, digits),
        (k) => degrees(phase[k]!),
      );
    } else {
      const gain = ac.magnitudeDb(output, input);
      const ratio = ratioLabel(output, input);
      columns.push({ header: ratio, align: 'right' }, { header: `∠${ratio}`, align: 'right' });
      cellsOf.push(
        (k) => decibels(gain[k]!),
        (k) => degrees(phase[k]!),
      );
    }
  }
  const rows = Array.from(ac.frequencies, (f, k) => [cell(f, 'Hz', digits), ...cellsOf.map((c) => c(k))]);
  const title =
    input === undefined
      ? 'Small-signal response (peak phasors)'
      : `Small-signal gain relative to ${probeLabel(input)}`;
  return { title, columns, rows };
}

/**
 * The small-signal response as text, one row per analysed frequency.
 *
 * @param ac - the AC analysis
 * @param options - outputs (default every node), an input to show gains against, digits (default 4)
 * @returns the table, lines joined by `\n`
 * @throws QuiescentError `unknown-node`, `unknown-element`, or `invalid-value` for a zero input or bad digits
 * @example
 * ```ts no-run
 * console.log(formatAcAnalysis(ac, { outputs: ['out'], input: 'in' }));
 * ```
 */
export function formatAcAnalysis(ac: AcAnalysis, options: AcReportOptions = {}): string {
  return renderTable(acTable(ac, options));
}
