/**
 * The stability report as text: the margins, the poles (right-half-plane poles flagged), and the
 * verdict in words.
 */
import type { Root } from '../analysis/natural-frequencies.js';
import { isRightHalfPlane, PHASE_MARGIN_TARGET, type StabilityReport } from '../analysis/stability.js';
import { invalidValue } from '../errors/messages.js';
import { cell, DEFAULT_REPORT_DIGITS, type ReportOptions, renderTable, type TextTable } from './table.js';

/** A dimensionless number with `digits` significant digits; `∞` for an infinite one. */
function plain(value: number, digits: number): string {
  if (value === Number.POSITIVE_INFINITY) return '∞';
  if (value === Number.NEGATIVE_INFINITY) return '−∞';
  if (value === 0) return '0';
  return String(Number(value.toPrecision(digits)));
}

/**
 * A table of poles or zeros: real and imaginary parts of s/(2π), frequency, Q and damping ratio, with
 * a right-half-plane root flagged.
 *
 * @param title - the line above the table
 * @param roots - the roots, in the order to print
 * @param options - significant digits (default 4)
 * @returns the table as data
 */
export function rootsTable(title: string, roots: readonly Root[], options: ReportOptions = {}): TextTable {
  const digits = checkDigits(options);
  return {
    title,
    columns: [
      { header: 'real', align: 'right' },
      { header: 'imaginary', align: 'right' },
      { header: 'frequency', align: 'right' },
      { header: 'Q', align: 'right' },
      { header: 'damping ratio', align: 'right' },
      { header: 'half-plane' },
    ],
    rows: roots.map((r) => [
      cell(r.real, 'Hz', digits),
      cell(r.imaginary, 'Hz', digits),
      cell(r.frequency, 'Hz', digits),
      plain(r.q, digits),
      plain(r.dampingRatio, digits),
      isRightHalfPlane(r) ? 'RIGHT: grows' : r.real === 0 ? 'on the axis' : 'left',
    ]),
  };
}

function checkDigits(options: ReportOptions): number {
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  if (!Number.isInteger(digits) || digits < 1 || digits > 101) {
    throw invalidValue(['digits'], digits, 'a whole number of significant digits from 1 to 101');
  }
  return digits;
}

/**
 * The tables of a stability report as data: the margins, then the dominant poles (and any
 * right-half-plane pole beyond them).
 *
 * @param report - the stability report
 * @param options - significant digits (default 4)
 * @returns the tables, in the order {@link formatStabilityReport} prints them
 * @throws QuiescentError `invalid-value` for digits that are not a whole number from 1 to 101
 */
export function stabilityTables(report: StabilityReport, options: ReportOptions = {}): TextTable[] {
  const digits = checkDigits(options);
  const { loop } = report;
  const none = 'none in the sweep';
  const margins: TextTable = {
    title: `Loop gain at '${loop.probe}'`,
    columns: [{ header: 'quantity' }, { header: 'value', align: 'right' }],
    rows: [
      [
        'crossover frequency (|T| = 1)',
        loop.crossoverFrequency === null ? none : cell(loop.crossoverFrequency, 'Hz', digits),
      ],
      ['phase margin', loop.phaseMargin === null ? none : `${plain(loop.phaseMargin, digits)}°`],
      [
        'phase crossover (arg T = −180°)',
        loop.phaseCrossoverFrequency === null ? none : cell(loop.phaseCrossoverFrequency, 'Hz', digits),
      ],
      ['gain margin', loop.gainMargin === null ? none : `${plain(loop.gainMargin, digits)} dB`],
    ],
  };
  const extra = report.unstablePoles.filter((p) => !report.dominantPoles.includes(p));
  const polesTable = rootsTable(
    report.allPolesExamined ? 'Dominant poles (lowest frequency first)' : 'Poles nearest the crossover',
    [...report.dominantPoles, ...extra],
    { digits },
  );
  return [margins, polesTable];
}

/** The verdict in words. */
function verdictText(report: StabilityReport, digits: number): string {
  const { loop } = report;
  switch (report.verdict) {
    case 'unstable':
      return `Verdict: UNSTABLE: ${report.unstablePoles.length} pole${report.unstablePoles.length > 1 ? 's' : ''} in the right half-plane; the circuit oscillates or latches.`;
    case 'low-margin':
      return `Verdict: stable, but the phase margin (${plain(loop.phaseMargin!, digits)}°) is below ${PHASE_MARGIN_TARGET}°: expect peaking and ringing.`;
    case 'stable':
      return loop.phaseMargin === null
        ? 'Verdict: stable (no pole in the right half-plane; |T| does not cross 1 in the sweep).'
        : `Verdict: stable, phase margin ${plain(loop.phaseMargin, digits)}°.`;
  }
}

/**
 * The stability report as text: the margins, the dominant poles (right-half-plane poles flagged) and
 * the verdict.
 *
 * @param report - the stability report
 * @param options - significant digits (default 4)
 * @returns the text, without a final newline
 * @throws QuiescentError `invalid-value` for digits that are not a whole number from 1 to 101
 */
export function formatStabilityReport(report: StabilityReport, options: ReportOptions = {}): string {
  const digits = checkDigits(options);
  const parts = stabilityTables(report, options).map(renderTable);
  if (!report.allPolesExamined) {
    parts.push('(Above 1,000 unknowns only the poles nearest the crossover were examined.)');
  }
  parts.push(verdictText(report, digits));
  return parts.join('\n\n');
}
