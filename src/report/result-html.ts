/**
 * Results as rich output for web pages and notebooks: the operating point's and the AC analysis's
 * tables as HTML, and a Bode plot as SVG, each a {@link RichOutput} that a notebook shows as it is.
 */

import type { AcAnalysis, Probe } from '../analysis/ac-analysis.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import { ratioLabel } from '../analysis/probe-label.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import { type AcReportOptions, acTable, formatAcAnalysis } from './ac-table.js';
import { htmlTable } from './html-table.js';
import { formatOperatingPoint, operatingPointTables } from './operating-point-table.js';
import { RichOutput } from './rich-output.js';
import { bodePlotSvg } from './svg-plot.js';
import type { ReportOptions } from './table.js';

/**
 * The tables of an operating point (node voltages, element currents, one table per device kind) as
 * HTML, with the text report as its plain stand-in.
 *
 * @param op - the operating point
 * @param options - `digits` (default 4)
 * @returns the HTML, shown richly by a notebook
 */
export function operatingPointHtml(op: OperatingPoint, options: ReportOptions = {}): RichOutput {
  const html = operatingPointTables(op, options).map(htmlTable).join('\n');
  return new RichOutput(
    'text/html',
    `<div class="quiescent">\n${html}\n</div>`,
    formatOperatingPoint(op, options),
  );
}

/**
 * The small-signal response table as HTML (as {@link acTable}), with the text table as its plain
 * stand-in.
 *
 * @param ac - the AC analysis
 * @param options - outputs, input and digits, as {@link acTable}
 * @returns the HTML, shown richly by a notebook
 * @throws QuiescentError as {@link acTable}
 */
export function acAnalysisHtml(ac: AcAnalysis, options: AcReportOptions = {}): RichOutput {
  return new RichOutput('text/html', htmlTable(acTable(ac, options)), formatAcAnalysis(ac, options));
}

/**
 * The Bode plot of output (or output/input) as SVG, titled and labelled with the probes' names.
 *
 * @param ac - the AC analysis (its frequencies should be ascending, as a sweep)
 * @param output - the probe to plot
 * @param input - the probe to divide by, if any
 * @param title - the title (default `Bode plot of <output ÷ input>`)
 * @returns the SVG, shown richly by a notebook
 * @throws QuiescentError `unknown-node`, `unknown-element`; `invalid-value` for a zero input or no
 *   frequency above 0
 */
export function bodePlot(ac: AcAnalysis, output: Probe, input?: Probe, title?: string): RichOutput {
  requireShape(ac, 'ac', 'an AcAnalysis (the result of acAnalysis(op, options))', ['frequencies', 'bode']);
  if (output === null || (typeof output !== 'string' && typeof output !== 'object')) {
    requireOptions(output, 'output', false);
  }
  const label = ratioLabel(output, input);
  const svg = bodePlotSvg(ac.bode(output, input), title ?? `Bode plot of ${label}`, label);
  return new RichOutput('image/svg+xml', svg, `${title ?? `Bode plot of ${label}`} (an SVG image)`);
}
