/**
 * Text reports of tolerance analyses: the summary of every Monte Carlo measure (mean, standard
 * deviation, percentiles, extremes, yield against its limits) and the worst case of every measure.
 */
import { requireOptions, requireShape } from '../errors/arguments.js';
import { wrongArgument } from '../errors/messages.js';
import type { MonteCarlo, SpecLimits } from '../statistics/monte-carlo-result.js';
import type { WorstCase } from '../statistics/worst-case.js';
import type { Unit } from '../values/units.js';
import { cell, DEFAULT_REPORT_DIGITS, type ReportOptions, renderTable, type TextTable } from './table.js';

/** Options of the tolerance reports. */
export interface ToleranceReportOptions extends ReportOptions {
  /** The unit of each measure, by name, for the cells. */
  readonly units?: Readonly<Record<string, Unit>>;
  /** Specification limits by measure name: adds each measure's yield with its 95 % Wilson interval. */
  readonly specs?: Readonly<Record<string, SpecLimits>>;
}

/** The summary of every measure of a Monte Carlo result, one row per measure. */
export function monteCarloTable(mc: MonteCarlo, options: ToleranceReportOptions = {}): TextTable {
  requireShape(mc, 'mc', 'a MonteCarlo result (of monteCarlo or mergeMonteCarlo)', [
    'values',
    'summary',
    'measures',
    'range',
    'failures',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const total = mc.range[1] - mc.range[0];
  const rows = mc.measures.map((name) => {
    const s = mc.summary[name]!;
    const unit = options.units?.[name];
    const value = (v: number) => (Number.isNaN(v) ? '—' : cell(v, unit, digits));
    const spec = options.specs?.[name];
    let yieldCell = '';
    if (spec !== undefined) {
      const y = mc.yield({ [name]: spec });
      yieldCell = `${(100 * y.fraction).toFixed(1)} % (${(100 * y.low).toFixed(1)}–${(100 * y.high).toFixed(1)})`;
    }
    return [
      name,
      `${s.count}/${total}`,
      value(s.mean),
      value(s.standardDeviation),
      value(s.min),
      value(s.p1),
      value(s.p5),
      value(s.p50),
      value(s.p95),
      value(s.p99),
      value(s.max),
      yieldCell,
    ];
  });
  const right = { align: 'right' as const };
  return {
    title: `Monte Carlo: samples ${mc.range[0]}–${mc.range[1] - 1} of ${mc.samples}, seed ${mc.seed}, ${mc.failures.length} failed`,
    columns: [
      { header: 'measure' },
      { header: 'solved', ...right },
      { header: 'mean', ...right },
      { header: 'std dev', ...right },
      { header: 'min', ...right },
      { header: 'p1', ...right },
      { header: 'p5', ...right },
      { header: 'median', ...right },
      { header: 'p95', ...right },
      { header: 'p99', ...right },
      { header: 'max', ...right },
      { header: 'yield (95 % interval)', ...right },
    ],
    rows,
  };
}

/**
 * The Monte Carlo summary as text: the table of {@link monteCarloTable}, then the first failures
 * with their reasons.
 *
 * @example
 * ```ts
 * console.log(formatMonteCarlo(mc, { units: { out: 'V' }, specs: { out: { min: 2.4, max: 2.6 } } }));
 * ```
 */
export function formatMonteCarlo(mc: MonteCarlo, options: ToleranceReportOptions = {}): string {
  requireShape(mc, 'mc', 'a MonteCarlo result (of monteCarlo or mergeMonteCarlo)', [
    'values',
    'summary',
    'measures',
    'range',
    'failures',
  ]);
  requireOptions(options);
  const lines = [renderTable(monteCarloTable(mc, options))];
  const shown = mc.failures.slice(0, 5);
  for (const f of shown) lines.push(`sample ${f.sample} failed (${f.code}): ${f.message}`);
  if (mc.failures.length > shown.length)
    lines.push(`… and ${mc.failures.length - shown.length} more failures`);
  return lines.join('\n');
}

/** The worst case of every measure: its minimum and maximum, each with the parameter values there. */
export function worstCaseTable(wc: WorstCase, options: ToleranceReportOptions = {}): TextTable {
  requireWorstCase(wc);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const rows: string[][] = [];
  for (const [name, extremes] of Object.entries(wc)) {
    for (const end of ['min', 'max'] as const) {
      const e = extremes[end];
      const at = Object.entries(e.parameters)
        .map(([key, v]) => `${key} = ${cell(v, undefined, digits)}`)
        .join(', ');
      rows.push([name, end, cell(e.value, options.units?.[name], digits), at]);
    }
  }
  return {
    title: 'Worst case',
    columns: [
      { header: 'measure' },
      { header: 'end' },
      { header: 'value', align: 'right' },
      { header: 'at' },
    ],
    rows,
  };
}

/** The worst case as text (see {@link worstCaseTable}). */
export function formatWorstCase(wc: WorstCase, options: ToleranceReportOptions = {}): string {
  requireWorstCase(wc);
  requireOptions(options);
  return renderTable(worstCaseTable(wc, options));
}

/** Require a worst-case result: every measure with its `min` and `max` extremes. */
function requireWorstCase(wc: unknown): void {
  const ok =
    wc !== null &&
    typeof wc === 'object' &&
    !Array.isArray(wc) &&
    Object.values(wc).every(
      (e) =>
        e !== null && typeof e === 'object' && 'min' in e && 'max' in e && e.min !== null && e.max !== null,
    );
  if (!ok) throw wrongArgument('wc', wc, 'a WorstCase result (of worstCase)');
}
