/**
 * The noise spectrum as an SVG figure: the total density against frequency on log-log axes, with the
 * largest contributors drawn beside it, referred to the output or to the input source.
 */
import type { Noise } from '../analysis/noise.js';
import { invalidValue } from '../errors/messages.js';
import { contributionLabel, noiseInputUnit, noiseOutputUnit } from './noise-table.js';
import { type PlotSeries, svgPlot } from './svg-plot.js';

/** Options of {@link noisePlotSvg}. */
export interface NoisePlotOptions {
  /** `'output'` (default) or `'input'`: referred to the input source (the analysis must have one). */
  readonly referred?: 'output' | 'input';
  /** How many contributors to draw beside the total, the largest first (default 4). */
  readonly top?: number;
  /** The figure's title (default: what is plotted). */
  readonly title?: string;
  /** Width of the figure in px (default 720). */
  readonly width?: number;
}

/** Values for a log axis: a zero density (a cut-off channel) breaks the line instead of failing the axis. */
function positiveOrGap(values: Float64Array): Float64Array {
  return values.map((v) => (v > 0 ? v : Number.NaN));
}

/**
 * The noise density against frequency as a standalone SVG document: the total and the `top`
 * contributors, on logarithmic axes. Referred to the input, every curve is divided by the gain |H|
 * from the input source to the output.
 *
 * @param nz - the noise analysis
 * @param options - `referred`, `top`, `title`, `width`
 * @returns the SVG text
 * @throws QuiescentError `invalid-value` for `referred: 'input'` without an input, a bad `top`, or a
 *   spectrum with no density above 0
 * @example
 * ```ts no-run
 * writeFileSync('noise.svg', noisePlotSvg(nz, { referred: 'input' }));
 * ```
 */
export function noisePlotSvg(nz: Noise, options: NoisePlotOptions = {}): string {
  const referred = options.referred ?? 'output';
  const top = options.top ?? 4;
  if (!Number.isInteger(top) || top < 0) throw invalidValue(['top'], top, 'a whole number of 0 or more');
  if (referred !== 'output' && referred !== 'input') {
    throw invalidValue(['referred'], referred, "'output' or 'input'");
  }
  const inputDensity = nz.inputDensity;
  if (referred === 'input' && inputDensity === undefined) {
    throw invalidValue(['referred'], referred, "'output' for an analysis without an input source");
  }
  // Referred to the input: each density divided by |H| = output density / input density.
  const scale = (values: Float64Array): Float64Array =>
    referred === 'input' ? values.map((v, k) => (v * inputDensity![k]!) / nz.outputDensity[k]!) : values;
  const order = Array.from(nz.frequencies.keys()).sort((a, b) => nz.frequencies[a]! - nz.frequencies[b]!);
  const sorted = (values: Float64Array) => Float64Array.from(order, (k) => values[k]!);
  const x = sorted(nz.frequencies);
  const series: PlotSeries[] = [{ label: 'total', x, y: positiveOrGap(sorted(scale(nz.outputDensity))) }];
  for (const c of nz.contributions.slice(0, top)) {
    series.push({ label: contributionLabel(c), x, y: positiveOrGap(sorted(scale(c.density))) });
  }
  const unit = referred === 'input' ? noiseInputUnit(nz) : noiseOutputUnit(nz);
  const where = referred === 'input' ? `referred to ${nz.input}` : 'at the output';
  return svgPlot({
    title: options.title ?? `Noise density ${where}`,
    x: { label: 'frequency', unit: 'Hz', scale: 'log' },
    panels: [{ y: { label: 'density per √Hz', unit, scale: 'log' }, series }],
    ...(options.width === undefined ? {} : { width: options.width }),
  });
}
